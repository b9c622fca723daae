import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { averageOutputWatts, evaluateNode, nightMargin, type BankSpec, type ConverterSpec, type LoadSpec, type SiteSpec } from '@/lib/energy';
import { simulateDischargeUntilBrownout, type SimNodeSpec } from '@/simulator/physics';

// Issue 4: "the projected brownout instant agrees within 2 % with a step-by-step simulation of
// the same node by the simulator's physics". The two sides are written independently: lib/energy
// integrates the cycle-averaged bank power over voltage; the simulator steps time, runs each
// report's wake and burst in 50 ms sub-steps through the ESR, and browns out at the first
// report that fails. The 2 % is relative to the time from the evaluation instant to brownout.
//
// Where they differ, by design (so the configurations below stay in the range both claim):
// - the simulator takes the ESR loss I²·R out of the bank during wake and burst; the issue's
//   formulas (bank-side power = output/η + leakage·V, V' = √(V² − 2Pt/(ηC))) leave it out,
//   so lib/energy projects late by about the loss fraction I·ESR/V. Cells here have ≤ 30 mΩ.
// - the burst floor is for the burst alone; the simulator's report runs the wake first,
//   so it fails about one wake's energy earlier (lib/energy late by ≲ 1/cycles).
// - the simulator's leakage grows with voltage (∝ V/V_max); lib/energy holds the maker's figure
//   constant, so it projects early by up to leakage power ÷ load power (kept ≤ 1 % in the property).
// - the simulator fails at a report instant: brownouts come in steps of one interval, so each
//   discharge compared lasts at least 50 intervals (100 in the property).
// Measured while writing this: over ~950 random nodes of the property's family (5 seeds × 300)
// the worst gap was 1.5 %.

const TOLERANCE = 0.02; // issue 4

const site: SiteSpec = { lat: 47.1, lon: 8.3, rechargeElevationDeg: -0.833 }; // an invented valley at 47° N
const load: LoadSpec = { sleepAmps: 10e-6, awakeSeconds: 2, awakeAmps: 0.08, burstSeconds: 1, burstAmps: 0.3, intervalSeconds: 300, maxIntervalSeconds: 3600 };
const converter: ConverterSpec = { startVolts: 1.0, cutoffVolts: 0.8, outputVolts: 3.3, efficiency: 0.85, inputLimitAmps: 2 };
const bank: BankSpec = { cellsSeries: 2, cellsParallel: 1, cellFarads: 50, cellRatedVolts: 2.7, cellEsrOhms: 0.02, cellLeakageAmps: 0 };

function simSpec({ bank, converter, load }: { bank: BankSpec; converter: ConverterSpec; load: LoadSpec }): SimNodeSpec {
  return {
    slug: 'cross-check',
    site: { latDeg: site.lat, lonDeg: site.lon, timeZone: 'Europe/Zurich' },
    bank,
    converter,
    load,
    panel: { ratedWatts: 1, nominalVolts: 6, openCircuitVolts: 6.5 },
    charger: { efficiency: 0.8, chargeLimitAmps: 0.3 },
  };
}

/** Seconds to brownout in the dark, both ways: lib/energy with no recharge in sight, the simulator with no sun. */
function darkBrownouts(node: { bank: BankSpec; converter: ConverterSpec; load: LoadSpec; volts: number }) {
  const from = new Date('2026-12-10T17:00:00Z');
  const model = nightMargin({ ...node, site, at: from, rechargeAt: null });
  const sim = simulateDischargeUntilBrownout(simSpec(node), { from, initialVolts: node.volts, noSun: true, dtSeconds: 30 });
  const seconds = (d: Date | null) => (d ? (d.getTime() - from.getTime()) / 1000 : Number.NaN);
  return { modelSeconds: seconds(model.brownoutAt), simSeconds: seconds(sim), intervalSeconds: node.load.intervalSeconds };
}

function expectAgreement({ modelSeconds, simSeconds, intervalSeconds }: ReturnType<typeof darkBrownouts>) {
  expect(Number.isFinite(modelSeconds)).toBe(true);
  expect(Number.isFinite(simSeconds)).toBe(true);
  expect(modelSeconds).toBeGreaterThan(50 * intervalSeconds); // long enough for the comparison to mean something
  expect(Math.abs(simSeconds - modelSeconds) / modelSeconds).toBeLessThan(TOLERANCE);
}

