/**
 * Reply shapes of the node page's API (series, nights, status). Every instant is Unix seconds
 * (a number), stated once per reply as `time_unit: "s"`; volts are calibrated bank volts
 * unless named panel; energy in joules, power in watts.
 */
export interface SeriesColumns {
  /** Bucket starts. */
  t: number[];
  n: number[];
  v_min: number[];
  v_mean: number[];
  v_max: number[];
  v_last: number[];
  t_last: number[];
  /** Highest panel volts in the bucket; null where the node reported none. */
  vp_max: (number | null)[];
  energy_min_joules: number[];
  energy_mean_joules: number[];
  energy_max_joules: number[];
  reserve_min_joules: number[];
  reserve_mean_joules: number[];
  reserve_max_joules: number[];
}

export interface NightSpan {
  start: number;
  end: number;
}

export interface ProjectionWire {
  /** The latest reading the projection starts from. */
  from_at: number;
  t: number[];
  volts: number[];
  energy_joules: number[];
  reserve_joules: number[];
  recharge_at: number | null;
  brownout_at: number | null;
  /** "recharge": the trace reaches the recharge instant; "brownout": it stops at the burst floor first. */
  ends_at: 'recharge' | 'brownout';
}

export interface BankFigures {
  farads: number;
  max_volts: number;
  cutoff_volts: number;
  start_volts: number;
  burst_floor_volts: number;
  energy_full_joules: number;
}

export interface SeriesReply {
  time_unit: 's';
  node_id: number;
  time_zone: string;
  from: number;
  to: number;
  bucket_seconds: number;
  source: 'raw' | 'rollup-300' | 'rollup-3600';
  count: number;
  buckets: SeriesColumns;
  has_panel: boolean;
  nights: NightSpan[];
  bank: BankFigures;
  projection: ProjectionWire | null;
}

export interface MeasuredDrawWire {
  watts: number;
  modelled_watts: number;
  ratio: number | null;
  night_start_at: number;
  night_end_at: number;
}

export interface StatusReply {
  time_unit: 's';
  node: { id: number; name: string; purpose: string; site_id: number; site_name: string; time_zone: string };
  state: 'steady' | 'thin' | 'short' | 'dark' | 'silent' | 'new';
  last_reading_at: number | null;
  volts: number | null;
  panel_volts: number | null;
  energy_joules: number | null;
  soc: number | null;
  reserve_joules: number | null;
  margin: number | null;
  load_watts: number | null;
  recharge_at: number | null;
  brownout_at: number | null;
  /**
   * At the latest reading the sun was above the site's recharge elevation: the bank was charging,
   * and the margin counts from `charging_until` (that day's dusk; null in polar day).
   */
  charging: boolean;
  charging_until: number | null;
  next_report_s: number | null;
  evaluated_at: number;
  bank: BankFigures;
  measured: MeasuredDrawWire | null;
  /** The factor the margin, brownout and projection were worked out with: measured ÷ modelled draw when over 1.3, else 1. */
  draw_scale: number;
  projection: ProjectionWire | null;
}

export interface NightRowWire {
  dusk_at: number;
  dawn_at: number;
  /** False for tonight, while it is still dark. */
  complete: boolean;
  readings: number;
  dusk_reading_at: number | null;
  dawn_reading_at: number | null;
  dusk_volts: number | null;
  dawn_volts: number | null;
  dusk_energy_joules: number | null;
  dawn_energy_joules: number | null;
  min_volts: number | null;
  measured_watts: number | null;
  modelled_watts: number | null;
  draw_ratio: number | null;
  /** The model's night margin from the dusk reading to this dawn, at margin_draw_scale × the modelled draw. */
  margin_at_dusk: number | null;
  /** 1: the plain model; above 1: the night before's measured draw, as the live status projects. */
  margin_draw_scale: number;
  projected_brownout_at: number | null;
  /** The last reading before the node fell silent inside the night (over 3 report intervals), or null. */
  quiet_from: number | null;
  /** The bank volts at that last reading (near the burst floor: a brownout; else a silence). */
  quiet_volts: number | null;
}

export interface NightsReply {
  time_unit: 's';
  node_id: number;
  node_name: string;
  time_zone: string;
  burst_floor_volts: number;
  /** The bank's rated maximum, ns·Vr. */
  max_volts: number;
  nights: NightRowWire[];
}
