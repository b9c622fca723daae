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
