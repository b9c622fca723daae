'use client';

import { useState } from 'react';
import { formatAge } from '@/lib/format/units';
import type { AlertWire } from './alert-wire';
import { AlertCard } from './alert-card';
import { AlertFiltersForm } from './alert-filters';
import { AlertsEmpty, AlertsError, AlertsLoading } from './alerts-states';
import { DEFAULT_FILTERS, isFiltered, searchFromFilters, type AlertFilters } from './filter-params';
import { OutboxPanel } from './outbox-panel';
import { StatusTabs } from './status-tabs';
import { ALERTS_POLL_MS, useAlerts } from './use-alerts';

const PANEL_ID = 'alerts-panel';

/** The alerts page after the server's first paint: tabs by status, filters, live list, the owners' outbox. */
export function AlertsBoard({ initial, sites, canAcknowledge, isOwner, orgTimeZone }: {
  initial: { filters: AlertFilters; alerts: AlertWire[]; at: string };
  sites: { id: number; name: string }[];
  canAcknowledge: boolean;
  isOwner: boolean;
  orgTimeZone: string;
}) {
  const [filters, setFiltersState] = useState<AlertFilters>(initial.filters);
  const [message, setMessage] = useState<string | null>(null);
  const query = useAlerts({ filters, initial });
  const alerts = query.data;

  function setFilters(next: AlertFilters) {
    setFiltersState(next);
    setMessage(null);
    // The address follows the filters (a link or a reload shows the same list) without a server round trip.
    window.history.replaceState(null, '', `/alerts?${searchFromFilters(next)}`);
  }

  return (
    <section>
      <h1 className="text-2xl font-bold">Alerts</h1>
      <p className="mt-1 text-xs text-ink-muted" role="status" aria-live="polite" data-testid="alerts-freshness">
        {query.isError && alerts
          ? <span className="text-hazard">Live refresh failed ({query.error.message}); list as of {formatAge(new Date(query.dataUpdatedAt))}. Retrying.</span>
          : <>The list refreshes every {ALERTS_POLL_MS / 1000} s{query.isFetching ? ' — refreshing…' : ''}. Times are each site&apos;s own.</>}
      </p>

      <StatusTabs value={filters.status} onChange={(status) => setFilters({ ...filters, status })} panelId={PANEL_ID} />
      <div role="tabpanel" id={PANEL_ID} aria-labelledby={`alerts-tab-${filters.status}`}>
        <AlertFiltersForm filters={filters} onFilters={setFilters} sites={sites} nodeName={alerts?.[0]?.node_name ?? null} />
        <p className="mt-3 min-h-5 text-sm text-tide" role="status" aria-live="polite" data-testid="alerts-message">{message}</p>
        {alerts === undefined ? (
          query.isError ? <AlertsError message={query.error.message} retry={() => query.refetch()} /> : <AlertsLoading />
        ) : alerts.length === 0 ? (
          <AlertsEmpty status={filters.status} filtered={isFiltered(filters)} clear={() => setFilters({ ...DEFAULT_FILTERS, status: filters.status })} />
        ) : (
          <>
            <p className="text-xs text-ink-muted" data-testid="alerts-count">{alerts.length} {alerts.length === 1 ? 'alert' : 'alerts'}{alerts.length >= 200 ? ' (the newest 200)' : ''}</p>
            <ul className="mt-2 flex flex-col gap-3" aria-label={`${filters.status} alerts`}>
              {alerts.map((a) => (
                <li key={a.id}><AlertCard alert={a} canAcknowledge={canAcknowledge} isOwner={isOwner} onMessage={setMessage} /></li>
              ))}
            </ul>
          </>
        )}
      </div>

      {isOwner ? <OutboxPanel timeZone={orgTimeZone} /> : null}
    </section>
  );
}
