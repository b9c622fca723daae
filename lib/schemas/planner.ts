import { z } from 'zod';
import { bankSpec, checkNodeSpecs, modelBank, shortCircuitAmps, type BankPlan, type PlanInput } from '../energy';
import type { InvalidParam } from '../errors';
import {
  converterFromWire,
  converterSchema,
  loadFromWire,
  loadSchema,
  nonNegativeNumber,
  positiveNumber,
  siteFromWire,
  siteModelSchema,
  upTo,
} from './model';

/*
 * POST /api/v1/planner — how many cells in parallel a node needs (any signed-in member).
 *
 * Request (JSON, SI units, snake_case; `load`, `converter`, `site` are the shapes of
 * POST /api/v1/model/evaluate):
 *   load                 {sleep_amps, awake_seconds, awake_amps, burst_seconds, burst_amps,
 *                         interval_seconds, max_interval_seconds}
 *   converter            {start_volts, cutoff_volts, output_volts, efficiency (number or
 *                         [[volts, eta], ...]), input_limit_amps}
 *   cell                 {farads, rated_volts, esr_ohms, leakage_amps} — one cell
 *   cells_series         whole cells in each string (1–64)
 *   site                 {lat, lon, recharge_elevation_deg (default −0.833, standard sunrise)}
 *   date                 optional "YYYY-MM-DD": plan for the night that begins that evening at
 *                        the site; absent, the longest night of `year` there
 *   year                 optional (2000–2100), for the default; the current UTC year
 *   extra_days           whole days without sun after that night (0–30, default 0)
 *   target_margin        the margin to reach (> 0, default 1.5 — the "steady" threshold)
 *   panel_watts          rated panel power, W
 *   charger_efficiency   0–1, panel to bank
 *   sun_factor           0–1, the share of rated panel power expected while charging
 *   charger_amps         a constant-current charger's current, A
 *   max_cells_parallel   optional search limit (1–1000, default 1000)
 *
 * Reply 200:
 *   cells_parallel            smallest count reaching the target margin, or null if none up to
 *                             max_cells_parallel (the other figures are then for that maximum)
 *   bank                      the planned bank in the wire shape of a node's `bank` (cells_series,
 *                             cells_parallel, cell_farads, cell_rated_volts, cell_esr_ohms,
 *                             cell_leakage_amps), ready for POST /api/v1/nodes
 *   bank_farads, bank_max_volts, bank_esr_ohms   its combined figures
 *   energy_full_joules        ½·C·V_max²
 *   burst_floor_volts         lowest resting volts from which the transmit burst completes
 *   night_start               RFC 3339 sunset (through the recharge elevation) of the planned
 *                             night, or null on a day without sunset (polar day)
 *   night_seconds             its length (capped at 7 days in polar night)
 *   window_seconds            night + extra days: the span the bank must carry the node
 *   night_draw_joules         bank-side energy drawn over that window, starting full
 *   margin                    reserve at full ÷ that draw; null when nothing is drawn (infinite)
 *   panel_charge_seconds      cutoff → full from the panel: ½C(V_max² − V_cut²) ÷ (panel_watts ×
 *                             charger_efficiency × sun_factor), ignoring the node's own draw
 *   cc_charge_seconds         cutoff → full at constant current: C·(V_max − V_cut) ÷ charger_amps
 *   discharge_curve           [[seconds from sunset, bank volts], ...] from full over the
 *                             window, at most 300 points evenly spaced (the last one at the
 *                             window's end); it ends early where the bank reaches the burst floor;
 *                             empty when burst_blocked
 *   burst_blocked             null, or {input_amps, limit_amps, full_volts} when no cell count can
 *                             finish one transmit burst: from a full bank of ideal cells the
 *                             converter would draw input_amps = V_out·I_burst ÷ (η·V_full), over
 *                             its input limit
 *   short_circuit_amps        V_max ÷ ESR of the planned bank (null for ESR 0 Ω)
 * Bad input: 422 problem+json with a JSON pointer per bad field, e.g. /converter/cutoff_volts
 * when the cutoff is not below cells_series × cell.rated_volts.
 */

export const MAX_CURVE_POINTS = 300;

const cellSchema = z.object({
  farads: positiveNumber('F').max(100_000, upTo(100_000, 'F')),
  rated_volts: positiveNumber('V').max(10, upTo(10, 'V')),
  esr_ohms: nonNegativeNumber('Ω').max(100, upTo(100, 'Ω')),
  leakage_amps: nonNegativeNumber('A').max(1, upTo(1, 'A')),
}).strict();

