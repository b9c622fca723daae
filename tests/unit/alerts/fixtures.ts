// Invented test node and site for the alert rules (no real product).
import type { DerivedStatus } from '@/lib/status/derive-status';
import type { NodeModelSpec } from '@/lib/status/node-spec';

/** 2 × 25 F / 2.7 V in series (12.5 F, 5.4 V max), a 3.3 V boost, a 10-minute cadence. */
export const spec: NodeModelSpec = {
  bank: { cellsSeries: 2, cellsParallel: 1, cellFarads: 25, cellRatedVolts: 2.7, cellEsrOhms: 0.03, cellLeakageAmps: 12e-6 },
  converter: { startVolts: 0.8, cutoffVolts: 0.5, outputVolts: 3.3, efficiency: 0.85, inputLimitAmps: 1.8 },
  load: { sleepAmps: 10e-6, awakeSeconds: 2, awakeAmps: 0.08, burstSeconds: 1, burstAmps: 0.22, intervalSeconds: 600, maxIntervalSeconds: 3600 },
  // A fictional valley near 47° N, 120.5° W.
  site: { lat: 47.06, lon: -120.5, rechargeElevationDeg: 3 },
};
export const BANK_FARADS = 12.5;
export const MAX_VOLTS = 5.4;

export function statusWith(over: Partial<DerivedStatus>): DerivedStatus {
  return {
    state: 'steady', last_reading_at: new Date('2026-11-20T04:00:00Z'), volts: 4.5, panel_volts: null, energy_joules: 100, soc: 0.7,
    burst_floor_volts: 1, reserve_joules: 90, margin: 2, load_watts: 0.003, recharge_at: new Date('2026-11-20T15:30:00Z'),
    brownout_at: null, next_report_s: 600, evaluated_at: new Date('2026-11-20T04:00:00Z'), ...over,
  };
}

/** Readings of a bank drawing constant power P: V(t) = sqrt(V0² − 2·P·t/C) (derived here from E = ½CV²). */
export function constantPowerSamples({ from, to, stepSeconds, v0, watts, panelVolts }: { from: Date; to: Date; stepSeconds: number; v0: number; watts: number; panelVolts?: number }) {
  const out = [];
  for (let t = from.getTime(), i = 0; t <= to.getTime(); t += stepSeconds * 1000, i++) {
    const volts = Math.sqrt(Math.max(0, v0 ** 2 - (2 * watts * i * stepSeconds) / BANK_FARADS));
    out.push({ t: new Date(t), volts, ...(panelVolts === undefined ? {} : { panelVolts }) });
  }
  return out;
}
