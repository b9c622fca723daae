'use client';

import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { apiFetch, fieldErrors, inFieldUnits } from '@/lib/client/api';
import { converterNotes } from '@/components/settings/compute-node';
import { SpecNotes } from '@/components/settings/computed-values';
import { ChargerCautions } from './charger-cautions';
import { PlannerAnswer } from './planner-answer';
import { ALL_FIELDS, CHARGER_FIELDS, FIELD_GROUPS, plannerBodyFromValues, SITE_FIELDS, type PlannerField } from './planner-fields';
import type { PlannerReply, PlannerSite } from './planner-types';

const initialValues = (site?: PlannerSite) => {
  const values = Object.fromEntries(ALL_FIELDS.map((f) => [f.path, f.initial]));
  if (site) Object.assign(values, siteValues(site));
  return values;
};
const siteValues = (s: PlannerSite) => ({ 'site.lat': String(s.lat), 'site.lon': String(s.lon), 'site.recharge_elevation_deg': String(s.recharge_elevation_deg) });

/** The sizing planner: the form on the left (top on a phone), the answer and its chart beside it. */
export function PlannerForm({ sites }: { sites: PlannerSite[] }) {
  const [siteId, setSiteId] = useState<number | null>(sites[0]?.id ?? null);
  const [values, setValues] = useState<Record<string, string>>(() => initialValues(sites[0]));
  const [date, setDate] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [answer, setAnswer] = useState<{ reply: PlannerReply; cutoffVolts: number; timeZone: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const site = sites.find((s) => s.id === siteId) ?? null;
  const notes = converterNotes((plannerBodyFromValues({ values, date }) as { converter?: unknown }).converter);

  function pickSite(id: string) {
    const chosen = sites.find((s) => s.id === Number(id)) ?? null;
    setSiteId(chosen?.id ?? null);
    if (chosen) setValues((v) => ({ ...v, ...siteValues(chosen) }));
  }

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setBusy(true);
    setMessage(null);
    const res = await apiFetch<PlannerReply>('/api/v1/planner', { method: 'POST', body: plannerBodyFromValues({ values, date }) });
    setBusy(false);
    if (!res.ok) {
      const found = fieldErrors(res.problem);
      for (const f of ALL_FIELDS) if (found[f.path]) found[f.path] = inFieldUnits(found[f.path], f);
      setErrors(found);
      // An answer computed from other values must not stand under values that were refused.
      setAnswer(null);
      setMessage(res.problem.errors?.length ? 'Some values need a look: see the fields marked above.' : (res.problem.detail ?? res.problem.title));
      return;
    }
    setErrors({});
    setMessage(null);
    // Keep what the answer was computed with, so later edits do not redraw it wrongly.
    setAnswer({ reply: res.data, cutoffVolts: Number(values['converter.cutoff_volts']), timeZone: site?.time_zone ?? 'UTC' });
  }

  const input = (f: PlannerField) => (
    <Field key={f.path} id={`planner-${f.path.replace(/\./g, '-')}`} name={f.path} label={`${f.label} (${f.unit})`} inputMode="decimal"
      type="number" step={f.step ?? 'any'} value={values[f.path] ?? ''} error={errors[f.path]}
      onChange={(e) => { const value = e.target.value; setValues((v) => ({ ...v, [f.path]: value })); }} />
  );

  return (
    <div className="grid grid-cols-1 gap-8 xl:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-6" data-testid="planner-form" aria-label="Sizing planner">
        {FIELD_GROUPS.map((g) => (
          <fieldset key={g.title} className="min-w-0 rounded-xl border border-dusk-700 bg-dusk-900 p-4">
            <legend className="px-1 font-bold">{g.title}</legend>
            <div className="grid gap-3 sm:grid-cols-2">{g.fields.map(input)}</div>
            {g.fields.some((f) => f.path.startsWith('converter.')) ? <SpecNotes notes={notes} testId="converter-notes" /> : null}
          </fieldset>
        ))}
        <fieldset className="min-w-0 rounded-xl border border-dusk-700 bg-dusk-900 p-4">
          <legend className="px-1 font-bold">Site and night</legend>
          <div className="grid gap-3 sm:grid-cols-2">
            <div className="flex flex-col gap-1.5 sm:col-span-2">
              <label htmlFor="planner-site" className="text-sm font-bold">One of your sites</label>
              <select id="planner-site" value={siteId ?? ''} onChange={(e) => pickSite(e.target.value)} className="w-full min-w-0 max-w-full truncate rounded-md border border-dusk-600 bg-dusk-950 px-3 py-2" data-testid="planner-site">
                <option value="">Other place (enter latitude and longitude)</option>
                {sites.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
              </select>
            </div>
            {SITE_FIELDS.map((f) => input({ ...f }))}
            <Field id="planner-date" name="date" type="date" label="Night of (site date)" value={date} error={errors.date}
              hint="Blank: the longest night of the year there." onChange={(e) => setDate(e.target.value)} />
          </div>
          {!site ? <p className="mt-2 text-xs text-ink-muted">Times are shown in UTC for a place that is not one of your sites.</p> : null}
        </fieldset>
        <fieldset className="min-w-0 rounded-xl border border-dusk-700 bg-dusk-900 p-4">
          <legend className="px-1 font-bold">Charging</legend>
          <div className="grid gap-3 sm:grid-cols-2">{CHARGER_FIELDS.map(input)}</div>
          <div className="mt-3"><ChargerCautions chargerAmps={Number(values.charger_amps)} /></div>
        </fieldset>
        {message ? <p className="text-sm text-hazard" role="alert" data-testid="planner-message">{message}</p> : null}
        <Button type="submit" disabled={busy} data-testid="planner-submit">{busy ? 'Planning…' : 'Plan the bank'}</Button>
      </form>
      <div className="xl:sticky xl:top-6 xl:self-start">
        <PlannerAnswer answer={answer?.reply ?? null} busy={busy} timeZone={answer?.timeZone ?? 'UTC'} cutoffVolts={answer?.cutoffVolts ?? 0} />
      </div>
    </div>
  );
}
