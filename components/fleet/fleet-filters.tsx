import { NODE_STATES, type NodeState } from '@/lib/config/node-states';
import type { OrgSite } from '@/lib/db/queries/fleet';
import { SORT_KEYS, type FleetFilter, type SortDirection, type SortKey } from './sort-fleet';

const control = 'rounded-md border border-dusk-600 bg-dusk-950 px-3 py-2 text-sm text-ink focus:border-tide focus:outline-none';

/** Search, site and state filters, and the sort (the phone's only way to sort; the table's headers also sort). */
export function FleetFilters({
  filter,
  onFilter,
  sites,
  sortKey,
  direction,
  onSort,
}: {
  filter: FleetFilter;
  onFilter: (f: FleetFilter) => void;
  sites: Pick<OrgSite, 'id' | 'name'>[];
  sortKey: SortKey;
  direction: SortDirection;
  onSort: (key: SortKey, direction: SortDirection) => void;
}) {
  return (
    <form role="search" aria-label="Filter the fleet" className="mt-6 grid grid-cols-2 gap-3 md:grid-cols-[2fr_1.5fr_1fr_1.5fr]" onSubmit={(e) => e.preventDefault()}>
      <div className="col-span-2 flex flex-col gap-1 md:col-span-1">
        <label htmlFor="fleet-search" className="text-xs font-bold text-ink-muted">Search</label>
        <input id="fleet-search" type="search" value={filter.search} placeholder="Node, purpose or site" className={control}
          onChange={(e) => onFilter({ ...filter, search: e.target.value })} data-testid="fleet-search" />
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="fleet-site" className="text-xs font-bold text-ink-muted">Site</label>
        <select id="fleet-site" value={filter.siteId ?? ''} className={control} data-testid="fleet-site"
          onChange={(e) => onFilter({ ...filter, siteId: e.target.value ? Number(e.target.value) : null })}>
          <option value="">All sites</option>
          {sites.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
        </select>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor="fleet-state" className="text-xs font-bold text-ink-muted">State</label>
        <select id="fleet-state" value={filter.state ?? ''} className={control} data-testid="fleet-state"
          onChange={(e) => onFilter({ ...filter, state: (e.target.value || null) as NodeState | null })}>
          <option value="">All states</option>
          {NODE_STATES.map((s) => <option key={s} value={s}>{s}</option>)}
        </select>
      </div>
      <div className="col-span-2 flex flex-col gap-1 md:col-span-1">
        <label htmlFor="fleet-sort" className="text-xs font-bold text-ink-muted">Sort by</label>
        <div className="flex gap-2">
          <select id="fleet-sort" value={sortKey} className={`${control} min-w-0 flex-1`} data-testid="fleet-sort"
            onChange={(e) => onSort(e.target.value as SortKey, direction)}>
            {(Object.keys(SORT_KEYS) as SortKey[]).map((k) => <option key={k} value={k}>{SORT_KEYS[k]}</option>)}
          </select>
          <button type="button" className={`${control} hover:bg-dusk-800`} onClick={() => onSort(sortKey, direction === 'asc' ? 'desc' : 'asc')}
            aria-label={direction === 'asc' ? 'Ascending; switch to descending' : 'Descending; switch to ascending'}>
            {direction === 'asc' ? '↑' : '↓'}
          </button>
        </div>
      </div>
    </form>
  );
}