describe('projected brownout vs the simulator (issue 4, within 2 %)', () => {
  it('a December night at 47° N: both brown out before sunrise, at the same time', () => {
    const at = new Date('2026-12-10T17:00:00Z'); // after sunset at 8.3° E
    const node = { bank, converter, load, volts: 3.6 };
    const evaluation = evaluateNode({ ...node, site, at });
    expect(evaluation.brownoutAt).not.toBeNull();
    expect(evaluation.brownoutAt!.getTime()).toBeLessThan(evaluation.rechargeAt!.getTime());
    // The simulator under its own sky (not the no-sun switch): at night its panel gives nothing.
    const sim = simulateDischargeUntilBrownout(simSpec(node), { from: at, initialVolts: node.volts, noSun: false, dtSeconds: 30 });
    expectAgreement({
      modelSeconds: (evaluation.brownoutAt!.getTime() - at.getTime()) / 1000,
      simSeconds: (sim!.getTime() - at.getTime()) / 1000,
      intervalSeconds: load.intervalSeconds,
    });
  });

  it.each([
    ['constant efficiency', { bank, converter, load, volts: 5.0 }],
    ['an efficiency table over input volts', { bank, converter: { ...converter, efficiency: [[0.8, 0.6], [2, 0.8], [5, 0.92]] as [number, number][] }, load, volts: 5.0 }],
    ['20 µA leakage per cell', { bank: { ...bank, cellLeakageAmps: 20e-6 }, converter, load, volts: 5.0 }],
    ['a report every minute with a 0.5 A burst', { bank: { ...bank, cellFarads: 25 }, converter, load: { ...load, intervalSeconds: 60, burstAmps: 0.5 }, volts: 5.2 }],
    ['a floor set by the input current limit, over days', { bank: { ...bank, cellsParallel: 3, cellFarads: 100 }, converter: { ...converter, inputLimitAmps: 0.8 }, load, volts: 5.3 }],
    ['three cells in series, a 5 V output', { bank: { ...bank, cellsSeries: 3, cellFarads: 60 }, converter: { ...converter, outputVolts: 5, cutoffVolts: 1.2, startVolts: 1.5 }, load, volts: 7.5 }],
  ])('in the dark: %s', (_name, node) => {
    expectAgreement(darkBrownouts(node));
  });

  it('outside that range (0.3 Ω cells) the ESR loss the issue leaves out shows: lib/energy is late', () => {
    // Pins the known simplification (see the header) and shows the check can fail: with a bank
    // ESR of 0.6 Ω the wake and burst lose I·ESR/V ≈ 5–10 % of their energy in the cells.
    const { modelSeconds, simSeconds } = darkBrownouts({ bank: { ...bank, cellEsrOhms: 0.3 }, converter, load, volts: 5.0 });
    expect(simSeconds).toBeLessThan(modelSeconds * (1 - TOLERANCE));
  });

  it('agrees over a family of realistic nodes (fast-check, cell ESR ≤ 30 mΩ)', () => {
    const nodes = fc.record({
      cellsSeries: fc.integer({ min: 1, max: 3 }),
      cellsParallel: fc.integer({ min: 1, max: 4 }),
      cellFarads: fc.double({ min: 10, max: 200, noNaN: true }),
      cellEsrOhms: fc.double({ min: 0, max: 0.03, noNaN: true }),
      leakShare: fc.double({ min: 0, max: 0.01, noNaN: true }),
      eta: fc.double({ min: 0.6, max: 0.95, noNaN: true }),
      burstAmps: fc.double({ min: 0.05, max: 0.3, noNaN: true }),
      intervalSeconds: fc.integer({ min: 120, max: 900 }),
      startFraction: fc.double({ min: 0.7, max: 1, noNaN: true }),
    });
    fc.assert(
      fc.property(nodes, (n) => {
        const c: ConverterSpec = { ...converter, efficiency: n.eta, cutoffVolts: 0.8, startVolts: 1.0 };
        const l: LoadSpec = { ...load, burstAmps: n.burstAmps, intervalSeconds: n.intervalSeconds, maxIntervalSeconds: 3600 };
        // Leakage as a share of the node's mean draw at full voltage (see the header: the two
        // leakage models differ by up to that share, so it is kept to ≤ 1 %).
        const maxVolts = 2.7 * n.cellsSeries;
        const loadWatts = averageOutputWatts({ load: l, outputVolts: c.outputVolts }) / n.eta;
        const cellLeakageAmps = (n.leakShare * loadWatts) / (n.cellsParallel * maxVolts);
        const b: BankSpec = { cellsSeries: n.cellsSeries, cellsParallel: n.cellsParallel, cellFarads: n.cellFarads, cellRatedVolts: 2.7, cellEsrOhms: n.cellEsrOhms, cellLeakageAmps };
        const result = darkBrownouts({ bank: b, converter: c, load: l, volts: 2.7 * n.cellsSeries * n.startFraction });
        // Only discharges of a night or more of reports (≥ 100 intervals, within the 7-day
        // window) are compared: shorter ones are dominated by the one-interval steps.
        fc.pre(result.modelSeconds > 100 * n.intervalSeconds);
        expect(Math.abs(result.simSeconds - result.modelSeconds) / result.modelSeconds).toBeLessThan(TOLERANCE);
      }),
      { numRuns: 40, seed: 4 },
    );
  });
});
