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
const positive = (unit: string) => finite(unit).positive(`Must be above 0 ${unit}.`);
const nonNegative = (unit: string) => finite(unit).min(0, `Must not be negative (${unit}).`);

export const bankSchema = z.object({
  cells_series: z.number().int('Whole cells only.').min(1).max(64),
  cells_parallel: z.number().int('Whole cells only.').min(1).max(256),
  cell_farads: positive('F').max(100_000),
  cell_rated_volts: positive('V').max(10),
  cell_esr_ohms: nonNegative('Ω').max(100),
  cell_leakage_amps: nonNegative('A').max(1),
}).strict();

export const efficiencySchema = z.union([
  finite('0..1').gt(0, 'Must be above 0.').max(1, 'Must be at most 1.'),
  z.array(z.tuple([nonNegative('V').max(100), finite('0..1').gt(0).max(1)])).min(1).max(64),
]);

export const converterSchema = z.object({
  start_volts: positive('V').max(100),
  cutoff_volts: positive('V').max(100),
  output_volts: positive('V').max(60),
  efficiency: efficiencySchema,
  input_limit_amps: positive('A').max(100),
}).strict();

export const loadSchema = z.object({
  sleep_amps: nonNegative('A').max(10),
  awake_seconds: nonNegative('s').max(86_400),
  awake_amps: nonNegative('A').max(10),
  burst_seconds: nonNegative('s').max(3600),
  burst_amps: nonNegative('A').max(10),
  interval_seconds: z.number().int('Whole seconds.').min(1).max(86_400),
  max_interval_seconds: z.number().int('Whole seconds.').min(1).max(7 * 86_400),
}).strict();

export const siteModelSchema = z.object({
  lat: finite('°').min(-90, 'Latitude is between −90° and 90°.').max(90, 'Latitude is between −90° and 90°.'),
  lon: finite('°').min(-180, 'Longitude is between −180° and 180°.').max(180, 'Longitude is between −180° and 180°.'),
  recharge_elevation_deg: finite('°').min(-18).max(60).default(-0.833),
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
