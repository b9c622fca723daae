import { describe, expect, it } from 'vitest';
import { averageOutputWatts, bankWatts, nightWindows } from '@/lib/energy';
import { assessLatestDay } from '@/lib/alerts/day-charge';
import { measureLatestNight } from '@/lib/alerts/night-draw';
import { constantPowerSamples, spec } from './fixtures';

// 20:00 PST on 19 Nov 2026 at the fixture site: night since late afternoon (sun below +3°).
const now = new Date('2026-11-20T04:00:00Z');
const [previousNight, tonight] = nightWindows({ site: spec.site, from: new Date(now.getTime() - 36 * 3_600_000), to: now }).slice(-2);

describe('the latest night draw', () => {
  it('takes tonight once it is two hours old and recovers a known constant draw (½CV² slope, derived here)', () => {
    const samples = constantPowerSamples({ from: tonight.start, to: now, stepSeconds: 600, v0: 4.8, watts: 0.006 });
    const night = measureLatestNight({ spec, samples, now })!;
    expect(night.startAt.getTime()).toBe(tonight.start.getTime());
    expect(night.measuredWatts).toBeCloseTo(0.006, 6);
    // The model's bank-side draw at 600 s, averaged over the readings' voltages (η constant 0.85).
    const out = averageOutputWatts({ load: spec.load, outputVolts: 3.3 });
    const meanVolts = samples.reduce((s, x) => s + x.volts, 0) / samples.length;
    expect(night.modelledWatts).toBeCloseTo(bankWatts({ outputWatts: out, efficiency: 0.85, leakageAmps: 12e-6, volts: meanVolts }), 9);
    expect(night.ratio).toBeCloseTo(0.006 / night.modelledWatts, 6);
  });

  it('falls back to the previous complete night when tonight is too young, and models the cadence seen', () => {
    const early = new Date(tonight.start.getTime() + 3_600_000);
    const samples = constantPowerSamples({ from: previousNight.start, to: previousNight.end, stepSeconds: 1800, v0: 5, watts: 0.002 });
    const night = measureLatestNight({ spec, samples, now: early })!;
    expect(night.startAt.getTime()).toBe(previousNight.start.getTime());
    // Readings every 1800 s: the modelled draw is the one at a 1800 s interval, not the configured 600 s.
    const out1800 = averageOutputWatts({ load: spec.load, outputVolts: 3.3, intervalSeconds: 1800 });
    expect(night.modelledWatts).toBeLessThan(bankWatts({ outputWatts: out1800, efficiency: 0.85, leakageAmps: 12e-6, volts: 5 }) * 1.0001);
    expect(night.measuredWatts).toBeCloseTo(0.002, 6);
  });

  it('needs at least an hour of readings', () => {
    const samples = constantPowerSamples({ from: tonight.start, to: new Date(tonight.start.getTime() + 40 * 60_000), stepSeconds: 300, v0: 4, watts: 0.003 });
    expect(measureLatestNight({ spec, samples, now })).toBeNull();
  });
});

describe('the latest complete day', () => {
  const day = { start: previousNight.end, end: tonight.start };
  it('with high panel volts and a falling bank is a clear day without gain', () => {
    const samples = constantPowerSamples({ from: day.start, to: day.end, stepSeconds: 600, v0: 3, watts: 0.002, panelVolts: 6.2 });
    const result = assessLatestDay({ spec, samples, now })!;
    expect(result.startAt.getTime()).toBe(day.start.getTime());
    expect(result).toMatchObject({ clearSky: true, skyEvidence: 'panel_volts', gained: false, nearFull: false });
  });

  it('a bank that climbed by more than 2 % of its usable energy gained', () => {
    const samples = constantPowerSamples({ from: day.start, to: day.end, stepSeconds: 600, v0: 3, watts: -0.004, panelVolts: 6.2 });
    const result = assessLatestDay({ spec, samples, now })!;
    // 0.004 W over the ~8.5 h day ≈ 120 J ≫ 2 % of ½·12.5·(5.4² − 0.5²) ≈ 3.6 J (derived here).
    expect(result.gained).toBe(true);
    expect(result.gainJoules).toBeGreaterThan(100);
  });

  it('low panel volts all day is not a clear day', () => {
    const samples = constantPowerSamples({ from: day.start, to: day.end, stepSeconds: 600, v0: 3, watts: 0.002, panelVolts: 0.4 })
      .map((s, i) => (i === 0 ? { ...s, panelVolts: 6.3 } : s));
    expect(assessLatestDay({ spec, samples, now })!.clearSky).toBe(false);
  });
});
