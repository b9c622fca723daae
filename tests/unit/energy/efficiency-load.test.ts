import { describe, expect, it } from 'vitest';
import { averageOutputWatts, bankWatts, efficiencyAt, inputCurrentAmps } from '@/lib/energy';
import type { EfficiencyPoint, LoadSpec } from '@/lib/energy';

describe('converter', () => {
  it('boost converter input current: 5 V in, 10 V out at 0.8 A, η = 80 % → 2 A', () => {
    // REFERENCES.md boost converter worked example: I_in = V_out·I_out/(η·V_in) = 2 A
    expect(inputCurrentAmps({ outputWatts: 10 * 0.8, eta: 0.8, inputVolts: 5 })).toBeCloseTo(2, 12);
  });

  it('efficiency table is linear between points and flat beyond its ends', () => {
    const table: EfficiencyPoint[] = [[1.5, 0.8], [0.5, 0.6], [3, 0.9]]; // unsorted on purpose
    expect(efficiencyAt({ efficiency: table, volts: 0.2 })).toBe(0.6); // derived here: held flat below
    expect(efficiencyAt({ efficiency: table, volts: 1.0 })).toBeCloseTo(0.7, 12); // derived here: midway 0.6→0.8
    expect(efficiencyAt({ efficiency: table, volts: 2.25 })).toBeCloseTo(0.85, 12); // derived here: midway 0.8→0.9
    expect(efficiencyAt({ efficiency: table, volts: 4 })).toBe(0.9); // derived here: held flat above
    expect(efficiencyAt({ efficiency: 0.85, volts: 4 })).toBe(0.85);
  });
});

describe('load', () => {
  const load: LoadSpec = {
    sleepAmps: 10e-6,
    awakeSeconds: 2,
    awakeAmps: 0.08,
    burstSeconds: 1,
    burstAmps: 0.3,
    intervalSeconds: 300,
    maxIntervalSeconds: 3600,
  };

  it('averages one cycle at the output voltage', () => {
    // derived here: 3.3·(10 µA·297 s + 0.08 A·2 s + 0.3 A·1 s)/300 s = 3.3·0.46297/300 W
    const expected = (3.3 * (10e-6 * 297 + 0.08 * 2 + 0.3 * 1)) / 300;
    expect(averageOutputWatts({ load, outputVolts: 3.3 })).toBeCloseTo(expected, 15);
  });

  it('bank side adds converter loss and leakage × bank voltage', () => {
    const out = averageOutputWatts({ load, outputVolts: 3.3 });
    // derived here: P_out/η + I_leak·V
    expect(bankWatts({ outputWatts: out, efficiency: 0.8, leakageAmps: 30e-6, volts: 2 })).toBeCloseTo(out / 0.8 + 60e-6, 15);
  });
});
