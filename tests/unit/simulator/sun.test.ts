import * as SunCalc from 'suncalc';
import { describe, expect, it } from 'vitest';
import { getClearSkyIrradiance, getNextSunrise, getPanelVolts, getSunElevationRadians } from '../../../simulator/physics/sun';

const DEG = Math.PI / 180;

describe('sun', () => {
  it('finds the published sunrise for Kyiv on 2026-06-21 within 2 minutes', () => {
    // REFERENCES.md (US Naval Observatory data): Kyiv 50.45466 N 30.5238 E, sunrise 01:46 UTC.
    const sunrise = getNextSunrise({ from: new Date('2026-06-20T22:00:00Z'), latDeg: 50.45466, lonDeg: 30.5238 });
    const published = Date.UTC(2026, 5, 21, 1, 46);
    expect(Math.abs(sunrise!.getTime() - published)).toBeLessThanOrEqual(2 * 60_000);
  });

  it('puts the winter noon sun at 90° − latitude + declination', () => {
    // Derived here; declination on 1 December ≈ −21.8° (from memory). Allow 0.5°.
    const noon = SunCalc.getTimes(new Date('2026-12-01T20:00:00Z'), 47.1, -120.5).solarNoon;
    const elevationDeg = getSunElevationRadians({ at: noon, latDeg: 47.1, lonDeg: -120.5 }) / DEG;
    expect(Math.abs(elevationDeg - (90 - 47.1 - 21.8))).toBeLessThan(0.5);
  });

  it('gives no light at night and rises with elevation', () => {
    expect(getClearSkyIrradiance({ elevationRadians: -0.1 })).toBe(0);
    expect(getClearSkyIrradiance({ elevationRadians: Math.PI / 2 })).toBeCloseTo(1000, 6);
    const low = getClearSkyIrradiance({ elevationRadians: 10 * DEG });
    const high = getClearSkyIrradiance({ elevationRadians: 20 * DEG });
    expect(high).toBeGreaterThan(low);
    // The air-mass exponent keeps low sun below the plain cosine law (sin e · 1000 W/m²).
    expect(low).toBeLessThan(1000 * Math.sin(10 * DEG));
  });

  it('reads panel volts 0 in the dark and up to the open-circuit volts in full sun', () => {
    expect(getPanelVolts({ irradiance: 0, openCircuitVolts: 6.5 })).toBe(0);
    expect(getPanelVolts({ irradiance: 1000, openCircuitVolts: 6.5 })).toBeCloseTo(6.5, 9);
    expect(getPanelVolts({ irradiance: 100, openCircuitVolts: 6.5 })).toBeLessThan(6.5);
  });
});
