import { characterizeDischarge } from '@/lib/energy';
import { listBenchBatches, insertBenchRun } from '@/lib/db/queries/bench';
import { memberRoute } from '@/lib/http/route';
import { characterizeProblem, numberFromFormField } from '@/lib/schemas/bench';
import { benchBodyKind, fieldsAndSamples, readBenchForm, readBenchJson } from '@/lib/schemas/bench-upload';
import { benchRunFields, benchRunJsonBody, type BenchRunFields } from '@/lib/schemas/bench-runs';

// Stored bench runs (fields in lib/schemas/bench-runs.ts): any member reads the batch table;
// deployers and owners upload a cell's log, characterized by IEC 62391-1 through lib/energy.
export const GET = memberRoute({ permission: 'fleet:read' }, async ({ member }) => {
  return Response.json({ batches: await listBenchBatches(member.orgId) }, { headers: { 'cache-control': 'no-store' } });
});

type Upload = { fields: BenchRunFields; samples: [number, number][]; samplesPointer: string };

export const POST = memberRoute({ permission: 'bench:write' }, async ({ member, request }) => {
  let upload: Upload;
  if (benchBodyKind(request) === 'json') {
    const { samples, ...fields } = await readBenchJson(request, benchRunJsonBody);
    upload = { fields, samples, samplesPointer: '/samples' };
  } else upload = await readForm(request);
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

async function readForm(request: Request): Promise<Upload> {
  const form = await readBenchForm(request);
  const text = (name: string) => (typeof form.get(name) === 'string' ? (form.get(name) as string) : undefined);
  const parsed = benchRunFields.safeParse({
    batch_label: text('batch_label'),
    cell_label: text('cell_label'),
    nominal_farads: numberFromFormField(form.get('nominal_farads')),
    nominal_esr_ohms: numberFromFormField(form.get('nominal_esr_ohms')),
    rated_volts: numberFromFormField(form.get('rated_volts')),
    current_amps: numberFromFormField(form.get('current_amps')),
  });
  const { fields, samples } = await fieldsAndSamples(form, parsed, 'Attach the discharge log as a CSV file (seconds,volts).');
  return { fields, samples, samplesPointer: '/file' };
}
