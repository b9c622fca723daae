import { describe, expect, it } from 'vitest';
import { averageOutputWatts, bankWatts, drawScaleFrom, evaluateNode, nightMargin } from '@/lib/energy';
import { bank, converter, load, site } from './fixtures';

const at = new Date('2026-12-21T17:00:00Z');

describe('evaluateNode', () => {
  const result = evaluateNode({ bank, converter, load, site, volts: 2.0, at });

  it('answers exactly the fields of the API reply', () => {
    expect(Object.keys(result).sort()).toEqual(
      [
        'energyJoules', 'usableJoules', 'soc', 'burstFloorVolts', 'reserveJoules', 'loadWatts',
        'rechargeAt', 'chargingUntil', 'margin', 'brownoutAt', 'state', 'nextReportSeconds', 'shortCircuitAmps',
      ].sort(),
    );
  });

  it('bank figures follow the definitions (derived here for 2s3p of 100 F, 20 mΩ cells)', () => {
    const farads = 150; // 3·100/2
    expect(result.energyJoules).toBeCloseTo(0.5 * farads * 4, 9);
    expect(result.usableJoules).toBeCloseTo(0.5 * farads * (4 - 0.25), 9);
    expect(result.soc).toBeCloseTo((4 - 0.25) / (5.4 ** 2 - 0.25), 12);
    expect(result.shortCircuitAmps).toBeCloseTo(2.0 / ((2 * 0.02) / 3), 9);
    const out = averageOutputWatts({ load, outputVolts: 3.3 });
    expect(result.loadWatts).toBeCloseTo(bankWatts({ outputWatts: out, efficiency: 0.85, leakageAmps: 60e-6, volts: 2 }), 15);
  });

  it('agrees with nightMargin and maps the margin to a state', () => {
    const m = nightMargin({ bank, converter, load, site, volts: 2.0, at });
    expect(result.margin).toBeCloseTo(m.margin, 12);
    expect(result.rechargeAt).toEqual(m.rechargeAt);
    expect(result.brownoutAt).toEqual(m.brownoutAt);
    expect(result.state).toBe(result.margin >= 1.5 ? 'steady' : result.margin >= 1 ? 'thin' : 'short');
    expect(evaluateNode({ bank, converter, load, site, volts: 5.4, at }).state).toBe('steady');
  });

  it('uses per-organization thresholds', () => {
    const full = evaluateNode({ bank, converter, load, site, volts: 5.4, at });
    const strict = evaluateNode({ bank, converter, load, site, volts: 5.4, at, thresholds: { steady: full.margin + 1, thin: full.margin - 0.1 } });
    expect(strict.state).toBe('thin');
  });

  it('credits no energy above the rated maximum (common practice: a bank is never charged past ns·Vr)', () => {
    // 2 series cells of 2.7 V: rated 5.4 V. A 9.5 V reading is a fault, not a fuller bank.
    const rated = evaluateNode({ bank, converter, load, site, volts: 5.4, at });
    const over = evaluateNode({ bank, converter, load, site, volts: 9.5, at });
    expect(over.reserveJoules).toBeCloseTo(rated.reserveJoules, 9);
    expect(over.margin).toBeCloseTo(rated.margin, 9);
    expect(over.usableJoules).toBeCloseTo(rated.usableJoules, 9);
    expect(over.loadWatts).toBeCloseTo(rated.loadWatts, 15);
    expect(over.soc).toBe(1);
    // The cautions keep the reading as it is: energy ½CV² and the short-circuit current V/ESR.
    expect(over.energyJoules).toBeCloseTo(0.5 * 150 * 9.5 ** 2, 9);
    expect(over.shortCircuitAmps).toBeCloseTo(9.5 / ((2 * 0.02) / 3), 9);
  });

  it('projects with the measured draw when asked: k times the draw gives 1/k the margin (derived here)', () => {
    // No leakage and a constant efficiency: the bank-side power is the same at every voltage, so
    // over a window without brownout the draw is P·T and k·P·T with the scale (margin ∝ 1/k).
    const flat = { ...bank, cellLeakageAmps: 0 };
    const plain = evaluateNode({ bank: flat, converter, load, site, volts: 5.4, at });
    const twice = evaluateNode({ bank: flat, converter, load, site, volts: 5.4, at, drawScale: 2 });
    expect(plain.brownoutAt).toBeNull();
    expect(twice.brownoutAt).toBeNull();
    expect(twice.margin).toBeCloseTo(plain.margin / 2, 6);
    expect(evaluateNode({ bank: flat, converter, load, site, volts: 5.4, at, drawScale: 1 })).toEqual(plain);
    // Low in the bank, a larger draw brings the brownout sooner.
    const low = evaluateNode({ bank, converter, load, site, volts: 1.5, at });
    const lowTwice = evaluateNode({ bank, converter, load, site, volts: 1.5, at, drawScale: 2 });
    expect(lowTwice.brownoutAt!.getTime()).toBeLessThan(low.brownoutAt!.getTime());
  });

  it('uses the measured draw only when it is over 1.3 times the model (the draw-anomaly line)', () => {
    expect(drawScaleFrom({ measuredWatts: 0.0024, modelledWatts: 0.002 })).toBe(1); // 1.2×
    expect(drawScaleFrom({ measuredWatts: 0.00534, modelledWatts: 0.002 })).toBeCloseTo(2.67, 9);
    expect(drawScaleFrom({ measuredWatts: null, modelledWatts: 0.002 })).toBe(1);
    expect(drawScaleFrom({ measuredWatts: 0.003, modelledWatts: 0 })).toBe(1);
    expect(drawScaleFrom({ measuredWatts: 1, modelledWatts: 0.001 })).toBe(20); // capped
  });
});
