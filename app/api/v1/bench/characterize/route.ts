import { characterizeDischarge } from '@/lib/energy';
import { pointersFromZod, problems } from '@/lib/errors';
import { memberRoute } from '@/lib/http/route';
import {
  benchFormFields,
  benchJsonBody,
  characterizationToWire,
  characterizeProblem,
  invalidFromZod,
  MAX_BODY_BYTES,
  numberFromFormField,
  samplesFromCsv,
  type BenchInput,
} from '@/lib/schemas/bench';

// IEC 62391-1 constant-current characterization of one cell's discharge log, as JSON or as a
// CSV upload. memberRoute only parses JSON bodies, so this route reads its own by media type.
export const POST = memberRoute({ permission: 'bench:write' }, async ({ request }) => {
  const type = (request.headers.get('content-type') ?? '').toLowerCase();
  if (Number(request.headers.get('content-length') ?? 0) > MAX_BODY_BYTES) throw tooLarge();
  let input: BenchInput;
  let samplesPointer: string;
  if (type.startsWith('application/json')) {
    input = await readJson(request);
    samplesPointer = '/samples';
  } else if (type.startsWith('multipart/form-data')) {
    input = await readUpload(request);
    samplesPointer = '/file';
  } else {
    throw problems.unsupportedMedia('Send application/json or a multipart/form-data CSV upload.');
  }
  try {
    return Response.json(characterizationToWire(characterizeDischarge(input)), { headers: { 'cache-control': 'no-store' } });
  } catch (error) {
    throw characterizeProblem(error, samplesPointer);
  }
});

const tooLarge = () => problems.tooLarge(`The body is over ${MAX_BODY_BYTES / 1024 / 1024} MB.`);

async function readJson(request: Request): Promise<BenchInput> {
  const text = await request.text();
  if (text.length > MAX_BODY_BYTES) throw tooLarge();
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw problems.badRequest('The body is not valid JSON.');
  }
  const parsed = benchJsonBody.safeParse(raw);
  if (!parsed.success) throw invalidFromZod(parsed.error);
  return { ratedVolts: parsed.data.rated_volts, currentAmps: parsed.data.current_amps, samples: parsed.data.samples };
}

async function readUpload(request: Request): Promise<BenchInput> {
  let form: FormData;
  try {
    form = await request.formData();
  } catch {
    throw problems.badRequest('The multipart body could not be read.');
  }
  const fields = benchFormFields.safeParse({
    rated_volts: numberFromFormField(form.get('rated_volts')),
    current_amps: numberFromFormField(form.get('current_amps')),
  });
  const file = form.get('file');
  // Name every missing piece at once: the fields and the file.
  const bad = fields.success ? [] : pointersFromZod(fields.error);
  if (!file || typeof file === 'string') bad.push({ pointer: '/file', detail: 'Attach the discharge log as a CSV file.' });
  if (bad.length || !fields.success || !file || typeof file === 'string') throw problems.invalid(bad);
  if (file.size > MAX_BODY_BYTES) throw tooLarge();
  const samples = samplesFromCsv(await file.text());
  return { ratedVolts: fields.data.rated_volts, currentAmps: fields.data.current_amps, samples };
}
