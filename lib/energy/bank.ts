import type { BankModel, BankSpec } from './types';

// Identical cells: a series string divides capacitance and adds ESR; parallel strings do the
// opposite. Leakage: the same current flows through every cell of a string, so a string leaks
// one cell's current; np strings in parallel leak np times that. The bank then dissipates
// np·I_cell·(ns·V_cell) = (every cell) × I_cell × V_cell, as it should.
export function modelBank({ bank }: { bank: BankSpec }): BankModel {
  const { cellsSeries: ns, cellsParallel: np } = bank;
  return {
    farads: (np * bank.cellFarads) / ns,
    maxVolts: ns * bank.cellRatedVolts,
    esrOhms: (ns * bank.cellEsrOhms) / np,
    leakageAmps: np * bank.cellLeakageAmps,
  };
}

export function energyJoules({ farads, volts }: { farads: number; volts: number }): number {
  return 0.5 * farads * volts * volts;
}

/** Energy above a floor voltage; nothing below it. */
export function usableJoules({
  farads,
  volts,
  floorVolts,
}: {
  farads: number;
  volts: number;
  floorVolts: number;
}): number {
  if (volts <= floorVolts) return 0;
  return 0.5 * farads * (volts * volts - floorVolts * floorVolts);
}

/** Energy-based state of charge between cutoff and full, clamped to 0..1 (never linear in volts). */
export function stateOfCharge({
  volts,
  cutoffVolts,
  maxVolts,
}: {
  volts: number;
  cutoffVolts: number;
  maxVolts: number;
}): number {
  const span = maxVolts * maxVolts - cutoffVolts * cutoffVolts;
  if (span <= 0) return volts >= maxVolts ? 1 : 0;
  const soc = (volts * volts - cutoffVolts * cutoffVolts) / span;
  return Math.min(1, Math.max(0, soc));
}

/** The caution figure: current a dead short would draw from the bank at this voltage. */
export function shortCircuitAmps({ volts, esrOhms }: { volts: number; esrOhms: number }): number {
  return esrOhms > 0 ? volts / esrOhms : Number.POSITIVE_INFINITY;
}

/** Voltage at which a bank holds the given energy (inverse of energyJoules). */
export function voltsForJoules({ farads, joules }: { farads: number; joules: number }): number {
  return joules <= 0 ? 0 : Math.sqrt((2 * joules) / farads);
}
