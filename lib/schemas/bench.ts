import { z } from 'zod';
import { EnergyInputError, NeverCrossesError, type Characterization } from '../energy';
import { pointersFromZod, ProblemError, problems, type InvalidParam } from '../errors';
import { finiteNumber, positiveNumber, upTo } from './model';

/**
 * POST /api/v1/bench/characterize, either as JSON
 *   { rated_volts, current_amps, samples: [[seconds, volts], ...] }
 * or as multipart/form-data with a `file` (CSV, header line `seconds,volts`) and the fields
 * `rated_volts` and `current_amps`. The reply is the IEC 62391-1 result in snake_case.
 */
export const MAX_SAMPLES = 200_000;
/** 200 000 samples of ~25 characters each fit with room to spare. */
export const MAX_BODY_BYTES = 8 * 1024 * 1024;
/** More line errors than this say nothing new; the reply stays small. */
const MAX_REPORTED_ERRORS = 20;

const sample = z.tuple([finiteNumber('s'), finiteNumber('V').min(-1000).max(1000)]);

export const benchFields = {
  rated_volts: positiveNumber('V').max(1000, upTo(1000, 'V')),
  current_amps: positiveNumber('A').max(1000, upTo(1000, 'A')),
};

export const benchJsonBody = z.object({
  ...benchFields,
  samples: z.array(sample).min(3, 'A discharge log needs at least 3 samples.').max(MAX_SAMPLES, `At most ${MAX_SAMPLES} samples.`),
}).strict();

export const benchFormFields = z.object(benchFields);

export type BenchInput = { ratedVolts: number; currentAmps: number; samples: [number, number][] };

/** Throws 422 with at most MAX_REPORTED_ERRORS pointers. */
export function invalidFromZod(error: z.ZodError): ProblemError {
  return problems.invalid(pointersFromZod(error).slice(0, MAX_REPORTED_ERRORS));
}

/** A form field as a number: missing or blank stays undefined so the schema names it. */
export function numberFromFormField(value: FormDataEntryValue | null): unknown {
  if (typeof value !== 'string' || value.trim() === '') return undefined;
  const n = Number(value.trim());
  return Number.isNaN(n) ? value : n;
}

/**
 * CSV `seconds,volts` with one header line (1-based line numbers count it). Blank lines are
 * skipped; a comma, semicolon or tab separates the columns. Bad lines answer 422 naming them.
 */
export function samplesFromCsv(text: string): [number, number][] {
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
  const header = lines[0]?.trim().toLowerCase().replace(/["'\s]/g, '') ?? '';
  if (!/^seconds[,;\t]volts$/.test(header)) {
    throw csvProblem([{ line: 1, detail: 'line 1: the header must be "seconds,volts"' }]);
  }
  const samples: [number, number][] = [];
  const errors: { line: number; detail: string }[] = [];
  for (let i = 1; i < lines.length; i++) {
    const raw = lines[i].trim();
    if (raw === '') continue;
    const cells = raw.split(/[,;\t]/).map((c) => c.trim().replace(/^"(.*)"$/, '$1'));
    const [seconds, volts] = cells.map((c) => (c === '' ? Number.NaN : Number(c)));
    if (cells.length !== 2 || !Number.isFinite(seconds) || !Number.isFinite(volts)) {
      errors.push({ line: i + 1, detail: `line ${i + 1}: expected two numbers "seconds,volts", got "${raw.slice(0, 60)}"` });
      if (errors.length >= MAX_REPORTED_ERRORS) break;
      continue;
    }
    samples.push([seconds, volts]);
    if (samples.length > MAX_SAMPLES) throw problems.invalid([{ pointer: '/file', detail: `at most ${MAX_SAMPLES} samples` }]);
  }
  if (errors.length) throw csvProblem(errors);
  if (samples.length < 3) throw problems.invalid([{ pointer: '/file', detail: 'a discharge log needs at least 3 samples' }]);
  return samples;
}

function csvProblem(errors: { line: number; detail: string }[]): ProblemError {
  const params: (InvalidParam & { line: number })[] = errors.map((e) => ({ pointer: '/file', ...e }));
  return new ProblemError(422, 'Invalid values', 'Some lines of the CSV file are not valid.', { errors: params });
}

/**
 * The model's input errors as 422: which threshold is never crossed (the fraction and volts
 * are also sent as members), or which field is out of range. `samplesPointer` is /samples for
 * JSON and /file for an upload.
 */
export function characterizeProblem(error: unknown, samplesPointer: string): unknown {
  if (error instanceof NeverCrossesError) {
    return new ProblemError(422, 'Invalid values', error.message, {
      errors: [{ pointer: samplesPointer, detail: error.message }],
      threshold_fraction: error.thresholdFraction,
      threshold_volts: error.thresholdVolts,
    });
  }
  if (error instanceof EnergyInputError) {
    const pointer = error.field === 'samples' ? samplesPointer : '/' + error.field.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
    return problems.invalid([{ pointer, detail: error.message }]);
  }
  return error;
}

export function characterizationToWire(c: Characterization) {
  return { capacitance_farads: c.capacitanceFarads, esr_ohms: c.esrOhms, t1_seconds: c.t1Seconds, t2_seconds: c.t2Seconds };
}
