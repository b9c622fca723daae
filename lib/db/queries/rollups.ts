import type { Knex } from 'knex';
import { sqlNumber, sqlUtc } from '../sql-time';

/** Chart rollups: min/max/avg/last per node per 5-minute and 1-hour bucket. */
export const ROLLUP_BUCKETS_SECONDS = [300, 3600] as const;

/** Recomputes the buckets of one node touched since `from` (all of them when omitted). */
export async function rebuildRollups(knex: Knex | Knex.Transaction, nodeId: number, from?: Date, to?: Date): Promise<void> {
  for (const bucket of ROLLUP_BUCKETS_SECONDS) {
    const range: (Date | number)[] = [];
    let where = 'node_id = ?';
    if (from) {
      where += ' AND t >= FROM_UNIXTIME(FLOOR(UNIX_TIMESTAMP(?) / ?) * ?)';
      range.push(from, bucket, bucket);
    }
    if (to) {
      where += ' AND t < FROM_UNIXTIME((FLOOR(UNIX_TIMESTAMP(?) / ?) + 1) * ?)';
      range.push(to, bucket, bucket);
    }
    await knex.raw(
      `INSERT INTO reading_rollups (node_id, bucket_seconds, bucket_start, n, v_min, v_max, v_sum, v_last, t_last, vp_max)
       SELECT node_id, ?, FROM_UNIXTIME(FLOOR(UNIX_TIMESTAMP(t) / ?) * ?) AS b, COUNT(*), MIN(v), MAX(v), SUM(v),
              SUBSTRING_INDEX(GROUP_CONCAT(v ORDER BY t DESC), ',', 1), MAX(t), MAX(vp)
       FROM readings WHERE ${where}
       GROUP BY node_id, b
       ON DUPLICATE KEY UPDATE n = VALUES(n), v_min = VALUES(v_min), v_max = VALUES(v_max), v_sum = VALUES(v_sum),
         v_last = VALUES(v_last), t_last = VALUES(t_last), vp_max = VALUES(vp_max)`,
      [bucket, bucket, bucket, nodeId, ...range],
    );
  }
}

/**
 * Folds freshly stored readings into their buckets in one statement (the hot ingest path).
 * Exact because only new readings are passed: duplicates never reach here.
 */
export async function applyRollupDeltas(trx: Knex | Knex.Transaction, nodeId: number, readings: { t: Date; v: number; vp: number | null }[]): Promise<void> {
  const statement = rollupDeltaStatement(nodeId, readings);
  if (statement) await trx.raw(statement.sql, statement.bindings);
}

export function rollupDeltaStatement(nodeId: number, readings: RollupInput[]): { sql: string; bindings: (number | string | null)[] } | null {
  return rollupDeltaStatementFor([{ nodeId, readings }]);
}

type RollupInput = { t: Date; v: number; vp: number | null };

type Bucket = { node: number; bucket: number; start: number; n: number; min: number; max: number; sum: number; last: number; tLast: number; vpMax: number | null };

/** The buckets a set of posts touches, with their deltas (exported for tests/unit/series/rollup-deltas.test.ts). */
export function deltaRows(posts: { nodeId: number; readings: RollupInput[] }[]): Bucket[] {
  // One map per node and bucket size keyed by the bucket's start second (numbers, not
  // strings: this runs for every reading on the ingest path). A post usually comes in time
  // order, so the bucket of the reading before is tried first, without a map lookup.
  const byNode = new Map<number, Map<number, Bucket>[]>();
  for (const { nodeId, readings } of posts) {
    let bySize = byNode.get(nodeId);
    if (!bySize) byNode.set(nodeId, (bySize = ROLLUP_BUCKETS_SECONDS.map(() => new Map<number, Bucket>())));
    for (let k = 0; k < ROLLUP_BUCKETS_SECONDS.length; k++) {
      const bucket = ROLLUP_BUCKETS_SECONDS[k];
      const buckets = bySize[k];
      let b: Bucket | undefined;
      for (const r of readings) {
        const ms = r.t.getTime();
        const start = Math.floor(ms / 1000 / bucket) * bucket;
        if (b === undefined || b.start !== start) {
          b = buckets.get(start);
          if (!b) {
            b = { node: nodeId, bucket, start, n: 0, min: Infinity, max: -Infinity, sum: 0, last: r.v, tLast: -Infinity, vpMax: null };
            buckets.set(start, b);
          }
        }
        b.n++;
        if (r.v < b.min) b.min = r.v;
        if (r.v > b.max) b.max = r.v;
        b.sum += r.v;
        if (ms > b.tLast) { b.tLast = ms; b.last = r.v; }
        if (r.vp !== null) b.vpMax = b.vpMax === null ? r.vp : Math.max(b.vpMax, r.vp);
      }
    }
  }
  return [...byNode.keys()].sort((a, b) => a - b).flatMap((node) => byNode.get(node)!.flatMap((m) => [...m.values()].sort((a, b) => a.start - b.start)));
}

