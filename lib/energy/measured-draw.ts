import { isSunBelow } from './sun';
import type { SiteSpec } from './types';

// Draw measured from readings: the slope of stored energy ½·C·V² against time over a window
// with no charge. A robust start (Theil–Sen) marks outliers (residual beyond 3 robust sigmas,
// sigma = 1.4826·MAD), then ordinary least squares on the rest gives the slope and r².
// Gaps need no special care: least squares weighs each reading at its own time.

export interface VoltageSample {
  t: Date | number; // Date or Unix milliseconds
  volts: number;
  /** Panel volts, when the node reports them. */
  panelVolts?: number;
}

export interface EnergySlopeFit {
  /** Power leaving the bank (−slope): positive while discharging. */
  watts: number;
  slopeWatts: number;
  /** Readings kept after outlier trimming. */
  points: number;
  trimmed: number;
  r2: number;
}

const MIN_POINTS = 3;
const FULL_THEIL_SEN_LIMIT = 400;

export function fitEnergySlope({
  samples,
  bankFarads,
}: {
  samples: VoltageSample[];
  bankFarads: number;
}): EnergySlopeFit | null {
  const valid = samples.filter((s) => Number.isFinite(s.volts) && Number.isFinite(toMs(s.t)));
  if (valid.length < MIN_POINTS) return null;
  const t0 = valid.reduce((m, s) => Math.min(m, toMs(s.t)), Infinity);
  const xs = valid.map((s) => (toMs(s.t) - t0) / 1000);
  const ys = valid.map((s) => 0.5 * bankFarads * s.volts * s.volts);
  if (xs.every((x) => x === xs[0])) return null;
  const start = theilSen(xs, ys);
  const residuals = xs.map((x, i) => ys[i] - (start.intercept + start.slope * x));
  const centre = median(residuals);
  const sigma = 1.4826 * median(residuals.map((r) => Math.abs(r - centre)));
  const limit = 3 * Math.max(sigma, 1e-12 * ys.reduce((m, y) => Math.max(m, Math.abs(y)), 0));
  const keep = residuals.map((r) => Math.abs(r - centre) <= limit);
  const kx = xs.filter((_, i) => keep[i]);
  const ky = ys.filter((_, i) => keep[i]);
  if (kx.length < MIN_POINTS) return null;
  const fit = leastSquares(kx, ky);
  return { watts: -fit.slope, slopeWatts: fit.slope, points: kx.length, trimmed: xs.length - kx.length, r2: fit.r2 };
}

/** Harvested power from a daytime window: the same fit, positive while charging (net of the load). */
export function harvestWatts({ samples, bankFarads }: { samples: VoltageSample[]; bankFarads: number }): EnergySlopeFit | null {
  const fit = fitEnergySlope({ samples, bankFarads });
  return fit && { ...fit, watts: fit.slopeWatts };
}

/** Measured ÷ modelled bank-side draw; well above 1 points to a leak, a stuck wake or lost capacitance. */
export function measuredVsModelled({ measuredWatts, modelledWatts }: { measuredWatts: number; modelledWatts: number }): number {
  return modelledWatts > 0 ? measuredWatts / modelledWatts : Number.NaN;
}

/** Readings taken with no charge: panel volts below a threshold when reported, else the sun below the recharge elevation. */
export function selectNoChargeSamples({
  samples,
  site,
  panelVoltsThreshold,
}: {
  samples: VoltageSample[];
  site: SiteSpec;
  panelVoltsThreshold?: number;
}): VoltageSample[] {
  return samples.filter((s) =>
    s.panelVolts !== undefined && panelVoltsThreshold !== undefined
      ? s.panelVolts < panelVoltsThreshold
      : isSunBelow({ site, at: new Date(toMs(s.t)) }),
  );
}

/** Readings taken while charging (the complement of selectNoChargeSamples), for harvestWatts. */
export function selectChargingSamples(input: Parameters<typeof selectNoChargeSamples>[0]): VoltageSample[] {
  const dark = new Set(selectNoChargeSamples(input));
  return input.samples.filter((s) => !dark.has(s));
}

function toMs(t: Date | number): number {
  return t instanceof Date ? t.getTime() : t;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

function theilSen(xs: number[], ys: number[]): { slope: number; intercept: number } {
  const slopes: number[] = [];
  const n = xs.length;
  // Past a few hundred readings, pair each with the one half a record later: O(n), still robust.
  const pairs: [number, number][] = [];
  if (n <= FULL_THEIL_SEN_LIMIT) {
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) pairs.push([i, j]);
  } else {
    const order = xs.map((_, i) => i).sort((a, b) => xs[a] - xs[b]);
    const half = n >> 1;
    for (let k = 0; k + half < n; k++) pairs.push([order[k], order[k + half]]);
  }
  for (const [i, j] of pairs) if (xs[j] !== xs[i]) slopes.push((ys[j] - ys[i]) / (xs[j] - xs[i]));
  const slope = median(slopes);
  return { slope, intercept: median(ys.map((y, i) => y - slope * xs[i])) };
}

function leastSquares(xs: number[], ys: number[]): { slope: number; intercept: number; r2: number } {
  const n = xs.length;
  const mx = xs.reduce((a, b) => a + b, 0) / n;
  const my = ys.reduce((a, b) => a + b, 0) / n;
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    sxy += (xs[i] - mx) * (ys[i] - my);
    sxx += (xs[i] - mx) ** 2;
    syy += (ys[i] - my) ** 2;
  }
  const slope = sxy / sxx;
  const r2 = syy > 0 ? (sxy * sxy) / (sxx * syy) : 1;
  return { slope, intercept: my - slope * mx, r2 };
}
