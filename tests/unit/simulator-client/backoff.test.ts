import { describe, expect, it } from 'vitest';
import { computeBackoffMs, computeRetryAfterMs, parseRetryAfterSeconds } from '../../../simulator/client/backoff';

describe('retry timing', () => {
  it('reads Retry-After as delay-seconds or as an HTTP-date (RFC 9110 §10.2.3)', () => {
    // The RFC's own examples: "Retry-After: 120" and "Retry-After: Fri, 31 Dec 1999 23:59:59 GMT".
    expect(parseRetryAfterSeconds({ header: '120' })).toBe(120);
    const nowMs = Date.UTC(1999, 11, 31, 23, 57, 59); // two minutes before the RFC's date (derived here)
    expect(parseRetryAfterSeconds({ header: 'Fri, 31 Dec 1999 23:59:59 GMT', nowMs })).toBe(120);
    expect(parseRetryAfterSeconds({ header: null })).toBeNull();
    expect(parseRetryAfterSeconds({ header: 'soon' })).toBeNull();
    expect(parseRetryAfterSeconds({ header: 'Fri, 31 Dec 1999 23:59:59 GMT', nowMs: nowMs + 600_000 })).toBe(0); // a date past: now
  });

  it('doubles the backoff per failure up to the cap, with jitter in [½, 1] (common practice)', () => {
    const at = (failures: number, r: number) => computeBackoffMs({ failures, baseMs: 1000, maxMs: 60_000, random: () => r });
    expect([1, 2, 3, 4].map((f) => at(f, 1 - 1e-12))).toEqual([1000, 2000, 4000, 8000]);
    expect(at(3, 0)).toBe(2000); // half of 4 s
    expect(at(20, 1 - 1e-12)).toBe(60_000); // capped
  });

  it('spreads a Retry-After over at most a fifth more (derived here)', () => {
    expect(computeRetryAfterMs({ seconds: 5, random: () => 0 })).toBe(5000);
    expect(computeRetryAfterMs({ seconds: 5, random: () => 1 - 1e-12 })).toBe(6000);
  });
});
