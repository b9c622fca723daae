import { describe, expect, it } from 'vitest';
import { simulateNode } from '../../../simulator/physics/simulate';
import { createWeather } from '../../../simulator/physics/weather';
import { makeTestSpec } from './fixtures';

const window = { from: new Date('2026-12-01T00:00:00Z'), to: new Date('2026-12-03T00:00:00Z'), dtSeconds: 60, initialVolts: 4 };

describe('determinism', () => {
  it('gives the same readings for the same seed and different noise for another', () => {
    const a = simulateNode(makeTestSpec(), { ...window, seed: 11 });
    const b = simulateNode(makeTestSpec(), { ...window, seed: 11 });
    const c = simulateNode(makeTestSpec(), { ...window, seed: 12 });
    expect(a.readings.length).toBeGreaterThan(200);
    expect(b.readings).toEqual(a.readings);
    expect(c.readings.map((r) => r.v)).not.toEqual(a.readings.map((r) => r.v));
  });

  it('gives the same sky whatever order the hours are asked in', () => {
    const hours = Array.from({ length: 24 * 30 }, (_, i) => new Date(Date.UTC(2026, 11, 1) + i * 3_600_000));
    const forward = createWeather({ seed: 4, lonDeg: -120 });
    const backward = createWeather({ seed: 4, lonDeg: -120 });
    const f = hours.map((h) => forward.getCloudFactor(h));
    const b = [...hours].reverse().map((h) => backward.getCloudFactor(h)).reverse();
    expect(b).toEqual(f);
    const kinds = new Set(hours.map((h) => forward.getSkyKind(h)));
    expect(kinds.size).toBeGreaterThan(1); // a month of Markov weather is not one kind of day
  });

  it('keeps the measurement noise within ±2 mV of the resting bank voltage', () => {
    // A bank so large that two days of load move it by far less than a millivolt.
    const spec = makeTestSpec({ bank: { ...makeTestSpec().bank, cellFarads: 1e8 } });
    const run = simulateNode(spec, { ...window, seed: 2, initialVolts: 4, noSun: true });
    expect(run.readings.length).toBeGreaterThan(200);
    for (const r of run.readings) expect(Math.abs(r.v - 4)).toBeLessThanOrEqual(0.0021) // ±2 mV plus rounding to 1 mV;
  });
});
