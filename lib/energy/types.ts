// Plain-object inputs of the energy model. SI units everywhere: volts, amps, farads, ohms,
// seconds, watts, joules; angles in degrees. Field names carry their unit.

/** A bank of identical cells: `cellsSeries` in each string, `cellsParallel` strings. */
export interface BankSpec {
  cellsSeries: number;
  cellsParallel: number;
  cellFarads: number;
  cellRatedVolts: number;
  cellEsrOhms: number;
  /** Leakage current of one cell (the maker's figure), treated as constant. */
  cellLeakageAmps: number;
}

/** A voltage (input volts, efficiency 0..1) point of a converter efficiency table. */
export type EfficiencyPoint = [volts: number, eta: number];

export interface ConverterSpec {
  /** After a brownout the node only returns once the bank climbs back to this. */
  startVolts: number;
  /** Below this input voltage the converter stops. */
  cutoffVolts: number;
  outputVolts: number;
  /** A constant, or a table over input volts (linear between points, flat beyond its ends). */
  efficiency: number | EfficiencyPoint[];
  inputLimitAmps: number;
}

/** One report cycle at the converter output. */
export interface LoadSpec {
  sleepAmps: number;
  awakeSeconds: number;
  awakeAmps: number;
  burstSeconds: number;
  burstAmps: number;
  intervalSeconds: number;
  maxIntervalSeconds: number;
}

export interface SiteSpec {
  lat: number;
  lon: number;
  /** Sun elevation (true altitude, degrees) above which the panel gives net charge; −0.833 is standard sunrise. */
  rechargeElevationDeg: number;
}

export interface StateThresholds {
  steady: number;
  thin: number;
}

export const DEFAULT_THRESHOLDS: StateThresholds = { steady: 1.5, thin: 1.0 };

export type MarginState = 'steady' | 'thin' | 'short';

/** Bank figures derived from a BankSpec. */
export interface BankModel {
  farads: number;
  maxVolts: number;
  esrOhms: number;
  leakageAmps: number;
}

/** Bank-side power drawn at a given bank voltage. */
export type BankWattsAt = (volts: number) => number;
