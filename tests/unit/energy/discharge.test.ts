import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { buildDischargeTable, efficiencyAt, secondsAtVolts, traceDischarge, voltsAtSeconds } from '@/lib/energy';
import type { EfficiencyPoint } from '@/lib/energy';

describe('hold-up time', () => {
  it('constant current: t = C(V1 − V2)/I — maker example 0.1 A, 10 s, 5 → 4.2 V needs 1.25 F', () => {
    // A constant current I drawn from the bank is bank-side power I·V.
    const table = buildDischargeTable({ farads: 1.25, fromVolts: 5, downToVolts: 4.2, bankWattsAt: (v) => 0.1 * v });
    // maker's application page "How to appropriately calculate the capacitance of ultracapacitor": 1.25 F → 10 s
    expect(secondsAtVolts({ table, volts: 4.2 })).toBeCloseTo(10, 9);
    // the same constant-current rule (Wikipedia "Supercapacitor"): halfway in volts at 5 s
    expect(voltsAtSeconds({ table, seconds: 5 })).toBeCloseTo(4.6, 9);
  });

  it('constant power: t = C(V1² − V2²)/(2P) — maker example 200 kW, 10 s, 750 → 450 V needs 11.1 F', () => {
    const farads = (2 * 200e3 * 10) / (750 ** 2 - 450 ** 2); // 11.11 F, re-derived here
    expect(farads).toBeCloseTo(11.1, 1); // maker's application page: 11.1 F
    const table = buildDischargeTable({ farads, fromVolts: 750, downToVolts: 450, bankWattsAt: () => 200e3 });
    expect(secondsAtVolts({ table, volts: 450 })).toBeCloseTo(10, 9); // hold-up at constant power, textbook
  });

  it('power plus leakage: agrees with the closed form (derived here)', () => {
    // C·V·dV/dt = −(a + b·V) → t = (C/b)(V0 − V) − (C·a/b²)·ln((a + b·V0)/(a + b·V))
    const [C, a, b, v0, v] = [300, 0.004, 0.0006, 5.4, 1.1];
    const expected = (C / b) * (v0 - v) - ((C * a) / b ** 2) * Math.log((a + b * v0) / (a + b * v));
    const table = buildDischargeTable({ farads: C, fromVolts: v0, downToVolts: 0.8, bankWattsAt: (u) => a + b * u });
    expect(secondsAtVolts({ table, volts: v }) / expected).toBeCloseTo(1, 7);
    expect(voltsAtSeconds({ table, seconds: expected })).toBeCloseTo(v, 6);
  });

  it('a table-driven efficiency integrates like a fine Euler simulation (derived here)', () => {
    const eta: EfficiencyPoint[] = [[0.5, 0.55], [1.2, 0.75], [2.5, 0.88], [4, 0.9]];
    const watts = (u: number) => 0.006 / efficiencyAt({ efficiency: eta, volts: u }) + 60e-6 * u;
    const table = buildDischargeTable({ farads: 150, fromVolts: 5, downToVolts: 0.7, bankWattsAt: watts, breakVolts: eta.map(([v]) => v) });
    let energy = 0.5 * 150 * 25;
    let t = 0;
    while (Math.sqrt((2 * energy) / 150) > 0.7) {
      energy -= watts(Math.sqrt((2 * energy) / 150)) * 1; // 1-second Euler steps
      t += 1;
    }
    expect(secondsAtVolts({ table, volts: 0.7 }) / t).toBeCloseTo(1, 4);
  });

  it('traces samples and stops at the stop voltage', () => {
    const table = buildDischargeTable({ farads: 1, fromVolts: 2, downToVolts: 1, bankWattsAt: (v) => 0.1 * v });
    const points = traceDischarge({ table, stepSeconds: 1, untilSeconds: 100 });
    expect(points[0]).toEqual({ t: 0, volts: 2 });
    expect(points.at(-1)!.t).toBeCloseTo(10, 6); // derived here: 1 F·1 V / 0.1 A
    expect(points.at(-1)!.volts).toBeCloseTo(1, 6);
    expect(voltsAtSeconds({ table, seconds: 11 })).toBeNull();
  });

  it('reaches its stop voltage exactly, whatever the rounding of the panel nodes (regression)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.3, max: 2, noNaN: true }), fc.double({ min: 2.1, max: 5.4, noNaN: true }), (stop, start) => {
        const table = buildDischargeTable({ farads: 150, fromVolts: start, downToVolts: stop, bankWattsAt: (v) => 0.005 + 1e-4 * v, breakVolts: [1.5, 0.7] });
        return Number.isFinite(secondsAtVolts({ table, volts: stop })) && table.volts.at(-1) === stop;
      }),
    );
  });
});
