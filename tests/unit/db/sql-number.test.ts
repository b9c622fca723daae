import fc from 'fast-check';
import mysql from 'mysql2';
import { describe, expect, it } from 'vitest';
import { sqlNumber, sqlUtc } from '@/lib/db/sql-time';

// The literal must be exactly what the reference library writes for the number: mysql2's
// escape, which is the engine's String(x) (ECMAScript Number::toString, shortest digits).
const thousandths = fc.integer({ min: -150_000, max: 150_000 }).map((k) => k / 1000);
const hundredths = fc.integer({ min: -15_000, max: 15_000 }).map((k) => k / 100);
const nearThousandths = thousandths.chain((x) => fc.constantFrom(x, x + Number.EPSILON * 4, x * (1 + Number.EPSILON), x + 1e-9, x - 1e-12));

describe('sqlNumber', () => {
  it('writes what mysql2 writes, for reading-like numbers and any double', () => {
    fc.assert(fc.property(fc.oneof(thousandths, hundredths, nearThousandths, fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer(), fc.double({ min: -2, max: 2 })), (x) => {
      if (!Number.isFinite(x)) return;
      expect(sqlNumber(x)).toBe(mysql.escape(x));
      expect(sqlNumber(x)).toBe(String(x));
    }), { numRuns: 20000 });
  });

  it('writes the edges as the engine does', () => {
    for (const x of [0, -0, 0.5, -0.5, 0.001, -0.001, 0.0005, 4.51, 4.512, 99.999, 100, 1e15 / 1000 + 0.5, 1e21, 5e-7, 0.1 + 0.2, 22.549999999999997]) {
      expect(sqlNumber(x)).toBe(String(x));
    }
    expect(sqlNumber(-0)).toBe('0');
  });

  it('refuses what is not a finite number', () => {
    for (const x of [Number.NaN, Infinity, -Infinity]) expect(() => sqlNumber(x)).toThrow(TypeError);
  });
});

describe('sqlUtc', () => {
  it('refuses a time that is not whole milliseconds', () => {
    expect(() => sqlUtc(1.5)).toThrow(RangeError);
    expect(() => sqlUtc(Number.NaN)).toThrow(RangeError);
  });

  it('keeps the hour right when calls alternate between hours and days', () => {
    const times = [Date.UTC(2026, 11, 1, 21, 59, 59, 999), Date.UTC(2026, 11, 1, 22), Date.UTC(2026, 11, 1, 21, 0, 0, 1), Date.UTC(2025, 0, 1), Date.UTC(1969, 11, 31, 23, 59, 59, 999)];
    for (const ms of [...times, ...times.reverse()]) expect(sqlUtc(ms)).toBe(new Date(ms).toISOString().slice(0, 23).replace('T', ' '));
  });
});
