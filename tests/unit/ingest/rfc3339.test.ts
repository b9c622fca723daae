import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { rfc3339Ms } from '@/lib/ingest/rfc3339';
import { RFC3339 } from '@/lib/schemas/reading';

// The hand reader of the ingest hot path against the reference: the JavaScript engine's own
// Date.parse (ECMAScript's date-time string format), after the one change the schema path
// makes (a space separator becomes 'T').
const pad = (n: number, width: number) => String(n).padStart(width, '0');
const field = (lo: number, hi: number, width: number) => fc.integer({ min: lo - 1, max: hi + 1 }).map((n) => pad(Math.max(n, 0), width));
const text = fc.record({
  year: fc.oneof(fc.integer({ min: 1969, max: 2100 }), fc.constantFrom(2000, 2024, 2100, 1900, 0, 69, 400)).map((y) => pad(y, 4)),
  month: field(1, 12, 2), day: field(1, 31, 2), hour: field(0, 23, 2), minute: field(0, 59, 2), second: field(0, 59, 2),
  sep: fc.constantFrom('T', ' ', 't', '_'),
  fraction: fc.oneof(fc.constant(''), fc.integer({ min: 1, max: 5 }).chain((k) => fc.integer({ min: 0, max: 10 ** k - 1 }).map((d) => '.' + pad(d, k)))),
  zone: fc.oneof(fc.constantFrom('Z', 'z', '', '+00:00', '-00:00', '+24:00', '+05:60'), fc.tuple(fc.constantFrom('+', '-'), fc.integer({ min: 0, max: 23 }), fc.integer({ min: 0, max: 59 })).map(([s, h, m]) => `${s}${pad(h, 2)}:${pad(m, 2)}`)),
}).map((p) => `${p.year}-${p.month}-${p.day}${p.sep}${p.hour}:${p.minute}:${p.second}${p.fraction}${p.zone}`);

const reference = (s: string) => Date.parse(s.replace(' ', 'T'));

/** A field past its range, judged by round-tripping the date through the engine's calendar. */
function outOfRange(s: string): boolean {
  const [y, mo, d, h, mi, sec] = [s.slice(0, 4), s.slice(5, 7), s.slice(8, 10), s.slice(11, 13), s.slice(14, 16), s.slice(17, 19)].map(Number);
  const date = new Date(Date.UTC(2000, mo - 1, d));
  const zone = /[+-](\d\d):(\d\d)$/.exec(s);
  const zoneBad = zone !== null && (Number(zone[1]) > 23 || Number(zone[2]) > 59);
  return date.getUTCMonth() !== mo - 1 || date.getUTCDate() !== d || (mo === 2 && d === 29 && !(y % 4 === 0 && (y % 100 !== 0 || y % 400 === 0)))
    || h > 23 || mi > 59 || sec > 59 || zoneBad;
}

describe('rfc3339Ms', () => {
  it('equals Date.parse on every time it reads, reads only what the schema pattern allows, and refuses only calendar nonsense in it', () => {
    let read = 0;
    fc.assert(fc.property(fc.oneof(text, fc.string()), (s) => {
      const ms = rfc3339Ms(s);
      if (Number.isNaN(ms)) {
        // Refused though the pattern allows it: then some field is out of its calendar range.
        if (RFC3339.test(s)) expect(outOfRange(s)).toBe(true);
        return;
      }
      read++;
      expect(RFC3339.test(s)).toBe(true);
      expect(ms).toBe(reference(s));
    }), { numRuns: 20000 });
    expect(read).toBeGreaterThan(1000); // the generator does reach readable times
  });

  it('reads every real time: T or a space, up to 9 fraction digits, Z or an offset', () => {
    fc.assert(fc.property(fc.integer({ min: Date.UTC(100, 0, 1), max: Date.UTC(2100, 0, 1) }), fc.integer({ min: -23 * 60 - 59, max: 23 * 60 + 59 }), fc.constantFrom(0, 1, 2, 3), fc.boolean(), fc.constantFrom('', '0', '999999'),
      (utcMs, offsetMinutes, places, space, extraDigits) => {
        const local = new Date(utcMs + offsetMinutes * 60_000).toISOString(); // shifted wall time, ends 'Z'
        const sign = offsetMinutes < 0 ? '-' : '+';
        const zone = offsetMinutes === 0 ? 'Z' : `${sign}${pad(Math.floor(Math.abs(offsetMinutes) / 60), 2)}:${pad(Math.abs(offsetMinutes) % 60, 2)}`;
        const s = local.slice(0, places ? 20 + places : 19).replace('T', space ? ' ' : 'T') + (places === 3 ? extraDigits : '') + zone;
        expect(rfc3339Ms(s)).toBe(reference(s));
      }), { numRuns: 5000 });
  });

  it('gives the instants of the examples in RFC 3339 §5.8, and leaves the unusual ones to the schema path', () => {
    // RFC 3339 §5.8: 1985-04-12T23:20:50.52Z is 20.52 s past 23:20 UTC on 12 April 1985.
    expect(rfc3339Ms('1985-04-12T23:20:50.52Z')).toBe(Date.UTC(1985, 3, 12, 23, 20, 50, 520));
    // RFC 3339 §5.8: 1996-12-19T16:39:57-08:00 is 1996-12-20T00:39:57Z.
    expect(rfc3339Ms('1996-12-19T16:39:57-08:00')).toBe(Date.UTC(1996, 11, 20, 0, 39, 57));
    // RFC 3339 §5.8: 1937-01-01T12:00:27.87+00:20 is 11:40:27.87 UTC.
    expect(rfc3339Ms('1937-01-01T12:00:27.87+00:20')).toBe(Date.UTC(1937, 0, 1, 11, 40, 27, 870));
    // RFC 3339 §5.8's leap second 1990-12-31T23:59:60Z: refused, as Date.parse refuses it.
    expect(rfc3339Ms('1990-12-31T23:59:60Z')).toBeNaN();
    // Lower-case separators (RFC 3339 §5.6 NOTE allows them) and digits past the millisecond.
    expect(rfc3339Ms('2026-12-01t21:00:00.1239z')).toBe(Date.UTC(2026, 11, 1, 21, 0, 0, 123));
    expect(rfc3339Ms('0069-12-01T21:00:00Z')).toBe(Date.parse('0069-12-01T21:00:00Z')); // not 1969
    // Calendar nonsense that Date.parse would roll over, and forms outside RFC 3339.
    for (const s of ['2026-02-30T10:00:00Z', '2026-02-29T00:00:00Z', '2026-12-01T24:00:00Z', '2026-12-01T21:00:00+24:00', '2026-12-01T21:00:00', '2026-12-01T21:00:00+0200', '2026-12-01T21:00:00.Z']) {
      expect(rfc3339Ms(s)).toBeNaN();
    }
    expect(rfc3339Ms('2024-02-29T12:00:00Z')).toBe(Date.UTC(2024, 1, 29, 12)); // a leap day
  });
});
