import { existsSync, statSync } from 'node:fs';
import path from 'node:path';
import type { Knex } from 'knex';
import { loadSecrets, type Profile } from '@/db/lifecycle/profile';
import { dropPartitions, listReadingPartitions } from '@/lib/db/queries/partitions';
import { getEnv } from '@/lib/env';
import { describeRetention, openMaintenanceKnex, runRetentionPass } from '@/lib/jobs/retention-pass';
import type { Row } from './run';

/**
 * Retention of raw readings: what dropping a month partition buys over deleting the same rows,
 * measured in one run on a scratch copy of the readings table (CREATE TABLE … LIKE keeps the
 * month partitions), then the product's retention pass on the bench's own readings table.
 */
const TABLE = 'readings_retention_bench';
const ROWS_PER_MONTH = 1_000_000;
const NODES = 100;
const DAY_MS = 86_400_000;

export async function retentionBenches(ctx: { profile: Profile; root: Knex }): Promise<Row[]> {
  return [...(await dropVersusDelete(ctx)), await passOnReadings(ctx)];
}

export async function dropVersusDelete({ profile, root }: { profile: Pick<Profile, 'mysqlDir' | 'dbName'>; root: Knex }): Promise<Row[]> {
  await root.raw(`DROP TABLE IF EXISTS ${TABLE}`);
  await root.raw(`CREATE TABLE ${TABLE} LIKE readings`);
  try {
    // Two whole months of at least 30 days (a lower bound is the previous partition's upper one).
    const parts = await listReadingPartitions(root, TABLE);
    const months = parts.slice(1)
      .map((p, i) => ({ name: p.name, from: parts[i].lessThan!, to: p.lessThan }))
      .filter((m): m is { name: string; from: Date; to: Date } => m.to !== null && m.to.getTime() - m.from.getTime() >= 30 * DAY_MS)
      .slice(0, 2);
    if (months.length < 2) throw new Error('the readings table has fewer than two whole month partitions');
    const stepSeconds = Math.floor((30 * DAY_MS) / 1000 / (ROWS_PER_MONTH / NODES));
    for (const m of months) {
      // Server-side rows from MariaDB's sequence engine: NODES nodes, one reading every stepSeconds each.
      await root.raw(
        `INSERT INTO ${TABLE} (node_id, t, v) SELECT 1 + seq % ?, TIMESTAMP(?) + INTERVAL (seq DIV ?) * ? SECOND, 3.5 + (seq % 97) / 100
         FROM seq_0_to_${ROWS_PER_MONTH - 1}`,
        [NODES, m.from, NODES, stepSeconds],
      );
    }
    const [dropped, deleted] = months;
    const file = (name: string) => path.join(profile.mysqlDir, profile.dbName, `${TABLE}#P#${name}.ibd`);
    const mb = (name: string) => (existsSync(file(name)) ? statSync(file(name)).size / 2 ** 20 : 0);
    const sizeBefore = { dropped: mb(dropped.name), deleted: mb(deleted.name) };

    const t0 = performance.now();
    await dropPartitions(root, [dropped.name], TABLE);
    const dropMs = performance.now() - t0;
    const t1 = performance.now();
    const [result] = await root.raw(`DELETE FROM ${TABLE} WHERE t >= ? AND t < ?`, [deleted.from, deleted.to]);
    const deleteMs = performance.now() - t1;
    const deletedRows = Number((result as { affectedRows?: number }).affectedRows ?? 0);
    const freedByDelete = sizeBefore.deleted - mb(deleted.name);
    const speedup = deleteMs / Math.max(dropMs, 0.01);
    return [
      {
        what: `Retention: one month of raw readings (${(ROWS_PER_MONTH / 1e6).toFixed(0)} M rows) removed by DROP PARTITION (ms)`,
        figure: dropMs.toFixed(0),
        baseline: `DELETE of an equal month (${deletedRows} rows, one statement) ${deleteMs.toFixed(0)} ms`,
        ratio: `${speedup.toFixed(0)} × faster`,
        target: '≥ 10 × faster than DELETE',
        ok: deletedRows === ROWS_PER_MONTH && speedup >= 10,
        tool: 'mysql2 as root, scratch copy of readings',
      },
      {
        what: 'Retention: disk freed at once by removing that month (MB)',
        figure: sizeBefore.dropped.toFixed(0),
        baseline: `DELETE freed ${freedByDelete.toFixed(0)} MB of a ${sizeBefore.deleted.toFixed(0)} MB file`,
        ratio: '—',
        target: "the month's file is gone",
        ok: !existsSync(file(dropped.name)) && sizeBefore.dropped > 0,
        tool: '.ibd file sizes',
      },
    ];
  } finally {
    await root.raw(`DROP TABLE IF EXISTS ${TABLE}`);
  }
}

/** The hourly pass as the job runner runs it, as the maintenance user, on the bench's readings table. */
async function passOnReadings({ profile }: { profile: Profile }): Promise<Row> {
  const maint = openMaintenanceKnex({ password: loadSecrets(profile).maintPassword });
  try {
    const days = getEnv().READINGS_RETENTION_DAYS;
    const t0 = performance.now();
    const outcome = await runRetentionPass({ knex: maint, retentionDays: days, now: new Date() });
    const ms = performance.now() - t0;
    return {
      what: 'Retention pass on the readings table as the maintenance user (ms)',
      figure: ms.toFixed(0),
      baseline: describeRetention(outcome, days),
      ratio: '—',
      target: '≤ 1000 ms, pmax empty',
      ok: outcome.ran && outcome.value.pmaxRowsEstimate === 0 && ms <= 1000,
      tool: 'runRetentionPass, in process',
    };
  } finally {
    await maint.destroy();
  }
}
