import { characterizeDischarge } from '@/lib/energy';
import { listBenchBatches, insertBenchRun } from '@/lib/db/queries/bench';
import { pointersFromZod, problems } from '@/lib/errors';
import { memberRoute } from '@/lib/http/route';
import { characterizeProblem, invalidFromZod, MAX_BODY_BYTES, numberFromFormField, samplesFromCsv } from '@/lib/schemas/bench';
import { benchRunFields, benchRunJsonBody, type BenchRunFields } from '@/lib/schemas/bench-runs';

// Stored bench runs (fields in lib/schemas/bench-runs.ts): any member reads the batch table;
// deployers and owners upload a cell's log, characterized by IEC 62391-1 through lib/energy.
export const GET = memberRoute({ permission: 'fleet:read' }, async ({ member }) => {
  return Response.json({ batches: await listBenchBatches(member.orgId) }, { headers: { 'cache-control': 'no-store' } });
});

type Upload = { fields: BenchRunFields; samples: [number, number][]; samplesPointer: string };

export const POST = memberRoute({ permission: 'bench:write' }, async ({ member, request }) => {
  const type = (request.headers.get('content-type') ?? '').toLowerCase();
  if (Number(request.headers.get('content-length') ?? 0) > MAX_BODY_BYTES) throw tooLarge();
  let upload: Upload;
  if (type.startsWith('application/json')) upload = await readJson(request);
  else if (type.startsWith('multipart/form-data')) upload = await readForm(request);
  else throw problems.unsupportedMedia('Send application/json or a multipart/form-data CSV upload.');
  const { fields, samples, samplesPointer } = upload;
  let result;
  try {
    result = characterizeDischarge({ ratedVolts: fields.rated_volts, currentAmps: fields.current_amps, samples });
  } catch (error) {
    throw characterizeProblem(error, samplesPointer);
  }
  const run = await insertBenchRun({ orgId: member.orgId, userId: member.userId, fields, result });
  return Response.json(run, { status: 201 });
});

const tooLarge = () => problems.tooLarge(`The body is over ${MAX_BODY_BYTES / 1024 / 1024} MB.`);

async function readJson(request: Request): Promise<Upload> {
  const text = await request.text();
  if (text.length > MAX_BODY_BYTES) throw tooLarge();
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw problems.badRequest('The body is not valid JSON.');
  }
  const parsed = benchRunJsonBody.safeParse(raw);
  if (!parsed.success) throw invalidFromZod(parsed.error);
  const { samples, ...fields } = parsed.data;
  return { fields, samples, samplesPointer: '/samples' };
}

async function readForm(request: Request): Promise<Upload> {
  let form: FormData;
  try {
    form = await request.formData();
  } catch {
    throw problems.badRequest('The multipart body could not be read.');
  }
  const text = (name: string) => (typeof form.get(name) === 'string' ? (form.get(name) as string) : undefined);
  const fields = benchRunFields.safeParse({
    batch_label: text('batch_label'),
    cell_label: text('cell_label'),
    nominal_farads: numberFromFormField(form.get('nominal_farads')),
    nominal_esr_ohms: numberFromFormField(form.get('nominal_esr_ohms')),
    rated_volts: numberFromFormField(form.get('rated_volts')),
    current_amps: numberFromFormField(form.get('current_amps')),
  });
  const file = form.get('file');
  // Name every missing piece at once: the fields and the file.
  const bad = fields.success ? [] : pointersFromZod(fields.error);
  if (!file || typeof file === 'string') bad.push({ pointer: '/file', detail: 'Attach the discharge log as a CSV file (seconds,volts).' });
  if (bad.length || !fields.success || !file || typeof file === 'string') throw problems.invalid(bad);
  if (file.size > MAX_BODY_BYTES) throw tooLarge();
  return { fields: fields.data, samples: samplesFromCsv(await file.text()), samplesPointer: '/file' };
}
