'use client';

import Link from 'next/link';
import { useMemo, useState } from 'react';
import type { FleetView, OrgSite } from '@/lib/db/queries/fleet';
import { formatAge } from '@/lib/format/units';
import { FleetCards } from './fleet-cards';
import { FleetFilters } from './fleet-filters';
import { FleetSocChart } from './fleet-soc-chart';
import { FleetSummary } from './fleet-summary';
import { FleetTable } from './fleet-table';
import { filterFleet, sortFleet, type FleetFilter, type SortDirection, type SortKey } from './sort-fleet';
import { FLEET_POLL_MS, useFleet } from './use-fleet';

/** The fleet page after the server's first paint: polling, filters, sort, table or cards, chart. */
export function FleetBoard({ initial, sites, canAddNode }: { initial: FleetView; sites: Pick<OrgSite, 'id' | 'name'>[]; canAddNode: boolean }) {
  const query = useFleet(initial);
  const view = query.data;
  const [filter, setFilter] = useState<FleetFilter>({ siteId: null, state: null, search: '' });
  const [sort, setSort] = useState<{ key: SortKey; direction: SortDirection }>({ key: 'risk', direction: 'asc' });
  const shown = useMemo(
    () => sortFleet({ nodes: filterFleet({ nodes: view.nodes, filter }), key: sort.key, direction: sort.direction }),
    [view.nodes, filter, sort],
  );
  const onSort = (key: SortKey, direction: SortDirection) => setSort({ key, direction });
  const filtered = filter.siteId != null || filter.state != null || filter.search.trim() !== '';

  return (
    <section>
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">Who makes it through tonight?</h1>
          <p className="mt-1 text-xs text-ink-muted" role="status" aria-live="polite" data-testid="fleet-freshness">
            {query.isError
              ? <span className="text-hazard">Live refresh failed ({query.error.message}); figures as of {formatAge(view.generated_at)}. Retrying.</span>
              : <>Figures refresh every {FLEET_POLL_MS / 1000} s{query.isFetching ? ' — refreshing…' : ''}.</>}
          </p>
        </div>
        {canAddNode ? (
          <Link href="/nodes/new" className="rounded-md bg-ember px-4 py-2 text-sm font-bold text-dusk-950 hover:opacity-90" data-testid="add-node">
            Add node
          </Link>
        ) : null}
      </div>

      <FleetSummary view={view} state={filter.state} onState={(state) => setFilter({ ...filter, state })} />

      {view.nodes.length === 0 ? (
        <div className="mt-8 rounded-xl border border-dashed border-dusk-600 p-8 text-center" data-testid="fleet-empty">
          <p className="font-bold">No nodes yet.</p>
          <p className="mt-1 text-sm text-ink-muted">
            {canAddNode ? 'Add the first node of a site to see its night margin here.' : 'A deployer or owner adds nodes; they appear here as soon as they report.'}
          </p>
        </div>
      ) : (
        <>
          <FleetFilters filter={filter} onFilter={setFilter} sites={sites} sortKey={sort.key} direction={sort.direction} onSort={onSort} />
          <p className="mt-3 text-xs text-ink-muted" data-testid="fleet-shown">
            {shown.length} of {view.nodes.length} nodes{filtered ? ' match' : ''}
          </p>
          {shown.length === 0 ? (
            <div className="mt-4 rounded-xl border border-dashed border-dusk-600 p-6 text-center text-sm" data-testid="fleet-no-match">
              <p>No node matches these filters.</p>
              <button type="button" className="mt-2 underline underline-offset-2" onClick={() => setFilter({ siteId: null, state: null, search: '' })}>Clear the filters</button>
            </div>
          ) : (
            <>
              <FleetTable nodes={shown} now={view.generated_at} sortKey={sort.key} direction={sort.direction} onSort={onSort} />
              <FleetCards nodes={shown} now={view.generated_at} />
            </>
          )}
          <FleetSocChart hours={48} />
        </>
      )}
    </section>
  );
}
