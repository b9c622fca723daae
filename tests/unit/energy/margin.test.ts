import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  averageOutputWatts,
  efficiencyAt,
  evaluateNode,
  modelBank,
  nightMargin,
  SEARCH_LIMIT_SECONDS,
  solveBurstFloor,
} from '@/lib/energy';
import type { BankSpec, ConverterSpec, LoadSpec } from '@/lib/energy';
import { bank, converter, load, site } from './fixtures';

const evening = new Date('2026-12-21T17:00:00Z');

describe('night margin', () => {
  it('constant η, no leakage: margin = reserve/(P·T) and brownout = reserve/P (derived here)', () => {
    const quiet: BankSpec = { ...bank, cellLeakageAmps: 0 };
    const result = nightMargin({ bank: quiet, converter, load, site, volts: 1.6, at: evening });
    const watts = averageOutputWatts({ load, outputVolts: converter.outputVolts }) / 0.85;
    const windowSeconds = (result.rechargeAt!.getTime() - evening.getTime()) / 1000;
    expect(result.drawJoules).toBeCloseTo(watts * windowSeconds, 6);
    expect(result.margin).toBeCloseTo(result.reserveJoules / (watts * windowSeconds), 9);
    expect(result.margin).toBeLessThan(1);
    const brownoutSeconds = (result.brownoutAt!.getTime() - evening.getTime()) / 1000;
    expect(brownoutSeconds).toBeCloseTo(result.reserveJoules / watts, 0);
  });

  it('a full bank makes it through the night: margin > 1 and no brownout', () => {
    const result = nightMargin({ bank, converter, load, site, volts: 5.4, at: evening });
    expect(result.margin).toBeGreaterThan(1);
    expect(result.brownoutAt).toBeNull();
    // derived here: the draw is the fall in stored energy, less than the reserve
    expect(result.drawJoules).toBeLessThan(result.reserveJoules);
  });

  it('below the burst floor: no reserve, margin 0, brownout now', () => {
    const result = nightMargin({ bank, converter, load, site, volts: 0.6, at: evening });
    expect(result).toMatchObject({ reserveJoules: 0, margin: 0 });
    expect(result.brownoutAt!.getTime()).toBe(evening.getTime());
  });

  it('polar night: no recharge, the window is 7 days', () => {
    const arctic = { lat: 78, lon: 15, rechargeElevationDeg: -0.833 };
    const quiet: BankSpec = { ...bank, cellLeakageAmps: 0, cellsParallel: 40 };
    const result = nightMargin({ bank: quiet, converter, load, site: arctic, volts: 5.4, at: new Date('2026-12-15T12:00:00Z') });
    expect(result.rechargeAt).toBeNull();
    const watts = averageOutputWatts({ load, outputVolts: converter.outputVolts }) / 0.85;
    expect(result.drawJoules).toBeCloseTo(watts * SEARCH_LIMIT_SECONDS, 4); // derived here: constant power × 7 days
  });

  it('projected brownout agrees within 2 % with a cycle-by-cycle simulation (derived here)', () => {
    const tableConverter: ConverterSpec = { ...converter, efficiency: [[0.5, 0.6], [1.5, 0.8], [3, 0.9]] };
    const leaky: BankSpec = { ...bank, cellsParallel: 1, cellLeakageAmps: 200e-6 };
    const result = nightMargin({ bank: leaky, converter: tableConverter, load, site, volts: 3.2, at: evening });
    expect(result.brownoutAt).not.toBeNull();
    const projected = (result.brownoutAt!.getTime() - evening.getTime()) / 1000;
    const simulated = simulateBrownoutSeconds({ bankSpec: leaky, converter: tableConverter, load, volts: 3.2 });
    expect(Math.abs(projected - simulated) / simulated).toBeLessThan(0.02);
  });

  it('margin < 1 exactly when a brownout is projected (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.4, max: 5.4, noNaN: true }), fc.integer({ min: 1, max: 12 }), (volts, np) => {
        const r = nightMargin({ bank: { ...bank, cellsParallel: np }, converter, load, site, volts, at: evening });
        return (r.margin < 1) === (r.brownoutAt !== null);
      }),
      { numRuns: 200 },
    );
  });
});

