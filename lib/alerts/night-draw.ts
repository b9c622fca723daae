import {
  averageOutputWatts, bankWatts, fitEnergySlope, measuredVsModelled, modelBank, nightWindows, type VoltageSample,
} from '../energy';
import type { NodeModelSpec } from '../status/node-spec';

/**
 * The draw measured over the latest night: the slope of ½·C·V² over the no-charge window (sun
 * below the site's recharge elevation), against the draw the load profile predicts at the
 * voltages and the cadence actually seen. "Latest night" is tonight so far once it is two hours
 * old (an early warning), else the previous complete night.
 */
export interface NightDraw {
  startAt: Date;
  endAt: Date;
  measuredWatts: number;
  modelledWatts: number;
  ratio: number;
  points: number;
  r2: number;
}

const LOOKBACK_MS = 48 * 3_600_000;
const MIN_NIGHT_SO_FAR_MS = 2 * 3_600_000;
const MIN_SPAN_MS = 3_600_000;
const MIN_POINTS = 4;

export function measureLatestNight({ spec, samples, now }: { spec: NodeModelSpec; samples: VoltageSample[]; now: Date }): NightDraw | null {
  const windows = nightWindows({ site: spec.site, from: new Date(now.getTime() - LOOKBACK_MS), to: now });
  const candidates = windows.filter((w) => w.end.getTime() < now.getTime() || w.end.getTime() - w.start.getTime() >= MIN_NIGHT_SO_FAR_MS);
  for (const w of candidates.reverse()) {
    const inside = samples.filter((s) => ms(s.t) >= w.start.getTime() && ms(s.t) <= w.end.getTime());
    const draw = drawOverWindow({ spec, samples: inside });
    if (draw) return { startAt: w.start, endAt: w.end, ...draw };
  }
  return null;
}

export function drawOverWindow({ spec, samples }: { spec: NodeModelSpec; samples: VoltageSample[] }) {
  if (samples.length < MIN_POINTS) return null;
  const times = samples.map((s) => ms(s.t)).sort((a, b) => a - b);
  if (times[times.length - 1] - times[0] < MIN_SPAN_MS) return null;
  const bank = modelBank({ bank: spec.bank });
  const fit = fitEnergySlope({ samples, bankFarads: bank.farads });
  if (!fit) return null;
  // One reading per report: the median spacing is the cadence the node really ran at.
  const intervalSeconds = clamp(medianSpacingSeconds(times), spec.load.intervalSeconds, spec.load.maxIntervalSeconds);
  const outputWatts = averageOutputWatts({ load: spec.load, outputVolts: spec.converter.outputVolts, intervalSeconds });
  const modelledWatts =
    samples.reduce((sum, s) => sum + bankWatts({ outputWatts, efficiency: spec.converter.efficiency, leakageAmps: bank.leakageAmps, volts: s.volts }), 0) /
    samples.length;
  return {
    measuredWatts: fit.watts,
    modelledWatts,
    ratio: measuredVsModelled({ measuredWatts: fit.watts, modelledWatts }),
    points: fit.points,
    r2: fit.r2,
  };
}

function medianSpacingSeconds(sortedMs: number[]): number {
  const gaps = sortedMs.slice(1).map((t, i) => (t - sortedMs[i]) / 1000).filter((g) => g > 0).sort((a, b) => a - b);
  if (gaps.length === 0) return 0;
  const mid = gaps.length >> 1;
  return gaps.length % 2 ? gaps[mid] : (gaps[mid - 1] + gaps[mid]) / 2;
}

function clamp(value: number, low: number, high: number): number {
  return Math.min(Math.max(value, low), Math.max(low, high));
}

function ms(t: Date | number): number {
  return t instanceof Date ? t.getTime() : t;
}
