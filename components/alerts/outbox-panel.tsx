'use client';

import type { OutboxWire } from './alert-wire';
import { SiteTime } from './site-time';
import { useOutbox } from './use-alerts';

/**
 * Owners: every e-mail of the organization, the ones needing attention first — dead letters
 * with the relay's error, held mail with when it goes, retries with their next attempt — and
 * the recently sent folded away. No bodies (invitations and resets carry one-time links).
 */
const PURPOSE: Record<OutboxWire['purpose'], string> = { alert: 'alert', digest: 'daily digest', invitation: 'invitation', password_reset: 'password reset' };

type Bucket = 'dead' | 'held' | 'pending' | 'sent';
const bucketOf = (m: OutboxWire): Bucket => (m.status === 'pending' ? (m.held ? 'held' : 'pending') : m.status);

export function OutboxPanel({ timeZone }: { timeZone: string }) {
  const query = useOutbox({ enabled: true });
  const messages = query.data ?? [];
  const by = (b: Bucket) => messages.filter((m) => bucketOf(m) === b);
  const attention = [...by('dead'), ...by('held'), ...by('pending')];
  const sent = by('sent');
  return (
    <section aria-labelledby="outbox-heading" className="mt-10 rounded-xl border border-dusk-700 bg-dusk-900/60 p-4" data-testid="outbox-panel">
      <h2 id="outbox-heading" className="text-lg font-bold">Outbox</h2>
      <p className="mt-1 text-xs text-ink-muted">Every e-mail of the organization, owners only. Times in {timeZone}.</p>
      {query.isPending ? <p className="mt-3 text-sm text-ink-muted" role="status">Loading the outbox…</p> : null}
      {query.isError ? <p className="mt-3 text-sm text-hazard" role="alert">The outbox could not be loaded ({query.error.message}). Retrying.</p> : null}
      {query.isSuccess ? (
        <>
          <p className="figures mt-3 flex flex-wrap gap-x-4 text-sm" data-testid="outbox-counts">
            <span>{by('dead').length} dead</span><span>{by('held').length} held</span><span>{by('pending').length} pending</span><span>{sent.length} sent</span>
          </p>
          {attention.length === 0 ? (
            <p className="mt-3 text-sm text-ink-muted">Nothing waiting and nothing failed.</p>
          ) : (
            <ul className="mt-3 flex flex-col gap-2">{attention.map((m) => <OutboxItem key={m.id} message={m} timeZone={timeZone} />)}</ul>
          )}
          {sent.length ? (
            <details className="mt-3">
              <summary className="cursor-pointer text-sm font-bold">Sent ({sent.length})</summary>
              <ul className="mt-2 flex flex-col gap-2">{sent.map((m) => <OutboxItem key={m.id} message={m} timeZone={timeZone} />)}</ul>
            </details>
          ) : null}
        </>
      ) : null}
    </section>
  );
}

function OutboxItem({ message: m, timeZone }: { message: OutboxWire; timeZone: string }) {
  const bucket = bucketOf(m);
  return (
    <li className={`rounded-lg border bg-dusk-950/60 p-3 text-sm ${bucket === 'dead' ? 'border-hazard/70' : 'border-dusk-700'}`} data-testid="outbox-item" data-bucket={bucket}>
      <div className="flex flex-wrap items-baseline justify-between gap-x-3">
        <p className="min-w-0 break-words font-bold">{m.subject}</p>
        <p className={`text-xs font-bold uppercase tracking-[0.14em] ${bucket === 'dead' ? 'text-hazard' : 'text-ink-muted'}`}>{bucket}</p>
      </div>
      <p className="break-all text-xs text-ink-muted">{PURPOSE[m.purpose] ?? m.purpose} to {m.to_address} · written <SiteTime at={m.created_at} timeZone={timeZone} /> · {m.attempts} {m.attempts === 1 ? 'attempt' : 'attempts'}</p>
      {bucket === 'sent' ? <p className="text-xs text-ink-muted">Sent <SiteTime at={m.sent_at} timeZone={timeZone} /></p> : null}
      {bucket === 'held' ? <p className="text-xs">Held by the hourly cap; goes out from <SiteTime at={m.next_attempt_at} timeZone={timeZone} /></p> : null}
      {bucket === 'pending' ? <p className="text-xs">Next attempt <SiteTime at={m.next_attempt_at} timeZone={timeZone} /></p> : null}
      {m.last_error && bucket !== 'held' && bucket !== 'sent' ? (
        <p className="mt-1 break-words text-xs"><span className="font-bold">Error:</span> <span className="figures">{m.last_error}</span></p>
      ) : null}
    </li>
  );
}
