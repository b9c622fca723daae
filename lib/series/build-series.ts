import { energyJoules, reserveJoules } from '../energy';
import type { Bucket } from './aggregate';
import type { SeriesColumns } from './wire';

/**
 * Buckets of reported volts → the reply's columns: calibrated volts (v_true = gain·v + offset,
 * linear, so min, max and mean map straight across; a negative gain swaps min and max), stored
 * energy ½·C·V² and reserve above the burst floor at each of them. Energy at the mean volts is
 * a hair under the mean energy (E is convex in V); at chart resolution the two are one line.
 */
export interface Calibration {
  gain: number;
  offsetVolts: number;
}

const round = (x: number, digits: number) => Number(x.toFixed(digits));
const VOLT_DIGITS = 5;
const JOULE_DIGITS = 3;

export function calibrate({ calibration, volts }: { calibration: Calibration; volts: number }): number {
  return calibration.gain * volts + calibration.offsetVolts;
}

export function buildSeriesColumns({
  buckets,
  calibration,
  bankFarads,
  burstFloorVolts,
}: {
  buckets: Bucket[];
  calibration: Calibration;
  bankFarads: number;
  burstFloorVolts: number;
}): SeriesColumns {
  const cols: SeriesColumns = {
    t: [], n: [], v_min: [], v_mean: [], v_max: [], v_last: [], t_last: [], vp_max: [],
    energy_min_joules: [], energy_mean_joules: [], energy_max_joules: [],
    reserve_min_joules: [], reserve_mean_joules: [], reserve_max_joules: [],
  };
  const energy = (volts: number) => round(energyJoules({ farads: bankFarads, volts: Math.max(0, volts) }), JOULE_DIGITS);
  const reserve = (volts: number) => round(reserveJoules({ farads: bankFarads, volts, burstFloorVolts }), JOULE_DIGITS);
  for (const b of buckets) {
    const a = calibrate({ calibration, volts: b.vMin });
    const z = calibrate({ calibration, volts: b.vMax });
    const low = Math.min(a, z);
    const high = Math.max(a, z);
    const mean = Math.min(high, Math.max(low, calibrate({ calibration, volts: b.vMean })));
    cols.t.push(b.t);
    cols.n.push(b.n);
    cols.v_min.push(round(low, VOLT_DIGITS));
    cols.v_mean.push(round(mean, VOLT_DIGITS));
    cols.v_max.push(round(high, VOLT_DIGITS));
    cols.v_last.push(round(calibrate({ calibration, volts: b.vLast }), VOLT_DIGITS));
    cols.t_last.push(round(b.tLast, 3));
    cols.vp_max.push(b.vpMax === null ? null : round(b.vpMax, VOLT_DIGITS));
    cols.energy_min_joules.push(energy(low));
    cols.energy_mean_joules.push(energy(mean));
    cols.energy_max_joules.push(energy(high));
    cols.reserve_min_joules.push(reserve(low));
    cols.reserve_mean_joules.push(reserve(mean));
    cols.reserve_max_joules.push(reserve(high));
  }
  return cols;
}
