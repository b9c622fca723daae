'use client';

import { useRouter } from 'next/navigation';
import { useMemo, useState, type FormEvent, type ReactNode } from 'react';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { apiFetch, fieldErrors, inFieldUnits } from '@/lib/client/api';
import type { NodeBody } from '@/lib/schemas/node';
import { BankCaution } from './bank-caution';
import { bankNotes, computeBankFigures, converterNotes, computeLoadFigures } from './compute-node';
import { BankFiguresPanel, LoadFiguresPanel } from './computed-values';
import { EfficiencyInput } from './efficiency-input';
import { BANK_INPUTS, bodyFromForm, CONVERTER_INPUTS, formFromBody, LOAD_INPUTS, OTHER_INPUTS } from './node-fields';
import { NumberInputs } from './number-inputs';

/** Create and edit a node: the same form, the server's words by each field. */
export function NodeForm({ nodeId, initial, sites }: { nodeId?: number; initial: NodeBody; sites: { id: number; name: string }[] }) {
  const router = useRouter();
  const start = useMemo(() => formFromBody(initial), [initial]);
  const [values, setValues] = useState(start.values);
  const [efficiency, setEfficiency] = useState(start.efficiency);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ text: string; bad: boolean } | null>(null);
  const [busy, setBusy] = useState(false);

  const body = bodyFromForm(values, efficiency) as { bank: unknown; converter: unknown; load: unknown };
  const bankFigures = computeBankFigures(body.bank);
  const loadFigures = computeLoadFigures(body);
  const set = (path: string, text: string) => setValues((v) => ({ ...v, [path]: text }));

  async function onSubmit(event: FormEvent) {
    event.preventDefault();
    setBusy(true);
    const res = await apiFetch<{ id: number }>(nodeId ? `/api/v1/nodes/${nodeId}` : '/api/v1/nodes', { method: nodeId ? 'PUT' : 'POST', body: bodyFromForm(values, efficiency) });
    setBusy(false);
    if (!res.ok) {
      const found = fieldErrors(res.problem);
      for (const i of [...BANK_INPUTS, ...CONVERTER_INPUTS, ...LOAD_INPUTS]) if (found[i.path]) found[i.path] = inFieldUnits(found[i.path], { scale: i.scale ?? 1, unit: i.unit });
      // The efficiency (constant, or each point's second number) is typed in %.
      for (const key of Object.keys(found)) if (key === 'converter.efficiency' || /^converter\.efficiency\.\d+\.1$/.test(key)) found[key] = inFieldUnits(found[key], { scale: 0.01, unit: '%' });
      setErrors(found);
      const stray = Object.entries(found).filter(([k]) => !knownPath(k)).map(([k, v]) => `${k}: ${v}`);
      setMessage({ text: [res.problem.detail ?? res.problem.title, stray.length ? '' : 'See the marked fields.', ...stray].filter(Boolean).join(' '), bad: true });
      // Keyboard and screen-reader users land on the first field the server named.
      requestAnimationFrame(() => document.querySelector<HTMLElement>('[data-testid="node-form"] [aria-invalid="true"]')?.focus());
      return;
    }
    setErrors({});
    if (!nodeId) {
      router.push(`/nodes/${res.data.id}/credentials?created=1`);
      return;
    }
    setMessage({ text: 'Saved. The node’s state, charge and margin were worked out again with these settings.', bad: false });
    router.refresh();
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-6" data-testid="node-form">
      <Section title="Node">
        <div className="grid gap-3 sm:grid-cols-2">
          <Field id="node-name" name="name" label="Name" value={values.name} onChange={(e) => set('name', e.target.value)} error={errors.name} autoComplete="off" />
          <div className="flex flex-col gap-1.5">
            <label htmlFor="node-site" className="text-sm font-bold">Site</label>
            <select id="node-site" value={values.site_id} onChange={(e) => set('site_id', e.target.value)} aria-invalid={errors.site_id ? true : undefined}
              className="rounded-md border border-dusk-600 bg-dusk-950 px-3 py-2 text-ink">
              <option value="0" disabled>Choose a site…</option>
              {sites.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
            </select>
            {errors.site_id ? <p className="text-sm text-hazard" role="alert">{errors.site_id}</p> : null}
          </div>
          <div className="sm:col-span-2">
            <Field id="node-purpose" name="purpose" label="Purpose" hint="One line, e.g. stream gauge" value={values.purpose} onChange={(e) => set('purpose', e.target.value)} error={errors.purpose} />
          </div>
        </div>
      </Section>

      <Section title="Bank" aside={<><BankFiguresPanel figures={bankFigures} notes={bankNotes(body.bank)} /><BankCaution shortCircuitAmps={bankFigures?.shortCircuitAmps ?? null} /></>}>
        <div className="grid gap-3 sm:grid-cols-2"><NumberInputs inputs={BANK_INPUTS} values={values} errors={errors} onChange={set} /></div>
      </Section>

      <Section title="Converter and load" aside={<LoadFiguresPanel figures={loadFigures} notes={converterNotes(body.converter)} />}>
        <div className="grid gap-3 sm:grid-cols-2">
          <NumberInputs inputs={CONVERTER_INPUTS} values={values} errors={errors} onChange={set} />
          <EfficiencyInput value={efficiency} onChange={setEfficiency} errors={errors} />
          <NumberInputs inputs={LOAD_INPUTS} values={values} errors={errors} onChange={set} />
        </div>
      </Section>

      <Section title="Calibration and panel">
        <div className="grid gap-3 sm:grid-cols-2"><NumberInputs inputs={OTHER_INPUTS} values={values} errors={errors} onChange={set} /></div>
      </Section>

      {message ? <p role={message.bad ? 'alert' : 'status'} className={`text-sm ${message.bad ? 'text-hazard' : 'text-tide'}`} data-testid="node-form-message">{message.text}</p> : null}
      <div><Button type="submit" disabled={busy} data-testid="node-save">{busy ? 'Saving…' : nodeId ? 'Save settings' : 'Create node'}</Button></div>
    </form>
  );
}

const PATHS = new Set(['name', 'site_id', 'purpose', ...[...BANK_INPUTS, ...CONVERTER_INPUTS, ...LOAD_INPUTS, ...OTHER_INPUTS].map((i) => i.path)]);

function knownPath(key: string): boolean {
  return PATHS.has(key) || key.startsWith('converter.efficiency');
}

function Section({ title, children, aside }: { title: string; children: ReactNode; aside?: ReactNode }) {
  return (
    <fieldset className="rounded-xl border border-dusk-700 bg-dusk-900 p-4">
      <legend className="px-1 text-lg font-bold">{title}</legend>
      <div className={aside ? 'grid gap-4 lg:grid-cols-[minmax(0,1fr)_20rem]' : ''}>
        <div>{children}</div>
        {aside ? <div className="flex flex-col gap-3 lg:sticky lg:top-4 lg:self-start">{aside}</div> : null}
      </div>
    </fieldset>
  );
}
