/**
 * The planner's inputs in the units people use at the bench (µA, mA, mΩ, %), each with its
 * scale to SI and its path in the POST /api/v1/planner body (lib/schemas/planner.ts), so a
 * server error lands beside its field.
 */
export interface PlannerField {
  path: string; // dotted wire path, e.g. "load.sleep_amps"
  label: string;
  unit: string;
  scale: number; // SI value = shown value × scale
  initial: string;
  step?: string;
  integer?: boolean;
}

export const FIELD_GROUPS: { title: string; fields: PlannerField[] }[] = [
  {
    title: 'Load (at the converter output)',
    fields: [
      { path: 'load.sleep_amps', label: 'Sleep current', unit: 'µA', scale: 1e-6, initial: '15' },
      { path: 'load.awake_seconds', label: 'Awake time per report', unit: 's', scale: 1, initial: '2' },
      { path: 'load.awake_amps', label: 'Awake current', unit: 'mA', scale: 1e-3, initial: '80' },
      { path: 'load.burst_seconds', label: 'Transmit burst time', unit: 's', scale: 1, initial: '1' },
      { path: 'load.burst_amps', label: 'Transmit burst current', unit: 'mA', scale: 1e-3, initial: '250' },
      { path: 'load.interval_seconds', label: 'Report interval', unit: 's', scale: 1, initial: '600', integer: true },
      { path: 'load.max_interval_seconds', label: 'Longest allowed interval', unit: 's', scale: 1, initial: '3600', integer: true },
    ],
  },
  {
    title: 'Boost converter',
    fields: [
      { path: 'converter.start_volts', label: 'Start voltage', unit: 'V', scale: 1, initial: '0.9' },
      { path: 'converter.cutoff_volts', label: 'Cutoff voltage', unit: 'V', scale: 1, initial: '0.5' },
      { path: 'converter.output_volts', label: 'Output voltage', unit: 'V', scale: 1, initial: '3.3' },
      { path: 'converter.efficiency', label: 'Efficiency', unit: '%', scale: 0.01, initial: '85' },
      { path: 'converter.input_limit_amps', label: 'Input current limit', unit: 'A', scale: 1, initial: '1.5' },
    ],
  },
  {
    title: 'Cell type',
    fields: [
      { path: 'cell.farads', label: 'Capacitance per cell', unit: 'F', scale: 1, initial: '25' },
      { path: 'cell.rated_volts', label: 'Rated voltage per cell', unit: 'V', scale: 1, initial: '2.7' },
      { path: 'cell.esr_ohms', label: 'ESR per cell', unit: 'mΩ', scale: 1e-3, initial: '30' },
      { path: 'cell.leakage_amps', label: 'Leakage per cell', unit: 'µA', scale: 1e-6, initial: '5' },
      { path: 'cells_series', label: 'Cells in series', unit: 'cells', scale: 1, initial: '2', integer: true },
    ],
  },
  {
    title: 'Night and target',
    fields: [
      { path: 'extra_days', label: 'Extra days without sun', unit: 'days', scale: 1, initial: '1', integer: true },
      { path: 'target_margin', label: 'Target night margin', unit: '×', scale: 1, initial: '1.5' },
    ],
  },
];

export const CHARGER_FIELDS: PlannerField[] = [
  { path: 'panel_watts', label: 'Panel rating', unit: 'W', scale: 1, initial: '2' },
  { path: 'charger_efficiency', label: 'Charger efficiency', unit: '%', scale: 0.01, initial: '75' },
  { path: 'sun_factor', label: 'Sun factor (share of rated power)', unit: '%', scale: 0.01, initial: '30' },
  { path: 'charger_amps', label: 'Constant-current charger', unit: 'A', scale: 1, initial: '0.5' },
];

export const SITE_FIELDS: PlannerField[] = [
  { path: 'site.lat', label: 'Latitude', unit: '° N', scale: 1, initial: '47.2', step: 'any' },
  { path: 'site.lon', label: 'Longitude', unit: '° E', scale: 1, initial: '-121.6', step: 'any' },
  { path: 'site.recharge_elevation_deg', label: 'Recharge sun elevation', unit: '°', scale: 1, initial: '-0.833', step: 'any' },
];

export const ALL_FIELDS = [...FIELD_GROUPS.flatMap((g) => g.fields), ...SITE_FIELDS, ...CHARGER_FIELDS];

/** Form values (strings as typed) → the JSON body; blanks stay out so the server names them. */
export function plannerBodyFromValues({ values, date }: { values: Record<string, string>; date: string }): Record<string, unknown> {
  const body: Record<string, unknown> = {};
  for (const f of ALL_FIELDS) {
    const raw = (values[f.path] ?? '').trim().replace(',', '.');
    if (raw === '') continue;
    const n = Number(raw);
    // Round away float dust from the unit scale (0.1 × 1e-3 …) so integers stay integers.
    const si = Number.isFinite(n) ? Number((n * f.scale).toPrecision(12)) : raw;
    setPath(body, f.path, si);
  }
  if (date) body.date = date;
  return body;
}

function setPath(target: Record<string, unknown>, path: string, value: unknown) {
  const keys = path.split('.');
  let at = target;
  for (const k of keys.slice(0, -1)) at = (at[k] ??= {}) as Record<string, unknown>;
  at[keys[keys.length - 1]] = value;
}
