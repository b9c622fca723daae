'use client';

import { useQuery } from '@tanstack/react-query';
import { KIND_INFO, type AlertKind } from '@/lib/alerts/kinds';
import { formatLocal } from './local-time';

/**
 * This node's alerts, newest first. The alerts API may not know the `node` filter yet (or not
 * exist on an older server): any refusal reads as "nothing to show", and rows of other nodes
 * are dropped here as well, so the panel never shows another node's alert.
 */
interface AlertItem {
  id: number;
  node_id: number;
  kind: AlertKind;
  status: 'open' | 'acknowledged' | 'resolved';
  opened_at: string;
}

async function fetchNodeAlerts(nodeId: number, signal: AbortSignal): Promise<AlertItem[] | null> {
  const res = await fetch(`/api/v1/alerts?node=${nodeId}`, { credentials: 'same-origin', signal, headers: { accept: 'application/json' } }).catch(() => null);
  if (!res || !res.ok) return null;
  const body = (await res.json().catch(() => null)) as { alerts?: AlertItem[] } | null;
  return (body?.alerts ?? []).filter((a) => a.node_id === nodeId);
}

const STATUS_STYLE: Record<AlertItem['status'], string> = {
  open: 'border-hazard/60 text-hazard',
  acknowledged: 'border-dusk-600 text-ink-muted',
  resolved: 'border-dusk-700 text-ink-faint',
};

export function AlertsPanel({ nodeId, timeZone }: { nodeId: number; timeZone: string }) {
  const { data, isPending } = useQuery({ queryKey: ['node-alerts', nodeId], queryFn: ({ signal }) => fetchNodeAlerts(nodeId, signal), refetchInterval: 60_000, retry: false });
  const alerts = (data ?? []).slice(0, 8);
  return (
    <section aria-labelledby="alerts-heading" className="rounded-lg border border-dusk-800 bg-dusk-900/60 p-4" data-testid="node-alerts">
      <h2 id="alerts-heading" className="text-base font-bold">Alerts</h2>
      {isPending ? <p className="mt-2 text-sm text-ink-faint">Loading…</p> : null}
      {!isPending && alerts.length === 0 ? (
        <p className="mt-2 text-sm text-ink-muted" data-testid="alerts-empty">{data === null ? 'No alerts to show for this node.' : 'No alerts for this node.'}</p>
      ) : null}
      {alerts.length > 0 ? (
        <ul className="mt-2 grid gap-2">
          {alerts.map((a) => (
            <li key={a.id} className="text-sm" data-testid="node-alert">
              <span className={`mr-2 inline-block rounded border px-1.5 text-[11px] uppercase tracking-wider ${STATUS_STYLE[a.status]}`}>{a.status}</span>
              <span className="text-ink">{KIND_INFO[a.kind]?.title ?? a.kind}</span>
              <span className="figures block text-xs text-ink-faint">opened {formatLocal(new Date(a.opened_at).getTime() / 1000, timeZone, 'EEE d MMM HH:mm')}</span>
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
