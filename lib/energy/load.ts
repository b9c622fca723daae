import { efficiencyAt, type Efficiency } from './efficiency';
import type { BankWattsAt, LoadSpec } from './types';

/** Average power at the converter output over one report cycle. */
export function averageOutputWatts({
  load,
  outputVolts,
  intervalSeconds = load.intervalSeconds,
}: {
  load: LoadSpec;
  outputVolts: number;
  intervalSeconds?: number;
}): number {
  const T = intervalSeconds;
  // A cycle shorter than its wake cannot sleep; the wake then fills the whole cycle.
  const sleepSeconds = Math.max(0, T - load.awakeSeconds - load.burstSeconds);
  const ampSeconds =
    load.sleepAmps * sleepSeconds + load.awakeAmps * load.awakeSeconds + load.burstAmps * load.burstSeconds;
  return (outputVolts * ampSeconds) / Math.max(T, load.awakeSeconds + load.burstSeconds);
}

/** Bank-side power at bank voltage V: output power / η(V) plus the bank's leakage current × V. */
export function bankWatts({
  outputWatts,
  efficiency,
  leakageAmps,
  volts,
}: {
  outputWatts: number;
  efficiency: Efficiency;
  leakageAmps: number;
  volts: number;
}): number {
  return outputWatts / efficiencyAt({ efficiency, volts }) + leakageAmps * volts;
}

/**
 * The bank-side power curve for one load at one interval, for the integrators; `scale` (the
 * measured ÷ modelled draw a projection uses, 1 for the load profile as it stands) multiplies it.
 */
export function bankWattsCurve({
  outputWatts,
  efficiency,
  leakageAmps,
  scale = 1,
}: {
  outputWatts: number;
  efficiency: Efficiency;
  leakageAmps: number;
  scale?: number;
}): BankWattsAt {
  if (scale === 1) return (volts) => bankWatts({ outputWatts, efficiency, leakageAmps, volts });
  return (volts) => scale * bankWatts({ outputWatts, efficiency, leakageAmps, volts });
}
