'use client';

import { useRef, useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { inFieldUnits, type Problem } from '@/lib/client/api';
import type { BenchRunWire } from '@/lib/schemas/bench-runs';

// Shown in bench units, sent in SI (lib/schemas/bench-runs.ts); pointers name the wire fields.
/** "Discharge current (mA)" → "mA". */
const unitOf = (label: string) => /\(([^)]+)\)$/.exec(label)?.[1] ?? '';

const NUMBERS = [
  { name: 'rated_volts', label: 'Rated voltage (V)', scale: 1, initial: '2.7' },
  { name: 'current_amps', label: 'Discharge current (mA)', scale: 1e-3, initial: '10.8' },
  { name: 'nominal_farads', label: 'Nominal capacitance (F)', scale: 1, initial: '10' },
  { name: 'nominal_esr_ohms', label: 'Nominal ESR (mΩ)', scale: 1e-3, initial: '75' },
] as const;

async function postRun(form: FormData): Promise<{ ok: true; run: BenchRunWire } | { ok: false; problem: Problem }> {
  try {
    const res = await fetch('/api/v1/bench/runs', { method: 'POST', body: form, credentials: 'same-origin' });
    const body = await res.json().catch(() => null);
    return res.ok ? { ok: true, run: body as BenchRunWire } : { ok: false, problem: (body as Problem) ?? { title: res.statusText, status: res.status } };
  } catch {
    return { ok: false, problem: { title: 'Network error', status: 0, detail: 'The server could not be reached. Check the connection and try again.' } };
  }
}

/** One cell's discharge log (CSV seconds,volts) with its ratings; keeps the batch's values for the next cell. */
export function BenchUploadForm({ onStored }: { onStored: (run: BenchRunWire) => void }) {
  const fileRef = useRef<HTMLInputElement>(null);
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const element = event.currentTarget; // React clears currentTarget once the handler awaits
    const typed = new FormData(element);
    const form = new FormData();
    for (const key of ['batch_label', 'cell_label']) form.set(key, String(typed.get(key) ?? ''));
    for (const f of NUMBERS) {
      const raw = String(typed.get(f.name) ?? '').trim().replace(',', '.');
      form.set(f.name, raw === '' || !Number.isFinite(Number(raw)) ? raw : String(Number((Number(raw) * f.scale).toPrecision(12))));
    }
    const file = fileRef.current?.files?.[0];
    if (file) form.set('file', file);
    setBusy(true);
    setMessage(null);
    const res = await postRun(form);
    setBusy(false);
    if (!res.ok) {
      const byField: Record<string, string[]> = {};
      for (const e of res.problem.errors ?? []) {
        const name = e.pointer.replace(/^\//, '');
        const field = NUMBERS.find((f) => f.name === name);
        // the field's own unit (mA, mΩ) in a limit the server gave in A or Ω
        (byField[name] ??= []).push(field ? inFieldUnits(e.detail, { scale: field.scale, unit: unitOf(field.label) }) : e.detail);
      }
      setErrors(byField);
      setMessage(res.problem.errors?.length ? 'The log was not stored: see the fields marked above.' : (res.problem.detail ?? res.problem.title));
      return;
    }
    setErrors({});
    setMessage(`Stored cell ${res.run.cell_label}. Next cell: change its label and pick its log.`);
    (element.elements.namedItem('cell_label') as HTMLInputElement | null)?.select();
    if (fileRef.current) fileRef.current.value = '';
    onStored(res.run);
  }

  const first = (name: string) => errors[name]?.join(' ');
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3 rounded-xl border border-dusk-700 bg-dusk-900 p-4" data-testid="bench-form" aria-label="Upload a discharge log">
      <h2 className="font-bold">Upload a cell&apos;s discharge log</h2>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="bench-batch" name="batch_label" label="Batch label" error={first('batch_label')} required />
        <Field id="bench-cell" name="cell_label" label="Cell label" error={first('cell_label')} required />
        {NUMBERS.map((f) => (
          <Field key={f.name} id={`bench-${f.name}`} name={f.name} label={f.label} defaultValue={f.initial} type="number" step="any" inputMode="decimal" error={first(f.name)} />
        ))}
      </div>
      <div className="flex flex-col gap-1.5">
        <label htmlFor="bench-file" className="text-sm font-bold">Discharge log (CSV with the header seconds,volts)</label>
        <input id="bench-file" ref={fileRef} name="file" type="file" accept=".csv,text/csv" aria-invalid={errors.file ? true : undefined}
          aria-describedby={errors.file ? 'bench-file-error' : 'bench-file-hint'} data-testid="bench-file"
          className="text-sm file:mr-3 file:rounded-md file:border file:border-dusk-600 file:bg-dusk-950 file:px-3 file:py-1.5 file:text-ink" />
        {errors.file ? (
          <ul id="bench-file-error" role="alert" className="list-disc pl-5 text-sm text-hazard">{errors.file.map((e) => <li key={e}>{e}</li>)}</ul>
        ) : (
          <p id="bench-file-hint" className="text-xs text-ink-muted">Start at the discharge start, resting at the charged voltage; run down past 40 % of the rated voltage.</p>
        )}
      </div>
      {message ? <p className={`text-sm ${Object.keys(errors).length || message.startsWith('The log') ? 'text-hazard' : 'text-ink-muted'}`} role="status" data-testid="bench-message">{message}</p> : null}
      <Button type="submit" disabled={busy} data-testid="bench-submit">{busy ? 'Measuring…' : 'Characterize and store'}</Button>
    </form>
  );
}
