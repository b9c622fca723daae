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

export async function storeAllNew(opts: { nodeId: number; orgId: number; readings: NormalizedReading[]; status: DerivedStatus | null }): Promise<boolean> {
  const { nodeId, orgId, readings, status } = opts;
  const parts: string[] = ['START TRANSACTION'];
  const rows = readings.map((r) => [nodeId, sqlUtc(r.t.getTime()), r.v, r.vp, r.temp, r.rssi, r.seq]);
  parts.push(format('INSERT INTO readings (node_id, t, v, vp, temp_c, rssi_dbm, seq) VALUES ?', [rows]));
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
