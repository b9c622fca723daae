import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { distinctTimes, type NormalizedReading } from '@/lib/ingest/normalize';

const reading = (ms: number): NormalizedReading => ({ t: new Date(ms), v: 4.5, vp: null, temp: null, rssi: null, seq: null });

describe('distinctTimes', () => {
  it('agrees with counting distinct times, in any order', () => {
    fc.assert(fc.property(fc.array(fc.integer({ min: 0, max: 40 }), { maxLength: 30 }), fc.boolean(), (times, sort) => {
      const ms = sort ? [...times].sort((a, b) => a - b) : times;
      expect(distinctTimes(ms.map((t) => reading(t * 1000)))).toBe(new Set(ms).size === ms.length);
    }), { numRuns: 500 });
  });

  it('finds a repeated time in an otherwise ordered backlog', () => {
    expect(distinctTimes([reading(1000), reading(2000), reading(2000), reading(3000)])).toBe(false);
    expect(distinctTimes([reading(3000), reading(1000), reading(2000)])).toBe(true);
  });
});
