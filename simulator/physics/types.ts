// Specifications of one simulated node. SI units throughout (volts, amps, farads, ohms, seconds).

export interface SimSite {
  latDeg: number;
  lonDeg: number;
  timeZone: string;
  /** Mean air temperature over a day, °C, and half the day-night swing. */
  meanTempC?: number;
  tempSwingC?: number;
  /** Terrain horizon, degrees of true elevation: below it the panel gets no sun (a ridge or a road cut). */
  horizonDeg?: number;
  /** The owner's setting for when charge starts (the product's site field), for the simulator's own margin reckoning. */
  rechargeElevationDeg?: number;
}

export interface SimBank {
  cellsSeries: number;
  cellsParallel: number;
  cellFarads: number;
  cellRatedVolts: number;
  cellEsrOhms: number;
  /** Leakage current of one cell at its rated voltage. */
  cellLeakageAmps: number;
}

/** Efficiency as one number or a table of [input volts, efficiency] rows, interpolated. */
export type EfficiencySpec = number | [number, number][];

export interface SimConverter {
  startVolts: number;
  cutoffVolts: number;
  outputVolts: number;
  efficiency: EfficiencySpec;
  inputLimitAmps: number;
}

/** Load currents are at the converter output (outputVolts). */
export interface SimLoad {
  sleepAmps: number;
  awakeSeconds: number;
  awakeAmps: number;
  burstSeconds: number;
  burstAmps: number;
  intervalSeconds: number;
  maxIntervalSeconds: number;
}

export interface SimPanel {
  /** Electrical watts at 1000 W/m². */
  ratedWatts: number;
  nominalVolts: number;
  openCircuitVolts: number;
}

export interface SimCharger {
  efficiency: number;
  chargeLimitAmps: number;
  /** Charge stops here; default cellsSeries × cellRatedVolts × 0.96 (kept below the 98 % over-voltage alert, as chargers are set in practice). */
  chargeVolts?: number;
}

/** Physical faults the database does not know about: the simulator's hidden truth. */
export interface SimFaults {
  /** Remaining fraction of nominal capacitance (ageing). */
  capacitanceFactor: number;
  /** Multiplies the nominal leakage current. */
  leakageFactor: number;
  shadingFactor: number;
  dirtFactor: number;
  /** From this instant the panel gives nothing (buried in snow, cable cut). */
  panelLostFrom: Date | null;
  /** From this instant firmware never sleeps: it draws stuckAwakeAmps between reports. */
  stuckAwakeFrom: Date | null;
  stuckAwakeAmps: number | null;
  /** From this instant nothing the node sends arrives (it keeps running and transmitting). */
  linkFaultFrom: Date | null;
}

export interface SimNodeSpec {
  slug: string;
  site: SimSite;
  bank: SimBank;
  converter: SimConverter;
  load: SimLoad;
  panel: SimPanel;
  charger: SimCharger;
  faults?: Partial<SimFaults>;
  /** Voltage calibration the server applies: true = gain × raw + offset. */
  calibration?: { gain: number; offsetVolts: number };
  rssiDbm?: number;
}

/** One reading as the device would post it (DESIGN.md §5 field names). */
export interface SimReading {
  t: Date;
  v: number;
  vp: number;
  temp: number;
  rssi: number;
  seq: number;
}

export interface SimNodeState {
  at: Date;
  volts: number;
  running: boolean;
  seq: number;
  brownouts: number;
  restarts: number;
  /** Reports sent while the link was broken (energy spent, nothing arrived). */
  undelivered: number;
  nextReportAt: Date;
  intervalSeconds: number;
}

export const DEFAULT_FAULTS: SimFaults = {
  capacitanceFactor: 1,
  leakageFactor: 1,
  shadingFactor: 1,
  dirtFactor: 1,
  panelLostFrom: null,
  stuckAwakeFrom: null,
  stuckAwakeAmps: null,
  linkFaultFrom: null,
};
