import mysql from 'mysql2';
import type { DerivedStatus } from '../status/derive-status';

/**
 * The node's status row after a post, written only if this post's newest reading is not older
 * than the one the row already reflects: two posts of one node committing out of order (two
 * app instances, a store-and-forward backlog beside a live reading) must not leave the status
 * on the older reading. `last_reading_at` is assigned last, because MariaDB lets each later
 * assignment of ON DUPLICATE KEY UPDATE see the columns already changed.
 */
export const STATUS_COLUMNS = ['state', 'volts', 'panel_volts', 'energy_joules', 'soc', 'burst_floor_volts', 'reserve_joules', 'margin', 'load_watts', 'recharge_at', 'brownout_at', 'next_report_s', 'evaluated_at', 'last_reading_at'] as const;

const NEWER = '(node_status.last_reading_at IS NULL OR VALUES(last_reading_at) >= node_status.last_reading_at)';

export function statusUpsert(nodeId: number, orgId: number, status: DerivedStatus): { sql: string; bindings: unknown[] } {
  return statusUpsertRows([{ nodeId, orgId, status }]);
}

/**
 * Several nodes' status rows in one statement (posts committed together), in node order for
 * the same lock order in every transaction. Two rows of one node are applied in turn, each
 * against the row as the one before left it, so the newer reading still wins.
 */
export function statusUpsertRows(rows: { nodeId: number; orgId: number; status: DerivedStatus }[]): { sql: string; bindings: unknown[] } {
  const sorted = [...rows].sort((a, b) => a.nodeId - b.nodeId);
  const sql = `${INSERT_HEAD} ${sorted.map(() => PLACEHOLDER_ROW).join(', ')}${UPDATE_TAIL}`;
  return { sql, bindings: sorted.flatMap(rowValues) };
}

/**
 * The same statement written out, for the ingest hot path: each value escaped on its own by
 * mysql2 (times as UTC) instead of a format pass that scans the whole long statement for
 * placeholders on every post (tests/unit/ingest/status-upsert.test.ts holds the two equal).
 */
export function statusUpsertSql(rows: { nodeId: number; orgId: number; status: DerivedStatus }[]): string {
  const sorted = [...rows].sort((a, b) => a.nodeId - b.nodeId);
  const values = sorted.map((r) => `(${rowValues(r).map((v) => mysql.escape(v, false, 'Z')).join(', ')})`);
  return `${INSERT_HEAD} ${values.join(', ')}${UPDATE_TAIL}`;
}

const rowValues = (r: { nodeId: number; orgId: number; status: DerivedStatus }) => [r.nodeId, r.orgId, ...STATUS_COLUMNS.map((c) => r.status[c])];
const INSERT_HEAD = `INSERT INTO node_status (node_id, org_id, ${STATUS_COLUMNS.join(', ')}) VALUES`;
const PLACEHOLDER_ROW = `(?, ?, ${STATUS_COLUMNS.map(() => '?').join(', ')})`;
const UPDATE_TAIL = `
    ON DUPLICATE KEY UPDATE ${STATUS_COLUMNS.map((c) => `${c} = IF(${NEWER}, VALUES(${c}), ${c})`).join(', ')}`;

/**
 * The same guard for a status row written outside the ingest (the margin pass, a refresh after
 * a settings change), with whatever columns that writer has: a reading stored meanwhile by a
 * post is never overwritten by a status worked out from an older one.
 */
export function guardedStatusUpsert(values: Record<string, unknown>): { sql: string; bindings: unknown[] } {
  const columns = Object.keys(values);
  if (!columns.includes('last_reading_at')) throw new Error('a status row needs last_reading_at');
  const updated = [...columns.filter((c) => c !== 'node_id' && c !== 'org_id' && c !== 'last_reading_at'), 'last_reading_at'];
  const sql = `INSERT INTO node_status (${columns.join(', ')}) VALUES (${columns.map(() => '?').join(', ')})
    ON DUPLICATE KEY UPDATE ${updated.map((c) => `${c} = IF(${NEWER}, VALUES(${c}), ${c})`).join(', ')}`;
  return { sql, bindings: columns.map((c) => values[c]) };
}
