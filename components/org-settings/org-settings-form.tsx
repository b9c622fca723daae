'use client';

import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { apiFetch, fieldErrors } from '@/lib/client/api';
import { orgSettingsBody, type OrgSettingsWire } from '@/lib/schemas/org-settings';
import { pointersFromZod } from '@/lib/errors';

/**
 * The owner's form. The shared zod schema checks as the server would (same words), and the
 * server's answer still decides: its pointers land beside the fields.
 */
export function OrgSettingsForm({ initial }: { initial: OrgSettingsWire }) {
  const [values, setValues] = useState(initial);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ text: string; bad: boolean } | null>(null);
  const [busy, setBusy] = useState(false);
  const num = (key: keyof OrgSettingsWire) => ({
    value: String(values[key]),
    onChange: (e: React.ChangeEvent<HTMLInputElement>) => setValues({ ...values, [key]: e.target.value === '' ? ('' as never) : Number(e.target.value) }),
  });

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const { name: _name, ...body } = values;
    const local = orgSettingsBody.safeParse(body);
    if (!local.success) {
      setErrors(fieldErrors({ title: '', status: 422, errors: pointersFromZod(local.error) }));
      setMessage({ text: 'Nothing saved: see the fields marked above.', bad: true });
      return;
    }
    setBusy(true);
    setMessage(null);
    const res = await apiFetch<OrgSettingsWire>('/api/v1/org/settings', { method: 'PUT', body: local.data });
    setBusy(false);
    if (!res.ok) {
      setErrors(fieldErrors(res.problem));
      setMessage({ text: res.problem.errors?.length ? 'Nothing saved: see the fields marked above.' : (res.problem.detail ?? res.problem.title), bad: true });
      return;
    }
    setValues(res.data);
    setErrors({});
    setMessage({ text: 'Saved. Node states follow the new thresholds at the next margin pass.', bad: false });
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex max-w-xl flex-col gap-5" data-testid="org-settings-form">
      <fieldset className="min-w-0 rounded-xl border border-dusk-700 bg-dusk-900 p-4">
        <legend className="px-1 font-bold">State thresholds (night margin)</legend>
        <div className="grid gap-3 sm:grid-cols-2">
          <Field id="steady_margin" label="steady at or above (×)" type="number" step="0.05" inputMode="decimal" error={errors.steady_margin} {...num('steady_margin')} />
          <Field id="thin_margin" label="thin at or above (×)" type="number" step="0.05" inputMode="decimal" error={errors.thin_margin} hint="Below it: short." {...num('thin_margin')} />
        </div>
        <p className="mt-2 text-xs text-ink-muted">Steady must be above thin, and thin above 0. A margin of 1.0× just reaches the recharge.</p>
      </fieldset>
      <fieldset className="min-w-0 rounded-xl border border-dusk-700 bg-dusk-900 p-4">
        <legend className="px-1 font-bold">Alert e-mail</legend>
        <div className="flex items-center gap-3">
          <input id="alert_on_thin" type="checkbox" checked={values.alert_on_thin} onChange={(e) => setValues({ ...values, alert_on_thin: e.target.checked })} className="h-5 w-5 accent-[rgb(var(--tide))]" />
          <label htmlFor="alert_on_thin" className="text-sm font-bold">Also alert when a node&apos;s reserve turns thin</label>
        </div>
        <div className="mt-3 grid gap-3 sm:grid-cols-2">
          <Field id="resend_short_hours" label="Re-send an open short alert after (h)" type="number" step="1" min="1" error={errors.resend_short_hours} {...num('resend_short_hours')} />
          <Field id="mail_cap_per_hour" label="At most e-mails per hour" type="number" step="1" min="1" error={errors.mail_cap_per_hour} {...num('mail_cap_per_hour')} />
        </div>
      </fieldset>
      {message ? <p className={`text-sm ${message.bad ? 'text-hazard' : 'text-ink-muted'}`} role="status" data-testid="org-settings-message">{message.text}</p> : null}
      <Button type="submit" disabled={busy} className="self-start" data-testid="org-settings-save">{busy ? 'Saving…' : 'Save settings'}</Button>
    </form>
  );
}
