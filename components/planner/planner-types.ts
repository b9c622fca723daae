/** The reply of POST /api/v1/planner (documented in lib/schemas/planner.ts). */
export interface PlannerReply {
  cells_parallel: number | null;
  bank: { cells_series: number; cells_parallel: number; cell_farads: number; cell_rated_volts: number; cell_esr_ohms: number; cell_leakage_amps: number };
  bank_farads: number;
  bank_max_volts: number;
  bank_esr_ohms: number;
  energy_full_joules: number;
  burst_floor_volts: number;
  night_start: string | null;
  night_seconds: number;
  window_seconds: number;
  night_draw_joules: number;
  margin: number | null;
  panel_charge_seconds: number;
  cc_charge_seconds: number;
  discharge_curve: [number, number][];
  /** Set when no cell count can finish one burst: the converter's input current from a full ideal bank exceeds its limit. */
  burst_blocked: { input_amps: number; limit_amps: number; full_volts: number } | null;
  /** The planned bank's current into a dead short at full charge, V_full ÷ ESR. */
  short_circuit_amps: number | null;
}

export interface PlannerSite {
  id: number;
  name: string;
  lat: number;
  lon: number;
  time_zone: string;
  recharge_elevation_deg: number;
}
