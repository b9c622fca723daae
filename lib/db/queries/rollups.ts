import type { Knex } from 'knex';

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
