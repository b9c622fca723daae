import type { SimBank, SimCharger, SimFaults } from './types';

// The bank as a single ideal capacitor with a series resistance (DESIGN.md §3 combinations).

export interface BankPhysics {
  farads: number;
  esrOhms: number;
  ratedVolts: number;
  chargeVolts: number;
  /** Leakage current at a bank voltage; grows with voltage (proportional to V/Vmax here). */
  leakageAmps(volts: number): number;
}

export function createBankPhysics({ bank, charger, faults }: { bank: SimBank; charger: SimCharger; faults: SimFaults }): BankPhysics {
  const ratedVolts = bank.cellsSeries * bank.cellRatedVolts;
  // Series cells carry one current, parallel strings add theirs.
  const leakAtRated = bank.cellsParallel * bank.cellLeakageAmps * faults.leakageFactor;
  return {
    farads: ((bank.cellsParallel * bank.cellFarads) / bank.cellsSeries) * faults.capacitanceFactor,
    esrOhms: (bank.cellsSeries * bank.cellEsrOhms) / bank.cellsParallel,
    ratedVolts,
    chargeVolts: charger.chargeVolts ?? ratedVolts * 0.96,
    leakageAmps: (volts) => leakAtRated * Math.max(0, volts) / ratedVolts,
  };
}

export function getStoredJoules({ farads, volts }: { farads: number; volts: number }): number {
  return 0.5 * farads * volts * volts;
}

/** Volts after adding (positive) or drawing (negative) energy, from E = ½CV²; floors at 0. */
export function applyJoules({ farads, volts, joules }: { farads: number; volts: number; joules: number }): number {
  const energy = getStoredJoules({ farads, volts }) + joules;
  return energy > 0 ? Math.sqrt((2 * energy) / farads) : 0;
}