export const plannerBody = z.object({
  load: loadSchema,
  converter: converterSchema,
  cell: cellSchema,
  cells_series: z.number().int('Whole cells only.').min(1, 'At least 1 cell.').max(64, 'At most 64 cells in series.'),
  site: siteModelSchema,
  date: z.iso.date({ message: 'Give a calendar date, e.g. 2026-12-21.' }).optional(),
  year: z.number().int().min(2000).max(2100).optional(),
  extra_days: z.number().int('Whole days.').min(0).max(30).default(0),
  target_margin: positiveNumber('×').max(100, upTo(100, '×')).default(1.5),
  panel_watts: positiveNumber('W').max(10_000, upTo(10_000, 'W')),
  charger_efficiency: positiveNumber('0..1').max(1, 'Must be at most 1.'),
  sun_factor: positiveNumber('0..1').max(1, 'Must be at most 1.'),
  charger_amps: positiveNumber('A').max(1000, upTo(1000, 'A')),
  max_cells_parallel: z.number().int().min(1).max(1000).default(1000),
}).strict();

export type PlannerBody = z.infer<typeof plannerBody>;

export function planInputFromWire(body: PlannerBody): PlanInput {
  const { cell } = body;
  return {
    load: loadFromWire(body.load),
    converter: converterFromWire(body.converter),
    cell: { farads: cell.farads, ratedVolts: cell.rated_volts, esrOhms: cell.esr_ohms, leakageAmps: cell.leakage_amps },
    cellsSeries: body.cells_series,
    site: siteFromWire(body.site),
    date: body.date ? new Date(`${body.date}T00:00:00Z`) : undefined,
    year: body.year,
    extraDays: body.extra_days,
    targetMargin: body.target_margin,
    panelWatts: body.panel_watts,
    chargerEfficiency: body.charger_efficiency,
    sunFactor: body.sun_factor,
    chargerAmps: body.charger_amps,
    maxCellsParallel: body.max_cells_parallel,
  };
}

// lib/energy checks a bank; the planner's bank is one cell type in strings of cells_series.
const BANK_POINTERS: Record<string, string> = {
  cellsSeries: '/cells_series',
  cellFarads: '/cell/farads',
  cellRatedVolts: '/cell/rated_volts',
  cellEsrOhms: '/cell/esr_ohms',
  cellLeakageAmps: '/cell/leakage_amps',
};
const snake = (name: string) => name.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);

export function planProblems(input: PlanInput): InvalidParam[] {
  const found = checkNodeSpecs({ bank: bankSpec(input, 1), converter: input.converter, load: input.load, site: input.site });
  return found.map((p) => ({
    pointer: p.path[0] === 'bank' ? (BANK_POINTERS[p.path[1]] ?? '/cell') : '/' + p.path.map(snake).join('/'),
    detail: p.message,
  }));
}

/** Curve spacing giving at most MAX_CURVE_POINTS points (the trace adds the window's end). */
export function curveStepSeconds(windowSeconds: number): number {
  return Math.max(60, Math.ceil(windowSeconds / (MAX_CURVE_POINTS - 2)));
}

export function planToWire(plan: BankPlan, input: PlanInput) {
  const spec = bankSpec(input, plan.evaluatedCellsParallel);
  const model = modelBank({ bank: spec });
  return {
    cells_parallel: plan.cellsParallel,
    bank: {
      cells_series: spec.cellsSeries,
      cells_parallel: spec.cellsParallel,
      cell_farads: spec.cellFarads,
      cell_rated_volts: spec.cellRatedVolts,
      cell_esr_ohms: spec.cellEsrOhms,
      cell_leakage_amps: spec.cellLeakageAmps,
    },
    bank_farads: model.farads,
    bank_max_volts: model.maxVolts,
    bank_esr_ohms: model.esrOhms,
    energy_full_joules: plan.energyFullJoules,
    burst_floor_volts: plan.burstFloorVolts,
    night_start: plan.nightStart ? plan.nightStart.toISOString() : null,
    night_seconds: plan.nightSeconds,
    window_seconds: plan.windowSeconds,
    night_draw_joules: plan.nightDrawJoules,
    margin: Number.isFinite(plan.margin) ? plan.margin : null,
    panel_charge_seconds: plan.panelChargeSeconds,
    cc_charge_seconds: plan.ccChargeSeconds,
    discharge_curve: plan.dischargeCurve.slice(0, MAX_CURVE_POINTS).map((p) => [p.t, p.volts]),
    burst_blocked: plan.burstBlocked
      ? { input_amps: plan.burstBlocked.inputAmps, limit_amps: plan.burstBlocked.limitAmps, full_volts: plan.burstBlocked.fullVolts }
      : null,
    // null for an ESR of 0 Ω (no finite figure: the caution still stands)
    short_circuit_amps: model.esrOhms > 0 ? shortCircuitAmps({ volts: model.maxVolts, esrOhms: model.esrOhms }) : null,
  };
}