describe('model properties', () => {
  const node = fc.record({
    volts: fc.double({ min: 0, max: 5.4, noNaN: true }),
    np: fc.integer({ min: 1, max: 10 }),
    esr: fc.double({ min: 0.001, max: 0.3, noNaN: true }),
    leakage: fc.double({ min: 0, max: 100e-6, noNaN: true }),
    interval: fc.integer({ min: 30, max: 1800 }),
  });

  it('reserve never exceeds usable energy', () => {
    fc.assert(
      fc.property(node, (n) => {
        const r = evaluateNode({
          bank: { ...bank, cellsParallel: n.np, cellEsrOhms: n.esr, cellLeakageAmps: n.leakage },
          converter,
          load: { ...load, intervalSeconds: n.interval },
          site,
          volts: n.volts,
          at: evening,
        });
        return r.reserveJoules <= r.usableJoules + 1e-9;
      }),
      { numRuns: 200 },
    );
  });

  it('margin never rises when the interval shortens', () => {
    fc.assert(
      fc.property(node, fc.integer({ min: 4, max: 1800 }), (n, shorter) => {
        const at = evening;
        const b = { ...bank, cellsParallel: n.np, cellEsrOhms: n.esr, cellLeakageAmps: n.leakage };
        const longer = Math.max(shorter, n.interval);
        const short = Math.min(shorter, n.interval);
        const m = (intervalSeconds: number) =>
          nightMargin({ bank: b, converter, load: { ...load, intervalSeconds }, site, volts: n.volts, at }).margin;
        return m(short) <= m(longer) + 1e-12;
      }),
      { numRuns: 200 },
    );
  });
});

// A step-by-step node: each cycle checks that the burst can be delivered (the burst
// formula), then takes the cycle's energy from the bank at the voltage it has then.
function simulateBrownoutSeconds({
  bankSpec,
  converter: c,
  load: l,
  volts,
}: {
  bankSpec: BankSpec;
  converter: ConverterSpec;
  load: LoadSpec;
  volts: number;
}): number {
  const b = modelBank({ bank: bankSpec });
  const burstWatts = c.outputVolts * l.burstAmps;
  let energy = 0.5 * b.farads * volts ** 2;
  for (let t = 0; t < 14 * 86_400; t += l.intervalSeconds) {
    const v = Math.sqrt((2 * energy) / b.farads);
    const eta = efficiencyAt({ efficiency: c.efficiency, volts: v });
    const rested = v * v - (2 * burstWatts * l.burstSeconds) / (eta * b.farads);
    const disc = rested - (4 * b.esrOhms * burstWatts) / eta;
    const terminal = rested >= 0 && disc >= 0 ? (Math.sqrt(rested) + Math.sqrt(disc)) / 2 : 0;
    if (terminal < c.cutoffVolts || burstWatts / (eta * terminal) > c.inputLimitAmps) return t;
    const sleepSeconds = l.intervalSeconds - l.awakeSeconds - l.burstSeconds;
    const outJoules = c.outputVolts * (l.sleepAmps * sleepSeconds + l.awakeAmps * l.awakeSeconds + l.burstAmps * l.burstSeconds);
    energy -= outJoules / eta + b.leakageAmps * v * l.intervalSeconds;
  }
  return Number.POSITIVE_INFINITY;
}

it('the simulation helper finds the floor the solver finds (sanity of the cross-check)', () => {
  const b = modelBank({ bank });
  const floor = solveBurstFloor({ bank: b, converter, load }).volts;
  expect(simulateBrownoutSeconds({ bankSpec: bank, converter, load, volts: floor - 1e-3 })).toBe(0);
  expect(simulateBrownoutSeconds({ bankSpec: bank, converter, load, volts: floor + 1e-3 })).toBeGreaterThan(0);
});
