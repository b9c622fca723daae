import { createBankPhysics, getStoredJoules } from '../physics/bank';
import { findBurstFloorVolts } from '../physics/burst';
import { getEfficiency } from '../physics/converter';
import { getNextRisingThrough } from '../physics/sun';
import { DEFAULT_FAULTS, type SimNodeSpec, type SimReading } from '../physics/types';
import type { DemoNodeState } from './demo-nodes';

// The simulator's own reading of a node's state at "now", from its readings and its nominal
// configuration — a stand-in for the product's energy model, used to tune and test the demo.


/** Sun centre 0.833° below the horizon: sunrise as almanacs give it (common practice). */
const STANDARD_SUNRISE_DEG = -0.833;

export interface DemoStateEstimate {
  state: DemoNodeState;
  margin: number | null;
  floorVolts: number;
  lastVolts: number | null;
  rechargeAt: Date | null;
}

/** Mean power the configured load takes from the bank at `volts` (sleep + one report per interval). */
export function getMeanBankWatts({ spec, volts }: { spec: SimNodeSpec; volts: number }): number {
  const { load, converter } = spec;
  const reportAmpSeconds = load.awakeAmps * load.awakeSeconds + load.burstAmps * load.burstSeconds;
  const outputWatts = converter.outputVolts * (load.sleepAmps + reportAmpSeconds / load.intervalSeconds);
  const bank = createBankPhysics({ bank: spec.bank, charger: spec.charger, faults: DEFAULT_FAULTS });
  return outputWatts / getEfficiency({ efficiency: converter.efficiency, inputVolts: volts }) + volts * bank.leakageAmps(volts);
}

export function estimateDemoState({ spec, readings, now }: { spec: SimNodeSpec; readings: SimReading[]; now: Date }): DemoStateEstimate {
  const bank = createBankPhysics({ bank: spec.bank, charger: spec.charger, faults: DEFAULT_FAULTS });
  const floorVolts = findBurstFloorVolts({ bank, converter: spec.converter, load: spec.load });
  const last = readings[readings.length - 1];
  if (!last) return { state: 'new', margin: null, floorVolts, lastVolts: null, rechargeAt: null };
  const cal = spec.calibration ?? { gain: 1, offsetVolts: 0 };
  const lastVolts = cal.gain * last.v + cal.offsetVolts;
  const quietSeconds = (now.getTime() - last.t.getTime()) / 1000;
  if (quietSeconds > 3 * spec.load.intervalSeconds) {
    const state = lastVolts <= floorVolts + 0.15 ? 'dark' : 'silent';
    return { state, margin: null, floorVolts, lastVolts, rechargeAt: null };
  }
  // As the product reckons it: from the last reading's time to the sun rising through the
  // site's recharge elevation (the product's default, standard sunrise, where none is set).
  const rechargeAt = getNextRisingThrough({
    from: last.t, latDeg: spec.site.latDeg, lonDeg: spec.site.lonDeg, elevationDeg: spec.site.rechargeElevationDeg ?? STANDARD_SUNRISE_DEG,
  });
  const seconds = rechargeAt ? (rechargeAt.getTime() - last.t.getTime()) / 1000 : 0;
  const reserve = Math.max(0, getStoredJoules({ farads: bank.farads, volts: lastVolts }) - getStoredJoules({ farads: bank.farads, volts: floorVolts }));
  // Efficiency falls as the bank does: take the draw at the midpoint between now and the floor.
  const need = getMeanBankWatts({ spec, volts: (lastVolts + floorVolts) / 2 }) * seconds;
  const margin = need > 0 ? reserve / need : Infinity;
  const state = margin >= 1.5 ? 'steady' : margin >= 1 ? 'thin' : 'short';
  return { state, margin, floorVolts, lastVolts, rechargeAt };
}
