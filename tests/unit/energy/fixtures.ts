// Shared test inputs: an invented node, not any real product.
import type { BankSpec, ConverterSpec, LoadSpec, SiteSpec } from '@/lib/energy';

export const bank: BankSpec = {
  cellsSeries: 2,
  cellsParallel: 3,
  cellFarads: 100,
  cellRatedVolts: 2.7,
  cellEsrOhms: 0.02,
  cellLeakageAmps: 20e-6,
};

export const converter: ConverterSpec = {
  startVolts: 0.9,
  cutoffVolts: 0.5,
  outputVolts: 3.3,
  efficiency: 0.85,
  inputLimitAmps: 2,
};

export const load: LoadSpec = {
  sleepAmps: 10e-6,
  awakeSeconds: 2,
  awakeAmps: 0.08,
  burstSeconds: 1,
  burstAmps: 0.3,
  intervalSeconds: 300,
  maxIntervalSeconds: 3600,
};

/** A fictional valley near 47° N. */
export const site: SiteSpec = { lat: 47.1, lon: 8.3, rechargeElevationDeg: -0.833 };
