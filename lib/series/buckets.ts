/**
 * How a time range is cut into chart buckets, and where the buckets are read from. Pure: no
 * I/O. The bucket width is the smallest "round" width that keeps the count at or under the
 * asked maximum; widths of 5 minutes and up are read from the stored rollups (300 s or 3600 s
 * rows merged), shorter ones from the raw readings.
 */
export type SeriesSource = 'raw' | 'rollup-300' | 'rollup-3600';

export interface BucketPlan {
  bucketSeconds: number;
  source: SeriesSource;
  /** Width of the rows read: 0 for raw readings, else the rollup width. */
  readSeconds: number;
  /** The range widened to whole buckets (Unix seconds). */
  fromSeconds: number;
  toSeconds: number;
}

export const MAX_BUCKETS = 2000;
export const DEFAULT_BUCKETS = 1000;
const DAY_SECONDS = 86_400;

// Round widths: each divides the next "larger unit", so buckets line up with minutes, hours and days (UTC).
const ROUND_WIDTHS_SECONDS = [1, 2, 5, 10, 15, 30, 60, 120, 300, 600, 900, 1800, 3600, 7200, 10_800, 21_600, 43_200, DAY_SECONDS];

export function chooseBucketSeconds({ spanSeconds, maxBuckets }: { spanSeconds: number; maxBuckets: number }): number {
  const least = spanSeconds / Math.max(1, maxBuckets);
  const round = ROUND_WIDTHS_SECONDS.find((w) => w >= least);
  return round ?? Math.ceil(least / DAY_SECONDS) * DAY_SECONDS;
}

export function planBuckets({ fromSeconds, toSeconds, maxBuckets = DEFAULT_BUCKETS }: { fromSeconds: number; toSeconds: number; maxBuckets?: number }): BucketPlan {
  const limit = Math.min(MAX_BUCKETS, Math.max(1, Math.floor(maxBuckets)));
  // Widening to whole buckets can add one bucket at each end: plan for two fewer.
  const bucketSeconds = chooseBucketSeconds({ spanSeconds: Math.max(1, toSeconds - fromSeconds), maxBuckets: Math.max(1, limit - 2) });
  const readSeconds = bucketSeconds % 3600 === 0 ? 3600 : bucketSeconds % 300 === 0 ? 300 : 0;
  const source: SeriesSource = readSeconds === 3600 ? 'rollup-3600' : readSeconds === 300 ? 'rollup-300' : 'raw';
  return {
    bucketSeconds,
    source,
    readSeconds,
    fromSeconds: Math.floor(fromSeconds / bucketSeconds) * bucketSeconds,
    toSeconds: Math.ceil(toSeconds / bucketSeconds) * bucketSeconds,
  };
}
