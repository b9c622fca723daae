import { Field } from '@/components/ui/field';
import { formatAmps } from '@/lib/format/units';
import type { FormValues, NumberInput } from './node-fields';

/** A group of unit-labelled number inputs; each shows its error in the server's words. */
export function NumberInputs({ inputs, values, errors, onChange }: { inputs: NumberInput[]; values: FormValues; errors: Record<string, string>; onChange: (path: string, text: string) => void }) {
  return (
    <>
      {inputs.map((i) => (
        <Field
          key={i.path}
          id={`node-${i.path.replace(/\./g, '-')}`}
          name={i.path}
          label={`${i.label} (${i.unit})`}
          hint={readableHint(i, values[i.path])}
          inputMode={i.whole ? 'numeric' : 'decimal'}
          autoComplete="off"
          value={values[i.path] ?? ''}
          onChange={(e) => onChange(i.path, e.target.value)}
          error={errors[i.path]}
        />
      ))}
    </>
  );
}

// Currents are entered in amps (SI, as the API takes them); a small one is echoed in µA or mA.
function readableHint(input: NumberInput, text: string | undefined): string | undefined {
  const amps = Number(text);
  if (input.unit !== 'A' || !text?.trim() || !Number.isFinite(amps) || amps <= 0 || amps >= 1) return input.hint;
  return `= ${formatAmps(amps)}`;
}
