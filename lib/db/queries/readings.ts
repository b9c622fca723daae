import type { Knex } from 'knex';
import { db } from '../knex';
import type { NormalizedReading } from '../../ingest/normalize';

/**
 * Stores a batch for one node, all or nothing. A reading whose (node, t) is already stored —
 * or appears twice in the batch — is a duplicate: counted, never stored twice. Not INSERT
 * IGNORE, which would also swallow real errors and coerce bad values.
 */
export async function storeReadings(
  nodeId: number,
  readings: NormalizedReading[],
  opts: { knex?: Knex; within?: (trx: Knex.Transaction, fresh: NormalizedReading[]) => Promise<void> } = {},
): Promise<{ accepted: number; duplicates: number; stored: NormalizedReading[] }> {
  const knex = opts.knex ?? db();
  for (let attempt = 0; ; attempt++) {
    try {
      // `within` runs in the same transaction (rollups, status): one commit, one fsync, per post.
      return await knex.transaction(async (trx) => {
        const result = await insertNew(trx, nodeId, readings);
        if (opts.within) await opts.within(trx, result.stored);
        return result;
      });
    } catch (e) {
      // A concurrent post of the same reading won the race: on retry it is a duplicate.
      if ((e as { code?: string }).code === 'ER_DUP_ENTRY' && attempt < 2) continue;
      throw e;
    }
  }
}

async function insertNew(trx: Knex.Transaction, nodeId: number, readings: NormalizedReading[]) {
  const unique = new Map<number, NormalizedReading>();
  for (const r of readings) if (!unique.has(r.t.getTime())) unique.set(r.t.getTime(), r);
  const candidates = [...unique.values()];
  // Most posts carry only new readings: insert them in one go. A duplicate key fails the
  // statement alone (the transaction stays usable), and then the slow path sorts them out.
  if (candidates.length <= 500) {
    try {
      await insertRows(trx, nodeId, candidates);
      return { accepted: candidates.length, duplicates: readings.length - candidates.length, stored: candidates };
    } catch (e) {
      if ((e as { code?: string }).code !== 'ER_DUP_ENTRY') throw e;
    }
  }
  const existing = new Set<number>();
  const times = candidates.map((r) => r.t);
  for (let i = 0; i < times.length; i += 500) {
    const rows = await trx('readings').where('node_id', nodeId).whereIn('t', times.slice(i, i + 500)).select('t');
    for (const row of rows) existing.add(new Date(row.t).getTime());
  }
  const fresh = candidates.filter((r) => !existing.has(r.t.getTime()));
  for (let i = 0; i < fresh.length; i += 500) await insertRows(trx, nodeId, fresh.slice(i, i + 500));
  return { accepted: fresh.length, duplicates: readings.length - fresh.length, stored: fresh };
}

function insertRows(trx: Knex.Transaction, nodeId: number, rows: NormalizedReading[]) {
  if (!rows.length) return Promise.resolve();
  return trx('readings').insert(rows.map((r) => ({ node_id: nodeId, t: r.t, v: r.v, vp: r.vp, temp_c: r.temp, rssi_dbm: r.rssi, seq: r.seq })));
}

export async function latestReading(nodeId: number, knex: Knex | Knex.Transaction = db()) {
  return knex('readings').where({ node_id: nodeId }).orderBy('t', 'desc').first('t', 'v', 'vp');
}
