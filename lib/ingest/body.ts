import { problems, type InvalidParam } from '../errors';
import { MAX_BODY_BYTES, MAX_READINGS_PER_POST, batchSchema } from '../schemas/reading';
import { csvLineToObject, parseCsvHeader } from './csv';
import { fastReading } from './fast-reading';
import { normalizeReading, type NormalizedReading } from './normalize';

/**
 * What ingest needs of a request: its headers and its body. A web Request (Next's route
 * handler) is one; the Node server's fast route (lib/server/fast-routes.ts) passes its
 * IncomingMessage's headers and the message itself as the body, without building a Request.
 */
export interface IngestRequest {
  headers: { get(name: string): string | null };
  body: ReadableStream<Uint8Array> | AsyncIterable<Uint8Array> | null;
}

/** Reads at most `maxBytes` of the body, refusing more without buffering it (413). */
export async function readBodyLimited(request: IngestRequest, maxBytes = MAX_BODY_BYTES): Promise<string> {
  const declared = Number(request.headers.get('content-length') ?? NaN);
  const tooLarge = () => problems.tooLarge(`The body is over ${maxBytes / 1024} KiB; send smaller batches.`);
  if (declared > maxBytes) throw tooLarge();
  if (!request.body) return '';
  const chunks: Uint8Array[] = [];
  let total = 0;
  if ('getReader' in request.body) {
    const reader = request.body.getReader();
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      total += value.byteLength;
      if (total > maxBytes) {
        await reader.cancel();
        throw tooLarge();
      }
      chunks.push(value);
    }
  } else {
    for await (const chunk of request.body) {
      total += chunk.byteLength;
      if (total > maxBytes) throw tooLarge(); // leaving the loop stops the stream
      chunks.push(chunk);
    }
  }
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(chunks.length === 1 ? chunks[0] : Buffer.concat(chunks));
  } catch {
    throw problems.badRequest('The body is not valid UTF-8.');
  }
}

function mediaType(request: IngestRequest): string {
  return (request.headers.get('content-type') ?? '').split(';')[0].trim().toLowerCase();
}

/** The whole post, validated: every reading or a 4xx problem. Nothing is stored here. */
export async function parseIngestBody(request: IngestRequest, receivedAt: Date): Promise<NormalizedReading[]> {
  const type = mediaType(request);
  if (type !== 'application/json' && type !== 'text/csv') throw problems.unsupportedMedia('Send application/json or text/csv.');
  const text = await readBodyLimited(request);
  const { items, single } = type === 'application/json' ? jsonItems(text) : { items: csvItems(text), single: false };
  if (items.length > MAX_READINGS_PER_POST) throw problems.tooLarge(`At most ${MAX_READINGS_PER_POST} readings a post; this one has ${items.length}.`);
  const readings: NormalizedReading[] = [];
  const bad: InvalidParam[] = [];
  // Pointers are built only for a reading that has something to report.
  const pointer = (i: number) => (single ? '' : `/readings/${i}`);
  for (let i = 0; i < items.length; i++) {
    const { raw, error } = items[i];
    if (error) {
      bad.push({ pointer: pointer(i), detail: error });
      continue;
    }
    const quick = fastReading(raw, receivedAt);
    if (quick) {
      readings.push(quick);
      continue;
    }
    const { reading, problems: p } = normalizeReading(raw, pointer(i), receivedAt);
    if (reading) readings.push(reading);
    bad.push(...p);
  }
  if (bad.length) throw problems.invalid(bad, 'Nothing was stored: fix these readings and send the batch again.');
  return readings;
}

type Item = { raw?: unknown; error?: string };

function jsonItems(text: string): { items: Item[]; single: boolean } {
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    throw problems.badRequest('The body is not valid JSON.');
  }
  if (body === null || typeof body !== 'object' || Array.isArray(body)) throw problems.badRequest('Send one reading object, or {"readings": [...]}.');
  if (!('readings' in body)) return { items: [{ raw: body }], single: true };
  const batch = batchSchema.safeParse(body);
  if (!batch.success) throw problems.invalid(batch.error.issues.map((i) => ({ pointer: '/' + i.path.join('/'), detail: i.message })));
  return { items: batch.data.readings.map((raw) => ({ raw })), single: false };
}

function csvItems(text: string): Item[] {
  const lines = text.split(/\r?\n/);
  while (lines.length && lines[lines.length - 1].trim() === '') lines.pop();
  if (lines.length < 2) throw problems.badRequest('CSV needs a header line and at least one reading.');
  const header = parseCsvHeader(lines[0]);
  if ('error' in header) throw problems.badRequest(header.error);
  return lines.slice(1).map((line, i) => {
    const obj = csvLineToObject(header.fields, line); // reading i is line i + 2 of the file
    return 'error' in obj ? { error: `Line ${i + 2}: ${obj.error}` } : { raw: obj };
  });
}
