import { z } from 'zod';
import { checkNodeSpecs, type BankSpec, type ConverterSpec, type LoadSpec, type SiteSpec } from '../energy';
import type { InvalidParam } from '../errors';

/**
 * The wire shape of the model's inputs (snake_case, SI units in the names), shared by the
 * evaluate route, the node settings and their forms. Cross-field checks (cutoff below the
 * bank's maximum …) come from lib/energy's checkNodeSpecs.
 */
// The message only for a missing or non-number value: given to z.number() as a plain message,
// zod 4 would put it on every failed range check too ("Enter a number (°)." for 95°).
const finite = (unit: string) => z.number({ error: (issue) => (issue.code === 'invalid_type' ? `Enter a number (${unit}).` : undefined) }).finite();
const withUnit = (n: number, unit: string) => `${n}${unit && !unit.includes('..') ? ` ${unit}` : ''}`;
const positive = (unit: string) => finite(unit).positive(`Must be above ${withUnit(0, unit)}.`);
const nonNegative = (unit: string) => finite(unit).min(0, 'Must not be negative.');
/** "Must be at most 10 A.": a range limit in the field's unit (the forms rescale it to theirs). */
export const upTo = (max: number, unit: string) => `Must be at most ${withUnit(max, unit)}.`;

export const bankSchema = z.object({
  cells_series: z.number().int('Whole cells only.').min(1, 'At least 1 cell.').max(64, 'At most 64 cells in series.'),
  cells_parallel: z.number().int('Whole cells only.').min(1, 'At least 1 string.').max(256, 'At most 256 strings in parallel.'),
  cell_farads: positive('F').max(100_000, upTo(100_000, 'F')),
  cell_rated_volts: positive('V').max(10, upTo(10, 'V')),
  cell_esr_ohms: nonNegative('Ω').max(100, upTo(100, 'Ω')),
  cell_leakage_amps: nonNegative('A').max(1, upTo(1, 'A')),
}).strict();

// Below 10 % is no working boost converter: most often a percentage typed as a fraction
// (0.85 meaning 85 %) in a form that takes percent, so it is refused rather than modelled.
const MIN_EFFICIENCY = 0.1;
const eta = () => finite('0..1').min(MIN_EFFICIENCY, `Must be at least ${MIN_EFFICIENCY}.`).max(1, 'Must be at most 1.');
export const efficiencySchema = z.union([
  eta(),
  z.array(z.tuple([nonNegative('V').max(100, upTo(100, 'V')), eta()])).min(1).max(64),
]);

export const converterSchema = z.object({
  start_volts: positive('V').max(100, upTo(100, 'V')),
  cutoff_volts: positive('V').max(100, upTo(100, 'V')),
  output_volts: positive('V').max(60, upTo(60, 'V')),
  efficiency: efficiencySchema,
  input_limit_amps: positive('A').max(100, upTo(100, 'A')),
}).strict();

export const loadSchema = z.object({
  sleep_amps: nonNegative('A').max(10, upTo(10, 'A')),
  awake_seconds: nonNegative('s').max(86_400, upTo(86_400, 's')),
  awake_amps: nonNegative('A').max(10, upTo(10, 'A')),
  burst_seconds: nonNegative('s').max(3600, upTo(3600, 's')),
  burst_amps: nonNegative('A').max(10, upTo(10, 'A')),
  interval_seconds: z.number().int('Whole seconds.').min(1, 'At least 1 s.').max(86_400, 'At most 86400 s (a day).'),
  max_interval_seconds: z.number().int('Whole seconds.').min(1, 'At least 1 s.').max(7 * 86_400, 'At most 604800 s (a week).'),
}).strict();

export const siteModelSchema = z.object({
  lat: finite('°').min(-90, 'Latitude is between −90° and 90°.').max(90, 'Latitude is between −90° and 90°.'),
  lon: finite('°').min(-180, 'Longitude is between −180° and 180°.').max(180, 'Longitude is between −180° and 180°.'),
  recharge_elevation_deg: finite('°').min(-18, 'At least −18° (astronomical twilight).').max(60, 'At most 60°.').default(-0.833),
}).strict();

export type BankWire = z.infer<typeof bankSchema>;
export type ConverterWire = z.infer<typeof converterSchema>;
export type LoadWire = z.infer<typeof loadSchema>;

export function bankFromWire(b: BankWire): BankSpec {
  return { cellsSeries: b.cells_series, cellsParallel: b.cells_parallel, cellFarads: b.cell_farads, cellRatedVolts: b.cell_rated_volts, cellEsrOhms: b.cell_esr_ohms, cellLeakageAmps: b.cell_leakage_amps };
}

export function converterFromWire(c: ConverterWire): ConverterSpec {
  return { startVolts: c.start_volts, cutoffVolts: c.cutoff_volts, outputVolts: c.output_volts, efficiency: c.efficiency, inputLimitAmps: c.input_limit_amps };
}

export function loadFromWire(l: LoadWire): LoadSpec {
  return { sleepAmps: l.sleep_amps, awakeSeconds: l.awake_seconds, awakeAmps: l.awake_amps, burstSeconds: l.burst_seconds, burstAmps: l.burst_amps, intervalSeconds: l.interval_seconds, maxIntervalSeconds: l.max_interval_seconds };
}

export function siteFromWire(s: z.infer<typeof siteModelSchema>): SiteSpec {
  return { lat: s.lat, lon: s.lon, rechargeElevationDeg: s.recharge_elevation_deg };
}

const snake = (name: string) => name.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);

/** checkNodeSpecs problems → JSON pointers into the snake_case wire body. */
export function crossFieldProblems(specs: Parameters<typeof checkNodeSpecs>[0], prefix = ''): InvalidParam[] {
  return checkNodeSpecs(specs).map((p) => ({ pointer: prefix + '/' + p.path.map(snake).join('/'), detail: p.message }));
}

// The unit-named number builders, for the other wire schemas (evaluate, bench, planner).
export { finite as finiteNumber, positive as positiveNumber, nonNegative as nonNegativeNumber };
