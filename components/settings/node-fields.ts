import type { NodeBody } from '@/lib/schemas/node';

/**
 * The node form's inputs, by their path in the wire body (the same path the server's 422
 * pointers name, so an error lands on its input). Small currents and resistances are typed in
 * µA, mA and mΩ, as datasheets give them and as the planner asks for them; the body the API
 * takes is SI (value × scale).
 */
export interface NumberInput {
  path: string;
  label: string;
  unit: string;
  /** SI value = typed value × scale (1 when the field is typed in SI). */
  scale?: number;
  hint?: string;
  whole?: boolean;
}

export const BANK_INPUTS: NumberInput[] = [
  { path: 'bank.cells_series', label: 'Cells in series', unit: 'cells', whole: true, hint: 'Each string; series strings need balancing.' },
  { path: 'bank.cells_parallel', label: 'Strings in parallel', unit: 'strings', whole: true },
  { path: 'bank.cell_farads', label: 'Cell capacitance', unit: 'F' },
  { path: 'bank.cell_rated_volts', label: 'Cell rated voltage', unit: 'V', hint: "The cell maker's rating; never charge above it." },
  { path: 'bank.cell_esr_ohms', label: 'Cell ESR', unit: 'mΩ', scale: 1e-3 },
  { path: 'bank.cell_leakage_amps', label: 'Cell leakage', unit: 'µA', scale: 1e-6 },
];

export const CONVERTER_INPUTS: NumberInput[] = [
  { path: 'converter.start_volts', label: 'Start voltage', unit: 'V', hint: 'After a brownout the node returns at this bank voltage.' },
  { path: 'converter.cutoff_volts', label: 'Cutoff voltage', unit: 'V' },
  { path: 'converter.output_volts', label: 'Output voltage', unit: 'V' },
  { path: 'converter.input_limit_amps', label: 'Input current limit', unit: 'A' },
];

export const LOAD_INPUTS: NumberInput[] = [
  { path: 'load.sleep_amps', label: 'Sleep current', unit: 'µA', scale: 1e-6 },
  { path: 'load.awake_seconds', label: 'Awake time', unit: 's' },
  { path: 'load.awake_amps', label: 'Awake current', unit: 'mA', scale: 1e-3 },
  { path: 'load.burst_seconds', label: 'Burst time', unit: 's' },
  { path: 'load.burst_amps', label: 'Burst current', unit: 'mA', scale: 1e-3 },
  { path: 'load.interval_seconds', label: 'Report interval', unit: 's', whole: true },
  { path: 'load.max_interval_seconds', label: 'Longest report interval', unit: 's', whole: true, hint: 'The ingest reply may stretch the interval up to this.' },
];

export const OTHER_INPUTS: NumberInput[] = [
  { path: 'calibration.gain', label: 'Calibration gain', unit: '×', hint: 'True volts = gain × reported + offset.' },
  { path: 'calibration.offset_volts', label: 'Calibration offset', unit: 'V' },
  { path: 'panel_watts', label: 'Panel rating', unit: 'W', hint: 'Leave empty when unknown.' },
];

export type FormValues = Record<string, string>;
export type EfficiencyRow = { volts: string; eta: string };
export interface EfficiencyState { mode: 'constant' | 'table'; constant: string; rows: EfficiencyRow[] }

// twelve significant digits drop the binary noise of the scaling (15 × 1e-6 → 0.000015)
const tidy = (x: number) => Number(x.toPrecision(12));

/** A typed value in the field's unit → SI; null and NaN pass through for the server to name. */
export function toSi(value: number | null, scale = 1): number | null {
  return value === null || !Number.isFinite(value) || scale === 1 ? value : tidy(value * scale);
}

/** An SI value → the field's unit. */
export function fromSi(value: number, scale = 1): number {
  return scale === 1 ? value : tidy(value / scale);
}

/** A typed number, or what the server will call "not a number" (NaN travels as null). */
export function numberFrom(text: string | undefined): number | null {
  const t = (text ?? '').trim();
  return t === '' ? null : Number(t);
}

export function bodyFromForm(values: FormValues, efficiency: EfficiencyState): Record<string, unknown> {
  const group = (prefix: string, inputs: NumberInput[]) =>
    Object.fromEntries(inputs.map((i) => [i.path.slice(prefix.length + 1), toSi(numberFrom(values[i.path]), i.scale)]));
  return {
    name: values.name ?? '',
    site_id: numberFrom(values.site_id),
    purpose: values.purpose ?? '',
    bank: group('bank', BANK_INPUTS),
    converter: {
      ...group('converter', CONVERTER_INPUTS),
      // typed in %, sent as a fraction
      efficiency: efficiency.mode === 'constant' ? toSi(numberFrom(efficiency.constant), 0.01) : efficiency.rows.map((r) => [numberFrom(r.volts), toSi(numberFrom(r.eta), 0.01)]),
    },
    load: group('load', LOAD_INPUTS),
    calibration: { gain: numberFrom(values['calibration.gain']), offset_volts: numberFrom(values['calibration.offset_volts']) },
    panel_watts: numberFrom(values.panel_watts),
  };
}

export function formFromBody(body: NodeBody): { values: FormValues; efficiency: EfficiencyState } {
  const values: FormValues = { name: body.name, site_id: String(body.site_id), purpose: body.purpose };
  for (const i of [...BANK_INPUTS, ...CONVERTER_INPUTS, ...LOAD_INPUTS, ...OTHER_INPUTS]) {
    const v = i.path.split('.').reduce<unknown>((o, k) => (o as Record<string, unknown> | null)?.[k], body);
    values[i.path] = v == null ? '' : String(fromSi(Number(v), i.scale));
  }
  const eff = body.converter.efficiency;
  const efficiency: EfficiencyState = typeof eff === 'number'
    ? { mode: 'constant', constant: String(fromSi(eff, 0.01)), rows: [{ volts: '', eta: '' }] }
    : { mode: 'table', constant: '85', rows: eff.map(([v, e]) => ({ volts: String(v), eta: String(fromSi(e, 0.01)) })) };
  return { values, efficiency };
}

/** A starting point for a new node: a small two-cell bank (example values, not advice). */
export const NEW_NODE: NodeBody = {
  name: '', site_id: 0, purpose: '',
  bank: { cells_series: 2, cells_parallel: 1, cell_farads: 100, cell_rated_volts: 2.7, cell_esr_ohms: 0.015, cell_leakage_amps: 0.000005 },
  converter: { start_volts: 2.2, cutoff_volts: 0.9, output_volts: 3.3, efficiency: 0.85, input_limit_amps: 1 },
  load: { sleep_amps: 0.00002, awake_seconds: 2, awake_amps: 0.01, burst_seconds: 0.5, burst_amps: 0.12, interval_seconds: 600, max_interval_seconds: 3600 },
  calibration: { gain: 1, offset_volts: 0 },
  panel_watts: null,
};
