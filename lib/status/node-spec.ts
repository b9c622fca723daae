import type { BankSpec, ConverterSpec, LoadSpec, SiteSpec } from '../energy';

/** A node's model inputs as stored (snake_case rows of `nodes` and `sites`). */
export interface NodeRow {
  id: number;
  org_id: number;
  site_id: number;
  name: string;
  cells_series: number;
  cells_parallel: number;
  cell_farads: number;
  cell_rated_volts: number;
  cell_esr_ohms: number;
  cell_leakage_amps: number;
  start_volts: number;
  cutoff_volts: number;
  output_volts: number;
  efficiency: unknown; // JSON: number or [[volts, eta], ...]
  input_limit_amps: number;
  sleep_amps: number;
  awake_seconds: number;
  awake_amps: number;
  burst_seconds: number;
  burst_amps: number;
  interval_seconds: number;
  max_interval_seconds: number;
  cal_gain: number;
  cal_offset_volts: number;
}

export interface SiteRow {
  id: number;
  lat: number;
  lon: number;
  time_zone: string;
  recharge_elevation_deg: number;
}

/** The columns the model reads (what a node row holds besides its identity). */
export type NodeModelRow = Omit<NodeRow, 'id' | 'org_id' | 'site_id' | 'name'>;
export type SiteModelRow = Pick<SiteRow, 'lat' | 'lon' | 'recharge_elevation_deg'>;

export interface NodeModelSpec {
  bank: BankSpec;
  converter: ConverterSpec;
  load: LoadSpec;
  site: SiteSpec;
}

function parseEfficiency(value: unknown): ConverterSpec['efficiency'] {
  const parsed = typeof value === 'string' ? JSON.parse(value) : value;
  if (typeof parsed === 'number') return parsed;
  if (Array.isArray(parsed)) return parsed.map((p) => [Number(p[0]), Number(p[1])] as [number, number]);
  throw new Error('efficiency must be a number or a table');
}

export function modelSpecFromRows(node: NodeModelRow, site: SiteModelRow): NodeModelSpec {
  return {
    bank: {
      cellsSeries: node.cells_series,
      cellsParallel: node.cells_parallel,
      cellFarads: node.cell_farads,
      cellRatedVolts: node.cell_rated_volts,
      cellEsrOhms: node.cell_esr_ohms,
      cellLeakageAmps: node.cell_leakage_amps,
    },
    converter: {
      startVolts: node.start_volts,
      cutoffVolts: node.cutoff_volts,
      outputVolts: node.output_volts,
      efficiency: parseEfficiency(node.efficiency),
      inputLimitAmps: node.input_limit_amps,
    },
    load: {
      sleepAmps: node.sleep_amps,
      awakeSeconds: node.awake_seconds,
      awakeAmps: node.awake_amps,
      burstSeconds: node.burst_seconds,
      burstAmps: node.burst_amps,
      intervalSeconds: node.interval_seconds,
      maxIntervalSeconds: node.max_interval_seconds,
    },
    site: { lat: site.lat, lon: site.lon, rechargeElevationDeg: site.recharge_elevation_deg },
  };
}

/** Reported volts → true bank volts, with the node's calibration. */
export function calibratedVolts(node: Pick<NodeRow, 'cal_gain' | 'cal_offset_volts'>, reportedVolts: number): number {
  return node.cal_gain * reportedVolts + node.cal_offset_volts;
}
