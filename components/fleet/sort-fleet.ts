import { NODE_STATE_INFO, type NodeState } from '@/lib/config/node-states';
import type { FleetNodeWire } from '@/lib/db/queries/fleet';

/** Sorting and filtering of the fleet table, pure so the board and its tests share it. */
export const SORT_KEYS = {
  risk: 'Most at risk',
  name: 'Name',
  site: 'Site',
  volts: 'Bank volts',
  soc: 'State of charge',
  reserve: 'Reserve',
  margin: 'Night margin',
  brownout: 'Projected brownout',
  age: 'Last reading',
  draw: 'Measured ÷ modelled draw',
} as const;
export type SortKey = keyof typeof SORT_KEYS;
export type SortDirection = 'asc' | 'desc';

export interface FleetFilter {
  siteId: number | null;
  state: NodeState | null;
  search: string;
}

// Missing values are split off before sorting (they go last in either direction).
const byNumber = (pick: (n: FleetNodeWire) => number | null) => (a: FleetNodeWire, b: FleetNodeWire) => (pick(a) ?? 0) - (pick(b) ?? 0);

const time = (iso: string | null) => (iso ? Date.parse(iso) : null);

const comparators: Record<SortKey, (a: FleetNodeWire, b: FleetNodeWire) => number> = {
  risk: (a, b) =>
    NODE_STATE_INFO[a.state].riskRank - NODE_STATE_INFO[b.state].riskRank ||
    (a.margin ?? Number.POSITIVE_INFINITY) - (b.margin ?? Number.POSITIVE_INFINITY),
  name: (a, b) => a.name.localeCompare(b.name),
  site: (a, b) => a.site_name.localeCompare(b.site_name),
  volts: byNumber((n) => n.volts),
  soc: byNumber((n) => n.soc),
  reserve: byNumber((n) => n.reserve_joules),
  margin: byNumber((n) => n.margin),
  brownout: byNumber((n) => time(n.brownout_at)),
  age: byNumber((n) => time(n.last_reading_at)),
  draw: byNumber((n) => n.draw_ratio),
};

const valueOf: Partial<Record<SortKey, (n: FleetNodeWire) => unknown>> = {
  volts: (n) => n.volts, soc: (n) => n.soc, reserve: (n) => n.reserve_joules, margin: (n) => n.margin,
  brownout: (n) => n.brownout_at, age: (n) => n.last_reading_at, draw: (n) => n.draw_ratio,
};

function isMissing(key: SortKey, n: FleetNodeWire): boolean {
  const pick = valueOf[key];
  return pick ? pick(n) == null : false;
}

export function sortFleet({ nodes, key, direction }: { nodes: FleetNodeWire[]; key: SortKey; direction: SortDirection }): FleetNodeWire[] {
  const present = nodes.filter((n) => !isMissing(key, n));
  const missing = nodes.filter((n) => isMissing(key, n));
  const sign = direction === 'asc' ? 1 : -1;
  const sorted = [...present].sort((a, b) => sign * comparators[key](a, b) || a.name.localeCompare(b.name));
  return [...sorted, ...missing.sort((a, b) => a.name.localeCompare(b.name))];
}

export function filterFleet({ nodes, filter }: { nodes: FleetNodeWire[]; filter: FleetFilter }): FleetNodeWire[] {
  const needle = filter.search.trim().toLowerCase();
  return nodes.filter(
    (n) =>
      (filter.siteId == null || n.site_id === filter.siteId) &&
      (filter.state == null || n.state === filter.state) &&
      (needle === '' || `${n.name} ${n.purpose} ${n.site_name}`.toLowerCase().includes(needle)),
  );
}
