import type { z } from 'zod';
import { pointersFromZod, ProblemError, problems, type InvalidParam } from '../errors';
import { invalidFromZod, MAX_BODY_BYTES, samplesFromCsv } from './bench';

/**
 * Reading a bench log, shared by POST /api/v1/bench/characterize and POST /api/v1/bench/runs:
 * a JSON body or a multipart CSV upload, both capped at MAX_BODY_BYTES.
 */
export const benchTooLarge = () => problems.tooLarge(`The body is over ${MAX_BODY_BYTES / 1024 / 1024} MB.`);

export type BenchBodyKind = 'json' | 'form';

/** The body's kind from its media type (and its declared length): 413 or 415 otherwise. */
export function benchBodyKind(request: Request): BenchBodyKind {
  const type = (request.headers.get('content-type') ?? '').toLowerCase();
  if (Number(request.headers.get('content-length') ?? 0) > MAX_BODY_BYTES) throw benchTooLarge();
  if (type.startsWith('application/json')) return 'json';
  if (type.startsWith('multipart/form-data')) return 'form';
  throw problems.unsupportedMedia('Send application/json or a multipart/form-data CSV upload.');
}

export async function readBenchJson<S extends z.ZodType>(request: Request, schema: S): Promise<z.infer<S>> {
  const text = await request.text();
  if (text.length > MAX_BODY_BYTES) throw benchTooLarge();
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw problems.badRequest('The body is not valid JSON.');
  }
  const parsed = schema.safeParse(raw);
  if (!parsed.success) throw invalidFromZod(parsed.error);
  return parsed.data;
}

export async function readBenchForm(request: Request): Promise<FormData> {
  try {
    return await request.formData();
  } catch {
    throw problems.badRequest('The multipart body could not be read.');
  }
}

/**
 * The form's fields (already parsed by the caller's schema) and its CSV file, naming every
 * problem at once: the fields, a missing file and the file's bad lines, so one upload shows all
 * there is to fix.
 */
export async function fieldsAndSamples<T>(form: FormData, fields: z.ZodSafeParseResult<T>, missingFileDetail: string): Promise<{ fields: T; samples: [number, number][] }> {
  const file = form.get('file');
  const bad: InvalidParam[] = fields.success ? [] : pointersFromZod(fields.error);
  let samples: [number, number][] | null = null;
  if (!file || typeof file === 'string') bad.push({ pointer: '/file', detail: missingFileDetail });
  else {
    if (file.size > MAX_BODY_BYTES) throw benchTooLarge();
    try {
      samples = samplesFromCsv(await file.text());
    } catch (error) {
      if (!(error instanceof ProblemError) || !error.extra.errors) throw error;
      bad.push(...error.extra.errors);
    }
  }
  if (bad.length || !fields.success || !samples) throw problems.invalid(bad);
  return { fields: fields.data, samples };
}
