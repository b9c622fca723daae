import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { sqlUtc } from '@/lib/db/sql-time';
import { fastReading } from '@/lib/ingest/fast-reading';
import { normalizeReading } from '@/lib/ingest/normalize';

// The hand-written hot-path check must never accept what the schema refuses, and must give
// the very same reading when it accepts. Inputs are generated near every boundary.
const receivedAt = new Date('2026-12-01T21:30:00.000Z');
const now = receivedAt.getTime();

const number = fc.oneof(
  fc.double({ noNaN: false }), fc.integer({ min: -200, max: 200 }), fc.constantFrom(-1, 100, -80, 150, -150, 20, 0, -0, 4_294_967_295, 4_294_967_296, 1e308, -1.0000001, 100.0000001),
  fc.double({ min: -2, max: 101 }),
);
const time = fc.oneof(
  fc.constant(undefined),
  fc.integer({ min: now - 401 * 86_400_000, max: now + 600_000 }).map((ms) => new Date(ms).toISOString()),
  fc.integer({ min: now - 401 * 86_400_000, max: now + 600_000 }).map((ms) => new Date(ms).toISOString().replace('T', ' ').replace('Z', '+02:00')),
  fc.integer({ min: now - 401 * 86_400_000, max: now + 600_000 }).map((ms) => ms / 1000),
  fc.constantFrom('2026-13-01T00:00:00Z', '2026-02-30T10:00:00Z', 'yesterday', '2026-12-01t21:00:00z', '', -5, Number.NaN),
  fc.string(),
);
const value = fc.oneof(number, fc.string(), fc.constant(null), fc.boolean(), fc.constant(undefined));
const anything = fc.record(
  { t: time, v: fc.oneof(number, value), seq: fc.oneof(number, value), vp: fc.oneof(number, value), temp: fc.oneof(number, value), rssi: fc.oneof(number, value), extra: value },
  { requiredKeys: [] },
);
// Mostly in range, each field a little past its edge now and then.
const near = (lo: number, hi: number, whole = false) => fc.oneof(
  whole ? fc.integer({ min: lo, max: hi }) : fc.double({ min: lo, max: hi, noNaN: true }),
  fc.constantFrom(lo, hi, lo - (whole ? 1 : 1e-9), hi + (whole ? 1 : 1e-9), hi - 0.5),
);
const plausible = fc.record(
  { t: time, v: near(-1, 100), seq: near(0, 4_294_967_295, true), vp: near(-1, 100), temp: near(-80, 150), rssi: near(-150, 20, true) },
  { requiredKeys: ['v'] },
);
const reading = fc.oneof(anything, plausible);

describe('fastReading agrees with the schema path (normalizeReading)', () => {
  it('accepts only what normalizeReading accepts, and yields the same reading', () => {
    let accepted = 0;
    fc.assert(fc.property(reading, (raw) => {
      const quick = fastReading(raw, receivedAt);
      const slow = normalizeReading(raw, '', receivedAt);
      if (quick) {
        accepted++;
        expect(slow.problems).toEqual([]);
        expect(quick).toEqual(slow.reading);
      }
      // And the other way round: every plain valid reading is taken by the hot path itself.
      else expect(slow.problems.length).toBeGreaterThan(0);
    }), { numRuns: 5000 });
    expect(accepted).toBeGreaterThan(50); // the generator does reach valid readings
  });

  it('takes the ordinary device readings itself', () => {
    const t = '2026-12-01T21:00:00Z';
    expect(fastReading({ t, v: 4.61 }, receivedAt)).toEqual(normalizeReading({ t, v: 4.61 }, '', receivedAt).reading);
    expect(fastReading({ t: 1_796_158_800, v: 4.6, seq: 7, vp: 5.2, temp: -3.5, rssi: -71 }, receivedAt)).not.toBeNull();
    expect(fastReading({ v: 4.6 }, receivedAt)?.t).toEqual(receivedAt);
  });

  it('leaves to the schema path what needs a message', () => {
    for (const raw of [{ t: '2026-12-01T21:00:00Z' }, { v: '4.6' }, { v: 4.6, volts: 1 }, JSON.parse('{"v":4.6,"__proto__":{"x":1}}'), { v: 4.6, rssi: -70.5 }, [4.6], null]) {
      expect(fastReading(raw, receivedAt)).toBeNull();
    }
  });
});

describe('sqlUtc', () => {
  it('writes the same DATETIME(3) text as the ISO form, at day edges too', () => {
    fc.assert(fc.property(fc.integer({ min: 0, max: 4_102_444_800_000 }), (ms) => {
      expect(sqlUtc(ms)).toBe(new Date(ms).toISOString().slice(0, 23).replace('T', ' '));
    }), { numRuns: 5000 });
    expect(sqlUtc(Date.UTC(2026, 11, 31, 23, 59, 59, 999))).toBe('2026-12-31 23:59:59.999');
    expect(sqlUtc(Date.UTC(2027, 0, 1))).toBe('2027-01-01 00:00:00.000');
  });
});
