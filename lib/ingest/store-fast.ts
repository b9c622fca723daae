import mysql from 'mysql2/promise';
import { fastPool } from '../db/fast-pool';
import { rollupDeltaStatement } from '../db/queries/rollups';
import { sqlUtc } from '../db/sql-time';
import type { DerivedStatus } from '../status/derive-status';
import type { NormalizedReading } from './normalize';
import { statusUpsert } from './status-upsert';

/**
 * The optimistic path of a post whose readings are all new (the usual case): readings,
 * rollup deltas and the node status in one transaction sent as one packet. A duplicate key
 * rolls the whole packet back and answers `false`: the caller then takes the careful path.
 */
// Dates are written as UTC, as everywhere else in the schema.
const format = (sql: string, values: unknown[]) => mysql.format(sql, values as Parameters<typeof mysql.format>[1], false, 'Z');

const OPTIONAL = [['vp', 'vp'], ['temp', 'temp_c'], ['rssi', 'rssi_dbm'], ['seq', 'seq']] as const;

/** A finite number as an SQL literal; anything else is refused (never reached: validated). */
function num(x: number): string {
  if (!Number.isFinite(x)) throw new TypeError('not a finite number');
  return String(x);
}

/**
 * The readings' multi-row INSERT, written directly: every value is a validated finite number
 * (checked again here) or a time in our own fixed 'YYYY-MM-DD hh:mm:ss.mmm' form, so no
 * general escaping pass is needed over tens of kilobytes. Optional columns that no reading of
 * the post carries are left out (they default to NULL), which keeps the statement short.
 */
export function readingsInsert(nodeId: number, readings: NormalizedReading[]): string {
  const present = OPTIONAL.filter(([key]) => readings.some((r) => r[key] !== null));
  const node = num(nodeId);
  const values = readings.map((r) => {
    let row = `(${node}, '${sqlUtc(r.t.getTime())}', ${num(r.v)}`;
    for (const [key] of present) row += r[key] === null ? ', NULL' : `, ${num(r[key] as number)}`;
    return row + ')';
  });
  return `INSERT INTO readings (node_id, t, v${present.map(([, column]) => `, ${column}`).join('')}) VALUES ${values.join(', ')}`;
}

export async function storeAllNew(opts: { nodeId: number; orgId: number; readings: NormalizedReading[]; status: DerivedStatus | null }): Promise<boolean> {
  const { nodeId, orgId, readings, status } = opts;
  const parts: string[] = ['START TRANSACTION'];
  parts.push(readingsInsert(nodeId, readings));
  const rollup = rollupDeltaStatement(nodeId, readings);
  if (rollup) parts.push(format(rollup.sql, rollup.bindings));
  if (status) {
    const upsert = statusUpsert(nodeId, orgId, status);
    parts.push(format(upsert.sql, upsert.bindings));
  }
  parts.push('COMMIT');
  const conn = await fastPool().getConnection();
  try {
    await conn.query(parts.join(';\n'));
    return true;
  } catch (e) {
    // Whatever failed, nothing of this packet may stay: the open transaction is rolled back.
    await conn.query('ROLLBACK').catch(() => conn.destroy());
    if ((e as { code?: string }).code === 'ER_DUP_ENTRY') return false;
    throw e;
  } finally {
    conn.release();
  }
}
