import { characterizeDischarge } from '@/lib/energy';
import { memberRoute } from '@/lib/http/route';
import { benchFormFields, benchJsonBody, characterizationToWire, characterizeProblem, numberFromFormField, type BenchInput } from '@/lib/schemas/bench';
import { benchBodyKind, fieldsAndSamples, readBenchForm, readBenchJson } from '@/lib/schemas/bench-upload';

// IEC 62391-1 constant-current characterization of one cell's discharge log, as JSON or as a
// CSV upload. memberRoute only parses JSON bodies, so this route reads its own by media type.
export const POST = memberRoute({ permission: 'bench:write' }, async ({ request }) => {
  let input: BenchInput;
  let samplesPointer: string;
  if (benchBodyKind(request) === 'json') {
    const body = await readBenchJson(request, benchJsonBody);
    input = { ratedVolts: body.rated_volts, currentAmps: body.current_amps, samples: body.samples };
    samplesPointer = '/samples';
  } else {
    input = await readUpload(request);
    samplesPointer = '/file';
  }
  try {
    return Response.json(characterizationToWire(characterizeDischarge(input)), { headers: { 'cache-control': 'no-store' } });
  } catch (error) {
    throw characterizeProblem(error, samplesPointer);
  }
});

async function readUpload(request: Request): Promise<BenchInput> {
  const form = await readBenchForm(request);
  const parsed = benchFormFields.safeParse({
    rated_volts: numberFromFormField(form.get('rated_volts')),
    current_amps: numberFromFormField(form.get('current_amps')),
  });
  const { fields, samples } = await fieldsAndSamples(form, parsed, 'Attach the discharge log as a CSV file.');
  return { ratedVolts: fields.rated_volts, currentAmps: fields.current_amps, samples };
}
