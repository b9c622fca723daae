'use client';

import { ALERT_KINDS, type AlertKind } from '@/lib/alerts/kinds';
import { KIND_LABELS } from '@/lib/alerts/labels';
import { NODE_STATES, type NodeState } from '@/lib/config/node-states';
import type { AlertFilters } from './filter-params';

const control = 'w-full rounded-md border border-dusk-600 bg-dusk-950 px-3 py-2 text-sm text-ink focus:border-tide focus:outline-none';

/** Site, kind and the node's state now; a node filter (from a node page's link) shows as a removable chip. */
export function AlertFiltersForm({ filters, onFilters, sites, nodeName }: {
  filters: AlertFilters;
  onFilters: (f: AlertFilters) => void;
  sites: { id: number; name: string }[];
  nodeName: string | null;
}) {
  return (
    <form role="search" aria-label="Filter the alerts" className="mt-4 grid grid-cols-2 gap-3 md:grid-cols-3" onSubmit={(e) => e.preventDefault()}>
      <div className="col-span-2 flex flex-col gap-1 md:col-span-1">
        <label htmlFor="alerts-site" className="text-xs font-bold text-ink-muted">Site</label>
        <select id="alerts-site" value={filters.siteId ?? ''} className={control} data-testid="alerts-site"
          onChange={(e) => onFilters({ ...filters, siteId: e.target.value ? Number(e.target.value) : null })}>
          <option value="">All sites</option>
          {sites.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
        </select>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="alerts-kind" className="text-xs font-bold text-ink-muted">Kind</label>
        <select id="alerts-kind" value={filters.kind ?? ''} className={control} data-testid="alerts-kind"
          onChange={(e) => onFilters({ ...filters, kind: (e.target.value || null) as AlertKind | null })}>
          <option value="">All kinds</option>
          {ALERT_KINDS.map((k) => <option key={k} value={k}>{KIND_LABELS[k].label}</option>)}
        </select>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="alerts-node-state" className="text-xs font-bold text-ink-muted">Node state now</label>
        <select id="alerts-node-state" value={filters.nodeState ?? ''} className={control} data-testid="alerts-node-state"
          onChange={(e) => onFilters({ ...filters, nodeState: (e.target.value || null) as NodeState | null })}>
          <option value="">Any state</option>
          {NODE_STATES.map((s) => <option key={s} value={s}>{s}</option>)}
        </select>
      </div>
      {filters.nodeId ? (
        <p className="col-span-2 flex flex-wrap items-center gap-2 text-sm md:col-span-3">
          <span className="text-ink-muted">Only node</span>
          <span className="font-bold">{nodeName ?? `#${filters.nodeId}`}</span>
          <button type="button" className="rounded-md border border-dusk-600 px-2 py-0.5 text-xs hover:bg-dusk-800" onClick={() => onFilters({ ...filters, nodeId: null })}>
            Show every node
          </button>
        </p>
      ) : null}
    </form>
  );
}
