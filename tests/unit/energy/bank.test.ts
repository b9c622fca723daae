import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  energyJoules,
  modelBank,
  shortCircuitAmps,
  stateOfCharge,
  usableJoules,
  voltsForJoules,
} from '@/lib/energy';

// The textbook's general rules for combining capacitors (OpenStax, College Physics 2e, §19.6):
// series 1/C = Σ 1/Ci, parallel C = Σ Ci. Checked below against the book's own examples, then
// used as an independent check of the bank formulas for identical cells.
const seriesFarads = (cs: number[]) => 1 / cs.reduce((a, c) => a + 1 / c, 0);
const parallelFarads = (cs: number[]) => cs.reduce((a, c) => a + c, 0);
const cellBank = (ns: number, np: number, farads = 100, esr = 0.02) =>
  modelBank({
    bank: { cellsSeries: ns, cellsParallel: np, cellFarads: farads, cellRatedVolts: 2.7, cellEsrOhms: esr, cellLeakageAmps: 5e-6 },
  });

describe('capacitor energy', () => {
  it('stores 400 J in 8.00 µF at 10.0 kV', () => {
    // OpenStax College Physics 2e §19.7 Example 19.11 (defibrillator): 400 J at 10.0 kV → C = 8.00 µF
    expect(energyJoules({ farads: 8.0e-6, volts: 10.0e3 })).toBeCloseTo(400, 9);
    // ...and the inverse: the voltage that holds 400 J in 8 µF
    expect(voltsForJoules({ farads: 8.0e-6, joules: 400 })).toBeCloseTo(10.0e3, 6);
  });

  it('a 400 F cell at 2.7 V stores 1458 J (about 0.41 Wh)', () => {
    const joules = energyJoules({ farads: 400, volts: 2.7 });
    expect(joules).toBeCloseTo(1458, 9); // common practice: ½·400·2.7² = 1458 J
    expect(joules / 3600).toBeCloseTo(0.405, 3); // common practice: ≈ 0.41 Wh
  });

  it('usable energy between two voltages is ½C(Vmax² − Vmin²), nothing below the floor', () => {
    // Standard textbook result (REFERENCES.md; Wikipedia "Supercapacitor"): W = ½C(Vmax² − Vmin²).
    // With the maker's constant-current example (1.25 F, 5 V → 4.2 V): ½·1.25·(25 − 17.64) = 4.6 J (derived here)
    expect(usableJoules({ farads: 1.25, volts: 5, floorVolts: 4.2 })).toBeCloseTo(4.6, 9);
    expect(usableJoules({ farads: 1.25, volts: 4.0, floorVolts: 4.2 })).toBe(0);
  });

  it('energy rises with voltage (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-3, max: 1e4, noNaN: true }),
        fc.double({ min: 0, max: 100, noNaN: true }),
        fc.double({ min: 1e-6, max: 10, noNaN: true }),
        (farads, volts, extra) => energyJoules({ farads, volts: volts + extra }) > energyJoules({ farads, volts }),
      ),
    );
  });
});

describe('bank of identical cells', () => {
  it('the textbook combination rules reproduce the book examples', () => {
    // OpenStax College Physics 2e §19.6 Example 19.9: 1.000, 5.000, 8.000 µF in series → 0.755 µF
    expect(seriesFarads([1, 5, 8])).toBeCloseTo(0.755, 3);
    // same example, in parallel → 14.000 µF
    expect(parallelFarads([1, 5, 8])).toBeCloseTo(14.0, 9);
    // Example 19.10: C1, C2 in series (0.833 µF), then in parallel with C3 → 8.833 µF
    expect(parallelFarads([seriesFarads([1, 5]), 8])).toBeCloseTo(8.833, 3);
  });

  it('C = np·C/ns agrees with the series/parallel rules for identical cells', () => {
    for (const [ns, np] of [[1, 1], [2, 1], [3, 4], [6, 2]]) {
      // derived here: ns cells in series per string (OpenStax §19.6 series rule), np strings in parallel
      const expected = parallelFarads(Array(np).fill(seriesFarads(Array(ns).fill(100))));
      expect(cellBank(ns, np).farads).toBeCloseTo(expected, 9);
    }
  });

  it('V_max = ns·V_rated and ESR = ns·ESR/np (resistors add in series, divide in parallel)', () => {
    const bank = cellBank(3, 4, 100, 0.02);
    expect(bank.maxVolts).toBeCloseTo(8.1, 12); // derived here: 3 × 2.7 V
    expect(bank.esrOhms).toBeCloseTo(0.015, 12); // derived here: 3 × 20 mΩ / 4
    expect(bank.leakageAmps).toBeCloseTo(20e-6, 12); // derived here: each string leaks one cell's current, 4 strings
  });

  it('RC time constant of a 100 F, 30 mΩ cell is 3 s', () => {
    const bank = cellBank(1, 1, 100, 0.03);
    expect(bank.farads * bank.esrOhms).toBeCloseTo(3, 12); // Wikipedia "Supercapacitor": 100 F with 30 mΩ → 3 s
  });

  it('short-circuit current is V/ESR_bank', () => {
    const bank = cellBank(2, 2, 100, 0.02);
    expect(shortCircuitAmps({ volts: 5.4, esrOhms: bank.esrOhms })).toBeCloseTo(270, 9); // derived here: 5.4 V / 20 mΩ
  });
});

describe('state of charge', () => {
  it('is energy-based, never linear in volts, and clamped', () => {
    // derived here: halfway in volts between 0.5 and 5.4 V holds (2.95² − 0.25)/(29.16 − 0.25) ≈ 0.292 of the usable energy
    expect(stateOfCharge({ volts: 2.95, cutoffVolts: 0.5, maxVolts: 5.4 })).toBeCloseTo((2.95 ** 2 - 0.25) / (5.4 ** 2 - 0.25), 12);
    expect(stateOfCharge({ volts: 6, cutoffVolts: 0.5, maxVolts: 5.4 })).toBe(1);
    expect(stateOfCharge({ volts: 0.2, cutoffVolts: 0.5, maxVolts: 5.4 })).toBe(0);
  });
});
