import { ALERT_KINDS, ALERT_STATUSES, type AlertKind, type AlertStatus } from '@/lib/alerts/kinds';
import { NODE_STATES, type NodeState } from '@/lib/config/node-states';

/**
 * The alerts page's filters, kept in the address (/alerts?status=acknowledged&site=3) so a
 * filtered list can be linked to, e.g. from a node page with ?node=ID. Pure: the server page
 * reads the first paint from it and the board the API path.
 */
export interface AlertFilters {
  status: AlertStatus;
  siteId: number | null;
  kind: AlertKind | null;
  nodeState: NodeState | null;
  nodeId: number | null;
}

export const DEFAULT_FILTERS: AlertFilters = { status: 'open', siteId: null, kind: null, nodeState: null, nodeId: null };

type Search = Record<string, string | string[] | undefined>;

function first(value: string | string[] | undefined): string | undefined {
  return Array.isArray(value) ? value[0] : value;
}

function positiveId(value: string | undefined): number | null {
  const n = Number(value);
  return value && Number.isSafeInteger(n) && n > 0 ? n : null;
}

function oneOf<T extends string>(list: readonly T[], value: string | undefined): T | null {
  return value && (list as readonly string[]).includes(value) ? (value as T) : null;
}

/** Unknown or malformed values fall back to "any", so an old link still opens the page. */
export function filtersFromSearch(search: Search): AlertFilters {
  return {
    status: oneOf(ALERT_STATUSES, first(search.status)) ?? 'open',
    siteId: positiveId(first(search.site)),
    kind: oneOf(ALERT_KINDS, first(search.kind)),
    nodeState: oneOf(NODE_STATES, first(search.node_state)),
    nodeId: positiveId(first(search.node)),
  };
}

/** The query string both for the address bar and for GET /api/v1/alerts. */
export function searchFromFilters(filters: AlertFilters): string {
  const params = new URLSearchParams({ status: filters.status });
  if (filters.siteId) params.set('site', String(filters.siteId));
  if (filters.kind) params.set('kind', filters.kind);
  if (filters.nodeState) params.set('node_state', filters.nodeState);
  if (filters.nodeId) params.set('node', String(filters.nodeId));
  return params.toString();
}

export function isFiltered(filters: AlertFilters): boolean {
  return filters.siteId !== null || filters.kind !== null || filters.nodeState !== null || filters.nodeId !== null;
}
