import type { SimBank, SimCharger, SimConverter, SimLoad, SimPanel } from '../physics/types';

// Invented but plausible parts for the demo (REFERENCES.md "Orders of magnitude": Wi-Fi module
// sleep 5–20 µA, transmit 120–250 mA, a wake-connect-send cycle of 1–3 s).

export const CELL_100F = { cellFarads: 100, cellRatedVolts: 2.7, cellEsrOhms: 0.015, cellLeakageAmps: 40e-6 };
export const CELL_50F = { cellFarads: 50, cellRatedVolts: 2.7, cellEsrOhms: 0.02, cellLeakageAmps: 20e-6 };
export const CELL_25F = { cellFarads: 25, cellRatedVolts: 2.7, cellEsrOhms: 0.03, cellLeakageAmps: 12e-6 };
export const CELL_10F = { cellFarads: 10, cellRatedVolts: 2.7, cellEsrOhms: 0.075, cellLeakageAmps: 6e-6 };

type Cell = typeof CELL_100F;

export function makeBank({ cell, series = 2, parallel = 1 }: { cell: Cell; series?: number; parallel?: number }): SimBank {
  return { cellsSeries: series, cellsParallel: parallel, ...cell };
}

export const BOOST_3V3: SimConverter = {
  startVolts: 0.8,
  cutoffVolts: 0.5,
  outputVolts: 3.3,
  efficiency: [[0.5, 0.6], [1, 0.75], [2, 0.85], [5, 0.9]],
  inputLimitAmps: 1.8,
};

export function makeLoad(overrides: Partial<SimLoad> = {}): SimLoad {
  return {
    sleepAmps: 10e-6, awakeSeconds: 2, awakeAmps: 0.08, burstSeconds: 1, burstAmps: 0.22,
    intervalSeconds: 600, maxIntervalSeconds: 3600, ...overrides,
  };
}

export function makePanel(ratedWatts: number): SimPanel {
  return { ratedWatts, nominalVolts: 6, openCircuitVolts: 6.5 };
}

export const CHARGER: SimCharger = { efficiency: 0.8, chargeLimitAmps: 0.5 };
