import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { chooseBucketSeconds, MAX_BUCKETS, planBuckets } from '@/lib/series/buckets';
import { mergeIntoBuckets, readingToFineRow, type FineRow } from '@/lib/series/aggregate';

const DAY = 86_400;

describe('planBuckets', () => {
  it('keeps every range at or under the asked number of buckets, up to ten years (property, derived here)', () => {
    fc.assert(fc.property(fc.integer({ min: 60, max: 3660 * DAY }), fc.integer({ min: 10, max: MAX_BUCKETS }), fc.integer({ min: 1.6e9, max: 1.9e9 }), (span, max, from) => {
      const plan = planBuckets({ fromSeconds: from, toSeconds: from + span, maxBuckets: max });
      const count = (plan.toSeconds - plan.fromSeconds) / plan.bucketSeconds;
      expect(Number.isInteger(count)).toBe(true);
      expect(count).toBeLessThanOrEqual(max);
      expect(plan.fromSeconds).toBeLessThanOrEqual(from);
      expect(plan.toSeconds).toBeGreaterThanOrEqual(from + span);
    }));
  });

  it('reads a year from the hourly rollups, a month from the 5-minute ones and a day raw (derived here)', () => {
    const to = 1_796_000_000;
    expect(planBuckets({ fromSeconds: to - 365 * DAY, toSeconds: to, maxBuckets: 2000 })).toMatchObject({ source: 'rollup-3600', bucketSeconds: 21_600 });
    expect(planBuckets({ fromSeconds: to - 30 * DAY, toSeconds: to, maxBuckets: 2000 })).toMatchObject({ source: 'rollup-300', bucketSeconds: 1800 });
    expect(planBuckets({ fromSeconds: to - DAY, toSeconds: to, maxBuckets: 2000 })).toMatchObject({ source: 'raw', bucketSeconds: 60 });
  });

  it('only reads a rollup whose width divides the bucket (property, derived here)', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 3660 * DAY }), fc.integer({ min: 1, max: MAX_BUCKETS }), (span, max) => {
      const plan = planBuckets({ fromSeconds: 0, toSeconds: span, maxBuckets: max });
      if (plan.readSeconds) expect(plan.bucketSeconds % plan.readSeconds).toBe(0);
      expect(chooseBucketSeconds({ spanSeconds: span, maxBuckets: max }) * max).toBeGreaterThanOrEqual(span);
    }));
  });
});

describe('mergeIntoBuckets', () => {
  const rows = (values: number[], stepSeconds: number): FineRow[] => values.map((v, i) => readingToFineRow({ t: 1000 + i * stepSeconds, v, vp: i % 2 ? null : v + 1 }));

  it('gives min, mean, max, last and count per bucket from raw readings (worked by hand)', () => {
    const b = mergeIntoBuckets({ rows: rows([3, 1, 2, 5, 4], 60), bucketSeconds: 120 });
    // readings at 1000, 1060 → bucket 960; 1120, 1180 → 1080; 1240 → 1200 (⌊t/120⌋·120)
    expect(b.map((x) => x.t)).toEqual([960, 1080, 1200]);
    expect(b[0]).toMatchObject({ n: 2, vMin: 1, vMax: 3, vMean: 2, vLast: 1, tLast: 1060, vpMax: 4 });
    expect(b[1]).toMatchObject({ n: 2, vMin: 2, vMax: 5, vMean: 3.5, vLast: 5, tLast: 1180, vpMax: 3 });
    expect(b[2]).toMatchObject({ n: 1, vMin: 4, vMax: 4, vMean: 4, vLast: 4, vpMax: 5 });
  });

  it('merging rollups gives what merging their raw readings gives (property, derived here)', () => {
    fc.assert(fc.property(fc.array(fc.double({ min: 0.2, max: 5.4, noNaN: true }), { minLength: 1, maxLength: 300 }), (values) => {
      const raw = rows(values, 37);
      const fine = mergeIntoBuckets({ rows: raw, bucketSeconds: 300 }).map((b) => ({ ...b, vSum: b.vMean * b.n }));
      const viaRollups = mergeIntoBuckets({ rows: fine, bucketSeconds: 3600 });
      const direct = mergeIntoBuckets({ rows: raw, bucketSeconds: 3600 });
      expect(viaRollups.length).toBe(direct.length);
      viaRollups.forEach((b, i) => {
        expect(b).toMatchObject({ t: direct[i].t, n: direct[i].n, vMin: direct[i].vMin, vMax: direct[i].vMax, vLast: direct[i].vLast, tLast: direct[i].tLast });
        expect(b.vMean).toBeCloseTo(direct[i].vMean, 9);
        expect(b.vMin).toBeLessThanOrEqual(b.vMean);
        expect(b.vMean).toBeLessThanOrEqual(b.vMax);
      });
    }));
  });
});
