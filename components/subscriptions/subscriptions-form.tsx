'use client';

import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { kindLabel } from '@/lib/alerts/labels';
import { apiFetch, fieldErrors } from '@/lib/client/api';
import { bodyFromRows, rowsFromView, type FormRow, type SubscriptionsView } from './subscription-model';
import { SubscriptionRowEditor } from './subscription-row';

/** The caller's own alert e-mail: which sites and kinds, right away or as a daily digest. Saved whole with PUT. */
export function SubscriptionsForm({ initial, sites, isOwner }: { initial: SubscriptionsView; sites: { id: number; name: string }[]; isOwner: boolean }) {
  const start = rowsFromView(initial);
  const [rows, setRows] = useState<FormRow[]>(start.rows);
  const [usingDefault, setUsingDefault] = useState(start.usingDefault);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ text: string; bad?: boolean } | null>(null);
  const [busy, setBusy] = useState(false);
  const [adding, setAdding] = useState('');
  const nameOf = (siteId: number | null) => (siteId === null ? 'All sites' : sites.find((s) => s.id === siteId)?.name ?? `Site #${siteId}`);
  const free = sites.filter((s) => !rows.some((r) => r.siteId === s.id));

  function edit(index: number, row: FormRow) {
    setRows(rows.map((r, i) => (i === index ? row : r)));
    setMessage(null);
  }

  function addSite() {
    const siteId = Number(adding);
    if (!siteId) return;
    // A new site row starts as a copy of the every-site choice, to be narrowed or widened.
    setRows([...rows, { ...rows[0], kinds: [...rows[0].kinds], siteId }]);
    setAdding('');
  }

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setBusy(true);
    const res = await apiFetch<SubscriptionsView>('/api/v1/subscriptions', { method: 'PUT', body: bodyFromRows(rows) });
    setBusy(false);
    if (!res.ok) {
      setErrors(fieldErrors(res.problem));
      setMessage({ text: res.problem.detail ?? res.problem.title, bad: true });
      return;
    }
    const next = rowsFromView(res.data);
    setRows(next.rows);
    setUsingDefault(next.usingDefault);
    setErrors({});
    setMessage({ text: 'Saved. New alerts reach you as chosen here.' });
  }

  return (
    <form onSubmit={onSubmit} className="mt-6 flex flex-col gap-4" noValidate data-testid="subscriptions-form">
      {usingDefault ? (
        <p className="rounded-lg border border-dusk-600 bg-dusk-900 p-3 text-sm" data-testid="subscriptions-default">
          You have not chosen yet, so the owner default applies: <b>{initial.defaults[0]?.kinds.map(kindLabel).join(', ').toLowerCase()}</b> alerts from every site, <b>right away</b>. It is shown below; save to make it your own choice.
        </p>
      ) : null}
      {!usingDefault && !isOwner && initial.subscriptions.length === 0 && rows.every((r) => r.kinds.length === 0) ? (
        <p className="rounded-lg border border-dusk-600 bg-dusk-900 p-3 text-sm">No alert e-mail reaches you yet. Tick the kinds you want below and save.</p>
      ) : null}

      {rows.map((row, i) => (
        <SubscriptionRowEditor key={row.siteId ?? 'all'} row={row} index={i} siteName={nameOf(row.siteId)} errors={errors}
          onChange={(r) => edit(i, r)} onRemove={row.siteId === null ? undefined : () => setRows(rows.filter((_, j) => j !== i))} />
      ))}

      {free.length ? (
        <div className="flex flex-wrap items-end gap-2">
          <div className="flex flex-col gap-1">
            <label htmlFor="sub-add-site" className="text-xs font-bold text-ink-muted">A site with its own choice</label>
            <select id="sub-add-site" value={adding} onChange={(e) => setAdding(e.target.value)} className="rounded-md border border-dusk-600 bg-dusk-950 px-3 py-2 text-sm">
              <option value="">Choose a site…</option>
              {free.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
            </select>
          </div>
          <Button type="button" tone="quiet" onClick={addSite} disabled={!adding}>Add site</Button>
        </div>
      ) : null}

      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" disabled={busy} data-testid="subscriptions-save">{busy ? 'Saving…' : 'Save'}</Button>
        <p role="status" aria-live="polite" className={`text-sm ${message?.bad ? 'text-hazard' : 'text-tide'}`} data-testid="subscriptions-message">{message?.text}</p>
      </div>
    </form>
  );
}
