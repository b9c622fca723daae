import { fastPool } from '../db/fast-pool';
import { rollupDeltaSql } from '../db/queries/rollups';
import { sqlNumber, sqlUtc } from '../db/sql-time';
import type { DerivedStatus } from '../status/derive-status';
import type { NormalizedReading } from './normalize';
import { Coalescer } from './coalesce';
import { statusUpsertSql } from './status-upsert';

/**
 * The optimistic path of a post whose readings are all new (the usual case): readings,
 * rollup deltas and the node status in one transaction sent as one packet. A duplicate key
 * rolls the whole packet back and answers `false`: the caller then takes the careful path.
 */
const OPTIONAL = [['vp', 'vp'], ['temp', 'temp_c'], ['rssi', 'rssi_dbm'], ['seq', 'seq']] as const;

/**
 * The readings' multi-row INSERT, written directly: every value is a validated finite number
 * (checked again here) or a time in our own fixed 'YYYY-MM-DD hh:mm:ss.mmm' form, so no
 * general escaping pass is needed over tens of kilobytes. Optional columns that no reading of
 * the post carries are left out (they default to NULL), which keeps the statement short.
 */
export function readingsInsert(nodeId: number, readings: NormalizedReading[]): string {
  return readingsInsertFor([{ nodeId, readings }]);
}

/** The same for several posts (several nodes) in one statement. */
export function readingsInsertFor(posts: { nodeId: number; readings: NormalizedReading[] }[]): string {
  const present = OPTIONAL.filter(([key]) => posts.some((p) => p.readings.some((r) => r[key] !== null)));
  // One string grown row by row, with no array of row texts to join: for 500 rows it was a
  // little faster than the join, counting the flattening when the text is written (measured
  // in isolation).
  let sql = `INSERT INTO readings (node_id, t, v${present.map(([, column]) => `, ${column}`).join('')}) VALUES `;
  let first = true;
  for (const { nodeId, readings } of posts) {
    const node = sqlNumber(nodeId);
    for (const r of readings) {
      sql += (first ? '(' : ', (') + node + ", '" + sqlUtc(r.t.getTime()) + "', " + sqlNumber(r.v);
      for (const [key] of present) sql += r[key] === null ? ', NULL' : ', ' + sqlNumber(r[key] as number);
      sql += ')';
      first = false;
    }
  }
  return sql;
}

export interface NewPost { nodeId: number; orgId: number; readings: NormalizedReading[]; status: DerivedStatus | null }

/** One post on its own: `true` when stored, `false` when a reading was already there. */
export async function storeAllNew(post: NewPost): Promise<boolean> {
  try {
    await commitPacket([post]);
    return true;
  } catch (e) {
    if ((e as { code?: string }).code === 'ER_DUP_ENTRY') return false;
    throw e;
  }
}

/**
 * The same, carried with the other posts that arrive while the database is busy: one packet,
 * one transaction, one log flush for all of them (lib/ingest/coalesce.ts). If the shared
 * transaction fails for any reason (a duplicate in one post, a deadlock), nothing of it stays
 * and each post is tried again on its own, so one device's duplicate never costs another's
 * reading and every answer still means "committed".
 */
const groups = new Coalescer<NewPost, boolean>(storeGroup, { maxInFlight: 8, maxWeight: 2000, weight: (p) => p.readings.length });

export function storeAllNewGrouped(post: NewPost): Promise<boolean> {
  return groups.submit(post);
}

async function storeGroup(posts: NewPost[]): Promise<boolean[]> {
  if (posts.length === 1) return [await storeAllNew(posts[0])];
  try {
    await commitPacket(posts);
    return posts.map(() => true);
  } catch {
    return Promise.all(posts.map((post) => storeAllNew(post)));
  }
}

async function commitPacket(posts: NewPost[]): Promise<void> {
  const parts: string[] = ['START TRANSACTION'];
  parts.push(readingsInsertFor(posts));
  const rollup = rollupDeltaSql(posts);
  if (rollup) parts.push(rollup);
  const statuses = posts.flatMap((p) => (p.status ? [{ nodeId: p.nodeId, orgId: p.orgId, status: p.status }] : []));
  if (statuses.length) parts.push(statusUpsertSql(statuses));
  parts.push('COMMIT');
  const conn = await fastPool().getConnection();
  try {
    await conn.query(parts.join(';\n'));
  } catch (e) {
    // Whatever failed, nothing of this packet may stay: the open transaction is rolled back.
    await conn.query('ROLLBACK').catch(() => conn.destroy());
    throw e;
  } finally {
    conn.release();
  }
}
