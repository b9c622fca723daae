import * as SunCalc from 'suncalc';

// Sun position from suncalc (Meeus' algorithms). Note: suncalc v2 returns degrees, not radians.

/** Apparent sun elevation above the horizon, in radians (negative below it). */
export function getSunElevationRadians({ at, latDeg, lonDeg }: { at: Date; latDeg: number; lonDeg: number }): number {
  return (SunCalc.getPosition(at, latDeg, lonDeg).altitude * Math.PI) / 180;
}

/**
 * Clear-sky irradiance on a horizontal panel, W/m², as a simple function of elevation.
 * 1000 W/m² × sin(e)^1.15: the exponent above 1 stands for the longer air path at low sun
 * (a common practice approximation; not a published clear-sky model).
 */
export function getClearSkyIrradiance({ elevationRadians }: { elevationRadians: number }): number {
  if (elevationRadians <= 0) return 0;
  return 1000 * Math.pow(Math.sin(elevationRadians), 1.15);
}

/**
 * Panel terminal volts under light: open-circuit voltage falls with the log of irradiance
 * (diode law; common practice), and is 0 in the dark.
 */
export function getPanelVolts({ irradiance, openCircuitVolts }: { irradiance: number; openCircuitVolts: number }): number {
  if (irradiance < 0.5) return 0;
  return Math.max(0, openCircuitVolts * (1 + 0.05 * Math.log(Math.min(irradiance, 1200) / 1000)));
}

/** Next sunrise after `from` (sun centre at −0.833°, suncalc's definition), or null in polar night. */
export function getNextSunrise({ from, latDeg, lonDeg }: { from: Date; latDeg: number; lonDeg: number }): Date | null {
  for (let dayOffset = -1; dayOffset <= 2; dayOffset += 1) {
    const probe = new Date(from.getTime() + dayOffset * 86_400_000);
    const sunrise = SunCalc.getTimes(probe, latDeg, lonDeg).sunrise;
    if (sunrise && sunrise.getTime() > from.getTime()) return sunrise;
  }
  return null;
}

/**
 * Atmospheric refraction for a true altitude, in degrees: Sæmundsson's formula,
 * R = 1.02′ / tan(h + 10.3 / (h + 5.11)) with h in degrees (Meeus, Astronomical Algorithms,
 * 2nd ed., eq. 16.4), for standard pressure and temperature.
 */
export function getRefractionDegrees(trueAltitudeDeg: number): number {
  const h = Math.max(trueAltitudeDeg, -1);
  return 1.02 / Math.tan(((h + 10.3 / (h + 5.11)) * Math.PI) / 180) / 60;
}

/**
 * First minute after `from` at which the sun, rising, reaches the true elevation
 * `elevationDeg` (compared as apparent elevation, which is what suncalc returns), or null
 * within two days (polar night). A one-minute scan: the demo's tuning needs no finer time
 * than its one-minute physics step.
 */
export function getNextRisingThrough({ from, latDeg, lonDeg, elevationDeg }: { from: Date; latDeg: number; lonDeg: number; elevationDeg: number }): Date | null {
  const target = ((elevationDeg + getRefractionDegrees(elevationDeg)) * Math.PI) / 180;
  let below = getSunElevationRadians({ at: from, latDeg, lonDeg }) < target;
  for (let ms = from.getTime() + 60_000; ms <= from.getTime() + 2 * 86_400_000; ms += 60_000) {
    const at = new Date(ms);
    const nowBelow = getSunElevationRadians({ at, latDeg, lonDeg }) < target;
    if (below && !nowBelow) return at;
    below = nowBelow;
  }
  return null;
}
