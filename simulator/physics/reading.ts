import { getPanelVolts } from './sun';
import type { SimNodeSpec, SimReading } from './types';

// What the device posts at a report: its own (raw) bank voltage, panel volts, temperature, RSSI.

export function makeSimReading({ spec, at, restingVolts, seq, irradiance, random }: {
  spec: SimNodeSpec; at: Date; restingVolts: number; seq: number; irradiance: number; random: () => number;
}): SimReading {
  const { site, panel, calibration, rssiDbm } = spec;
  const measured = restingVolts + (random() * 2 - 1) * 0.002;
  // The device posts raw volts; the server's calibration (true = gain·raw + offset) undoes this.
  const raw = calibration ? (measured - calibration.offsetVolts) / calibration.gain : measured;
  // Air temperature peaks mid-afternoon solar time (common practice for a daily cycle).
  const solarHour = ((at.getTime() / 3_600_000 + site.lonDeg / 15) % 24 + 24) % 24;
  const temp = (site.meanTempC ?? 0) + (site.tempSwingC ?? 4) * Math.cos((2 * Math.PI * (solarHour - 15)) / 24)
    + (random() - 0.5) * 0.6;
  const vp = getPanelVolts({ irradiance, openCircuitVolts: panel.openCircuitVolts });
  return {
    t: at,
    v: Math.round(raw * 1000) / 1000,
    vp: Math.round(vp * 100) / 100,
    temp: Math.round(temp * 10) / 10,
    rssi: Math.round((rssiDbm ?? -70) + (random() - 0.5) * 6),
    seq,
  };
}