const DELTA_INSERT = 'INSERT INTO reading_rollups (node_id, bucket_seconds, bucket_start, n, v_min, v_max, v_sum, v_last, t_last, vp_max)';
const DELTA_UPDATE = `ON DUPLICATE KEY UPDATE
       v_last = IF(VALUES(t_last) > t_last, VALUES(v_last), v_last),
       t_last = GREATEST(t_last, VALUES(t_last)),
       n = n + VALUES(n), v_min = LEAST(v_min, VALUES(v_min)), v_max = GREATEST(v_max, VALUES(v_max)),
       v_sum = v_sum + VALUES(v_sum), vp_max = IF(vp_max IS NULL, VALUES(vp_max), GREATEST(vp_max, COALESCE(VALUES(vp_max), vp_max)))`;

/**
 * The deltas of several nodes' fresh readings in one statement (several posts committed
 * together). Rows go in (node, bucket size, start) order, so two transactions that touch the
 * same buckets take their locks in the same order and cannot deadlock on each other.
 */
export function rollupDeltaStatementFor(posts: { nodeId: number; readings: RollupInput[] }[]): { sql: string; bindings: (number | string | null)[] } | null {
  const rows = deltaRows(posts);
  if (!rows.length) return null;
  const placeholders = rows.map(() => '(?, ?, FROM_UNIXTIME(?), ?, ?, ?, ?, ?, ?, ?)').join(', ');
  const bindings = rows.flatMap((b) => [b.node, b.bucket, b.start, b.n, Math.fround(b.min), Math.fround(b.max), b.sum, b.last, sqlUtc(b.tLast), b.vpMax === null ? null : Math.fround(b.vpMax)]);
  return { sql: `${DELTA_INSERT}\n     VALUES ${placeholders}\n     ${DELTA_UPDATE}`, bindings };
}

/**
 * The same statement written out directly, for the ingest hot path: every value is a number
 * the post's validation let through or a time in our own fixed form, so no general escaping
 * pass is needed (tests/unit/series/rollup-sql.test.ts holds it equal to mysql2's `format` of
 * the statement above).
 */
export function rollupDeltaSql(posts: { nodeId: number; readings: RollupInput[] }[]): string | null {
  const rows = deltaRows(posts);
  if (!rows.length) return null;
  let values = '';
  for (const b of rows) {
    values += (values ? ', (' : '(') + sqlNumber(b.node) + ', ' + sqlNumber(b.bucket) + ', FROM_UNIXTIME(' + sqlNumber(b.start) + '), ' + sqlNumber(b.n) + ', '
      + sqlNumber(Math.fround(b.min)) + ', ' + sqlNumber(Math.fround(b.max)) + ', ' + sqlNumber(b.sum) + ', ' + sqlNumber(b.last) + ", '" + sqlUtc(b.tLast) + "', "
      + (b.vpMax === null ? 'NULL' : sqlNumber(Math.fround(b.vpMax))) + ')';
  }
  return `${DELTA_INSERT}\n     VALUES ${values}\n     ${DELTA_UPDATE}`;
}
