/**
 * Merging finer rows (raw readings, or 5-minute / 1-hour rollups) into chart buckets. Volts here
 * are as reported (before calibration); calibration is linear, so it is applied to the merged
 * min / max / mean afterwards (see build-series.ts). Times in Unix seconds.
 */
export interface FineRow {
  /** Start of the row's own span (the reading's time for a raw reading). */
  t: number;
  n: number;
  vMin: number;
  vMax: number;
  vSum: number;
  vLast: number;
  tLast: number;
  vpMax: number | null;
}

export interface Bucket {
  t: number;
  n: number;
  vMin: number;
  vMax: number;
  vMean: number;
  vLast: number;
  tLast: number;
  vpMax: number | null;
}

export function readingToFineRow({ t, v, vp }: { t: number; v: number; vp: number | null }): FineRow {
  return { t, n: 1, vMin: v, vMax: v, vSum: v, vLast: v, tLast: t, vpMax: vp };
}

/** Rows in any order → buckets in time order, empty buckets left out. */
export function mergeIntoBuckets({ rows, bucketSeconds }: { rows: FineRow[]; bucketSeconds: number }): Bucket[] {
  const byStart = new Map<number, Bucket & { vSum: number }>();
  for (const r of rows) {
    if (r.n <= 0) continue;
    const start = Math.floor(r.t / bucketSeconds) * bucketSeconds;
    const b = byStart.get(start);
    if (!b) {
      byStart.set(start, { t: start, n: r.n, vMin: r.vMin, vMax: r.vMax, vSum: r.vSum, vMean: 0, vLast: r.vLast, tLast: r.tLast, vpMax: r.vpMax });
      continue;
    }
    b.n += r.n;
    b.vMin = Math.min(b.vMin, r.vMin);
    b.vMax = Math.max(b.vMax, r.vMax);
    b.vSum += r.vSum;
    if (r.tLast >= b.tLast) {
      b.tLast = r.tLast;
      b.vLast = r.vLast;
    }
    if (r.vpMax !== null) b.vpMax = b.vpMax === null ? r.vpMax : Math.max(b.vpMax, r.vpMax);
  }
  return [...byStart.values()]
    .sort((a, b) => a.t - b.t)
    // float sums can land a hair outside [min, max]; the mean cannot really be there
    .map(({ vSum, ...b }) => ({ ...b, vMean: Math.min(b.vMax, Math.max(b.vMin, vSum / b.n)) }));
}
