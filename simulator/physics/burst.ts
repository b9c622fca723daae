import type { BankPhysics } from './bank';
import { applyJoules } from './bank';
import { getEfficiency, solveTerminal } from './converter';
import type { SimConverter, SimLoad } from './types';

// The awake phase and the transmit burst, stepped finely (50 ms) so that the capacitive droop
// and the ESR drop are both followed through the pulse.

const SUB_STEP_SECONDS = 0.05;

export interface PhaseResult {
  ok: boolean;
  /** Resting volts at the end of the phase (or at the moment it failed). */
  volts: number;
  minTerminalVolts: number;
  maxInputAmps: number;
  /** Energy taken out of the capacitor, ESR loss included. */
  joules: number;
}

export function runLoadPhase({ volts, bank, converter, outputAmps, seconds }: {
  volts: number; bank: BankPhysics; converter: SimConverter; outputAmps: number; seconds: number;
}): PhaseResult {
  const steps = Math.max(1, Math.ceil(seconds / SUB_STEP_SECONDS));
  const dt = seconds / steps;
  const outputWatts = converter.outputVolts * outputAmps;
  let v = volts;
  let joules = 0;
  let minTerminalVolts = Infinity;
  let maxInputAmps = 0;
  for (let i = 0; i < steps; i += 1) {
    // Efficiency depends on the converter's own input (terminal) voltage: one refinement pass.
    let eta = getEfficiency({ efficiency: converter.efficiency, inputVolts: v });
    let point = solveTerminal({ restingVolts: v, esrOhms: bank.esrOhms, inputWatts: outputWatts / eta });
    if (point) {
      eta = getEfficiency({ efficiency: converter.efficiency, inputVolts: point.terminalVolts });
      point = solveTerminal({ restingVolts: v, esrOhms: bank.esrOhms, inputWatts: outputWatts / eta });
    }
    if (!point || point.terminalVolts < converter.cutoffVolts || point.amps > converter.inputLimitAmps) {
      return { ok: false, volts: v, minTerminalVolts: point?.terminalVolts ?? 0, maxInputAmps: point?.amps ?? Infinity, joules };
    }
    minTerminalVolts = Math.min(minTerminalVolts, point.terminalVolts);
    maxInputAmps = Math.max(maxInputAmps, point.amps);
    // The capacitor's own voltage drives the current: E drawn = V·I·dt (= P_in + I²·ESR).
    const drawn = v * point.amps * dt;
    joules += drawn;
    v = applyJoules({ farads: bank.farads, volts: v, joules: -drawn });
  }
  return { ok: true, volts: v, minTerminalVolts, maxInputAmps, joules };
}

/** One report: wake (measure, connect), then the transmit burst. Fails at the first bad sub-step. */
export function runReportCycle({ volts, bank, converter, load }: {
  volts: number; bank: BankPhysics; converter: SimConverter; load: SimLoad;
}): PhaseResult & { failedIn: 'awake' | 'burst' | null } {
  const awake = runLoadPhase({ volts, bank, converter, outputAmps: load.awakeAmps, seconds: load.awakeSeconds });
  if (!awake.ok) return { ...awake, failedIn: 'awake' };
  const burst = runLoadPhase({ volts: awake.volts, bank, converter, outputAmps: load.burstAmps, seconds: load.burstSeconds });
  return {
    ...burst,
    joules: awake.joules + burst.joules,
    minTerminalVolts: Math.min(awake.minTerminalVolts, burst.minTerminalVolts),
    maxInputAmps: Math.max(awake.maxInputAmps, burst.maxInputAmps),
    failedIn: burst.ok ? null : 'burst',
  };
}

/**
 * Lowest resting volts from which a report cycle (wake + burst, or the burst alone) completes,
 * by bisection; NaN if even the charge voltage is not enough.
 */
export function findBurstFloorVolts({ bank, converter, load, includeAwake = false }: {
  bank: BankPhysics; converter: SimConverter; load: SimLoad; includeAwake?: boolean;
}): number {
  const completes = (volts: number) =>
    includeAwake
      ? runReportCycle({ volts, bank, converter, load }).ok
      : runLoadPhase({ volts, bank, converter, outputAmps: load.burstAmps, seconds: load.burstSeconds }).ok;
  let low = converter.cutoffVolts;
  let high = Math.max(bank.chargeVolts, bank.ratedVolts);
  if (!completes(high)) return Number.NaN;
  if (completes(low)) return low;
  for (let i = 0; i < 40; i += 1) {
    const mid = (low + high) / 2;
    if (completes(mid)) high = mid;
    else low = mid;
  }
  return high;
}
