import { describe, expect, it } from 'vitest';
import { burstLimit, marginOverWindow, modelBank, planBank, solveBurstFloor } from '@/lib/energy';
import type { PlanInput } from '@/lib/energy';
import { converter, load, site } from './fixtures';

const plan: PlanInput = {
  load,
  converter,
  cell: { farads: 100, ratedVolts: 2.7, esrOhms: 0.02, leakageAmps: 20e-6 },
  cellsSeries: 2,
  site,
  year: 2026,
  extraDays: 1,
  targetMargin: 1.5,
  panelWatts: 2,
  chargerEfficiency: 0.8,
  sunFactor: 0.5,
  chargerAmps: 0.5,
};

// Independent margin for a candidate count, starting full over the planned window.
function marginFor(np: number, windowSeconds: number): number {
  const bank = modelBank({
    bank: { cellsSeries: 2, cellsParallel: np, cellFarads: 100, cellRatedVolts: 2.7, cellEsrOhms: 0.02, cellLeakageAmps: 20e-6 },
  });
  const floorVolts = solveBurstFloor({ bank, converter, load }).volts;
  return marginOverWindow({ bank, converter, load, volts: bank.maxVolts, windowSeconds, floorVolts }).margin;
}

describe('sizing planner', () => {
  const result = planBank(plan);

  it('plans for the longest night plus the extra day', () => {
    expect(result.nightStart!.getUTCMonth()).toBe(11); // derived here: northern winter solstice
    expect(result.nightSeconds / 3600).toBeGreaterThan(15.4); // derived here: ≈ 15.6 h at 47° N
    expect(result.nightSeconds / 3600).toBeLessThan(15.8);
    expect(result.windowSeconds).toBe(result.nightSeconds + 86_400);
  });

  it('picks the smallest parallel count that reaches the target margin', () => {
    const np = result.cellsParallel!;
    expect(np).toBeGreaterThan(1);
    expect(marginFor(np, result.windowSeconds)).toBeGreaterThanOrEqual(1.5);
    expect(marginFor(np - 1, result.windowSeconds)).toBeLessThan(1.5);
    expect(result.margin).toBeCloseTo(marginFor(np, result.windowSeconds), 12);
  });

  it('reports energy and charge times for that bank', () => {
    const farads = (result.cellsParallel! * 100) / 2;
    expect(result.energyFullJoules).toBeCloseTo(0.5 * farads * 5.4 ** 2, 9); // E = ½CV² (OpenStax §19.7)
    // DESIGN.md §3: constant-current charge t = C·ΔV/I, from cutoff (0.5 V) to full (5.4 V)
    expect(result.ccChargeSeconds).toBeCloseTo((farads * (5.4 - 0.5)) / 0.5, 9);
    // derived here: usable energy from cutoff to full over the delivered panel power (2 W · 0.8 · 0.5)
    expect(result.panelChargeSeconds).toBeCloseTo((0.5 * farads * (5.4 ** 2 - 0.5 ** 2)) / 0.8, 9);
  });

  it('traces the discharge from full over the window, staying above the floor', () => {
    const curve = result.dischargeCurve;
    expect(curve[0]).toEqual({ t: 0, volts: 5.4 });
    expect(curve.at(-1)!.t).toBeCloseTo(result.windowSeconds, 6);
    for (let i = 1; i < curve.length; i++) expect(curve[i].volts).toBeLessThan(curve[i - 1].volts);
    expect(curve.at(-1)!.volts).toBeGreaterThan(result.burstFloorVolts);
  });

  it('more sunless days need more cells; a short summer night needs fewer', () => {
    expect(planBank({ ...plan, extraDays: 3 }).cellsParallel!).toBeGreaterThan(result.cellsParallel!);
    expect(planBank({ ...plan, extraDays: 0, date: new Date('2026-06-21') }).cellsParallel!).toBeLessThanOrEqual(
      planBank({ ...plan, extraDays: 0 }).cellsParallel!,
    );
  });

  it('works in the southern hemisphere: the longest night is in June or July', () => {
    const south = planBank({ ...plan, site: { lat: -41.3, lon: 174.8, rechargeElevationDeg: -0.833 } });
    expect([5, 6]).toContain(south.nightStart!.getUTCMonth());
  });

  it('says so when no count up to the maximum is enough', () => {
    const hopeless = planBank({ ...plan, maxCellsParallel: 3, extraDays: 10 });
    expect(hopeless.cellsParallel).toBeNull();
    expect(hopeless.evaluatedCellsParallel).toBe(3);
    expect(hopeless.margin).toBeLessThan(1.5);
  });
});

describe('a burst no bank can carry', () => {
  // REFERENCES.md, boost converter worked example: 5 V in, 10 V out at 0.8 A, η = 80 % → I_in = 2 A.
  const converter = { startVolts: 1, cutoffVolts: 0.8, outputVolts: 10, efficiency: 0.8, inputLimitAmps: 1.5 };
  const load = { sleepAmps: 0, awakeSeconds: 0, awakeAmps: 0, burstSeconds: 1, burstAmps: 0.8, intervalSeconds: 600, maxIntervalSeconds: 3600 };
  it('is blocked when the ideal input current from a full bank is over the limit (2 A > 1.5 A)', () => {
    const blocked = burstLimit({ converter, load, fullVolts: 5 })!;
    expect(blocked.inputAmps).toBeCloseTo(2, 12);
    expect(blocked.limitAmps).toBe(1.5);
  });
  it('is not blocked with a 2.5 A limit: more cells can then lower the sag', () => {
    expect(burstLimit({ converter: { ...converter, inputLimitAmps: 2.5 }, load, fullVolts: 5 })).toBeNull();
  });
});
