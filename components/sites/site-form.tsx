'use client';

import { useRouter } from 'next/navigation';
import { useEffect, useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { apiFetch, fieldErrors } from '@/lib/client/api';
import type { SiteBody } from '@/lib/schemas/site';
import { RechargePreview } from './recharge-preview';
import { ZoneField } from './zone-field';
import { defaultSiteZone } from './zone-offset';

const num = (t: string) => (t.trim() === '' ? null : Number(t));

/** Create and edit a site; errors by the field in the server's words. */
export function SiteForm({ siteId, initial }: { siteId?: number; initial: SiteBody | null }) {
  const router = useRouter();
  const [v, setV] = useState({
    name: initial?.name ?? '', lat: initial ? String(initial.lat) : '', lon: initial ? String(initial.lon) : '', time_zone: initial?.time_zone ?? '',
    // A new site starts at 3°, the low end of where small panels give net charge (see the hint).
    recharge_elevation_deg: String(initial?.recharge_elevation_deg ?? 3), notes: initial?.notes ?? '',
  });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ text: string; bad: boolean } | null>(null);
  const [busy, setBusy] = useState(false);
  useEffect(() => {
    // A new site starts in the browser's own zone, usually the right one in the field (UTC if
    // the browser names none we know); after mount, since the server's zone is not the browser's.
    if (!initial) setV((old) => (old.time_zone ? old : { ...old, time_zone: defaultSiteZone(Intl.DateTimeFormat().resolvedOptions().timeZone) }));
  }, [initial]);
  const set = (key: keyof typeof v) => (e: { target: { value: string } }) => setV((old) => ({ ...old, [key]: e.target.value }));

  async function onSubmit(event: FormEvent) {
    event.preventDefault();
    setBusy(true);
    const body = { name: v.name, lat: num(v.lat), lon: num(v.lon), time_zone: v.time_zone, recharge_elevation_deg: num(v.recharge_elevation_deg), notes: v.notes };
    const res = await apiFetch<{ id: number }>(siteId ? `/api/v1/sites/${siteId}` : '/api/v1/sites', { method: siteId ? 'PUT' : 'POST', body });
    setBusy(false);
    if (!res.ok) {
      setErrors(fieldErrors(res.problem));
      setMessage({ text: res.problem.detail ?? res.problem.title, bad: true });
      return;
    }
    setErrors({});
    if (!siteId) return router.push('/sites');
    setMessage({ text: 'Saved.', bad: false });
    router.refresh();
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex max-w-2xl flex-col gap-4 rounded-xl border border-dusk-700 bg-dusk-900 p-4" data-testid="site-form">
      <Field id="site-name" label="Name" value={v.name} onChange={set('name')} error={errors.name} autoComplete="off" />
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="site-lat" label="Latitude (°)" hint="North positive, e.g. 43.412" inputMode="decimal" value={v.lat} onChange={set('lat')} error={errors.lat} />
        <Field id="site-lon" label="Longitude (°)" hint="East positive, e.g. −117.236" inputMode="decimal" value={v.lon} onChange={set('lon')} error={errors.lon} />
      </div>
      <ZoneField value={v.time_zone} onChange={set('time_zone')} error={errors.time_zone} />
      <Field id="site-elevation" label="Recharge elevation (°)" inputMode="decimal" value={v.recharge_elevation_deg} onChange={set('recharge_elevation_deg')} error={errors.recharge_elevation_deg}
        hint="Sun elevation above which the panel gives net charge. −0.833° is standard sunrise; a small panel gives net charge only a few degrees above, often 3° to 6° (common practice: measure yours). New sites start at 3°." />
      <RechargePreview lat={num(v.lat) ?? NaN} lon={num(v.lon) ?? NaN} elevationDeg={Number(v.recharge_elevation_deg)} timeZone={v.time_zone} />
      <div className="flex flex-col gap-1.5">
        <label htmlFor="site-notes" className="text-sm font-bold">Notes</label>
        <textarea id="site-notes" rows={3} value={v.notes} onChange={set('notes')} className="rounded-md border border-dusk-600 bg-dusk-950 px-3 py-2 text-ink focus:border-tide focus:outline-none" />
        {errors.notes ? <p role="alert" className="text-sm text-hazard">{errors.notes}</p> : null}
      </div>
      {message ? <p role={message.bad ? 'alert' : 'status'} className={`text-sm ${message.bad ? 'text-hazard' : 'text-tide'}`} data-testid="site-form-message">{message.text}</p> : null}
      <div><Button type="submit" disabled={busy} data-testid="site-save">{busy ? 'Saving…' : siteId ? 'Save site' : 'Add site'}</Button></div>
    </form>
  );
}
