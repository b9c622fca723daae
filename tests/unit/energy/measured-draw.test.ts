import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { fitEnergySlope, harvestWatts, measuredVsModelled, selectChargingSamples, selectNoChargeSamples } from '@/lib/energy';
import type { VoltageSample } from '@/lib/energy';
import { site } from './fixtures';

// Synthetic readings of a bank drawing constant power: V(t) = sqrt(V0² − 2·P·t/C) (derived here).
function constantPowerLog({ farads, watts, v0, count, stepSeconds }: { farads: number; watts: number; v0: number; count: number; stepSeconds: number }): VoltageSample[] {
  const t0 = Date.parse('2026-12-21T17:00:00Z');
  return Array.from({ length: count }, (_, i) => ({
    t: t0 + i * stepSeconds * 1000,
    volts: Math.sqrt(v0 ** 2 - (2 * watts * i * stepSeconds) / farads),
  }));
}

describe('measured draw', () => {
  it('recovers a constant draw exactly, with r² = 1', () => {
    const samples = constantPowerLog({ farads: 150, watts: 0.006, v0: 5, count: 100, stepSeconds: 300 });
    const fit = fitEnergySlope({ samples, bankFarads: 150 })!;
    expect(fit.watts).toBeCloseTo(0.006, 9);
    expect(fit.r2).toBeCloseTo(1, 9);
    expect(fit.points).toBe(100);
  });

  it('is robust to a few outliers and to gaps', () => {
    const samples = constantPowerLog({ farads: 150, watts: 0.006, v0: 5, count: 120, stepSeconds: 300 })
      .filter((_, i) => i < 30 || i > 60) // a 2.5-hour gap
      .map((s, i) => (i % 25 === 7 ? { ...s, volts: s.volts + 0.4 } : s)); // spikes
    const fit = fitEnergySlope({ samples, bankFarads: 150 })!;
    expect(fit.trimmed).toBeGreaterThanOrEqual(3);
    expect(fit.watts / 0.006).toBeCloseTo(1, 3);
  });

  it('recovers the draw through noise (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 0.05, noNaN: true }), fc.integer({ min: 1, max: 1_000_000 }), (watts, seed) => {
        let state = seed;
        const noise = () => ((state = (state * 1103515245 + 12345) % 2 ** 31) / 2 ** 31 - 0.5) * 2e-3; // ±1 mV
        const samples = constantPowerLog({ farads: 300, watts, v0: 5.2, count: 150, stepSeconds: 300 }).map((s) => ({ ...s, volts: s.volts + noise() }));
        const fit = fitEnergySlope({ samples, bankFarads: 300 })!;
        return Math.abs(fit.watts / watts - 1) < 0.05;
      }),
      { numRuns: 50 },
    );
  });

  it('refuses a fit with too few readings', () => {
    expect(fitEnergySlope({ samples: constantPowerLog({ farads: 1, watts: 0.01, v0: 2, count: 2, stepSeconds: 60 }), bankFarads: 1 })).toBeNull();
  });

  it('harvest is positive while charging; the ratio compares measured with modelled', () => {
    const charging = constantPowerLog({ farads: 150, watts: -0.5, v0: 2, count: 50, stepSeconds: 60 });
    expect(harvestWatts({ samples: charging, bankFarads: 150 })!.watts).toBeCloseTo(0.5, 9);
    expect(measuredVsModelled({ measuredWatts: 0.009, modelledWatts: 0.006 })).toBeCloseTo(1.5, 12);
  });

  it('keeps the readings with no charge: panel volts when reported, else the sun', () => {
    const samples: VoltageSample[] = [
      { t: new Date('2026-12-21T23:00:00Z'), volts: 4 }, // night, no panel reading
      { t: new Date('2026-12-21T11:00:00Z'), volts: 4 }, // day, no panel reading
      { t: new Date('2026-12-21T11:05:00Z'), volts: 4, panelVolts: 0.3 }, // day but shaded panel
      { t: new Date('2026-12-21T11:10:00Z'), volts: 4, panelVolts: 5.5 },
    ];
    const kept = selectNoChargeSamples({ samples, site, panelVoltsThreshold: 1 });
    expect(kept.map((s) => s.panelVolts)).toEqual([undefined, 0.3]);
    const charging = selectChargingSamples({ samples, site, panelVoltsThreshold: 1 });
    expect(charging.map((s) => s.panelVolts)).toEqual([undefined, 5.5]);
  });
});
