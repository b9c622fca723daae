import knexFactory, { type Knex } from 'knex';
import { addMonthsAsMaintenance, dropMonthAsMaintenance, listReadingPartitionsAsMaintenance, monthStart } from '../db/queries/partitions';
import { connectionOptions } from '../db/connection';
import { getEnv } from '../env';
import { withNamedLock, type LockOutcome } from './named-lock';

/**
 * Partition upkeep of the raw readings, run by the job runner about once an hour as the
 * maintenance user, which may only call the partition procedures (EXECUTE on three, no table
 * privilege; see the migration 20261203000005_partition_procedures):
 *  - month partitions are kept for the current month and the next MONTHS_AHEAD, split off pmax,
 *    so pmax never fills with real rows;
 *  - with a retention of N days, a month partition goes once its upper bound is at or before
 *    now − N days: every row in it is older than the retention, and the partition holding the
 *    cutoff is never touched. Dropping a whole partition is the usual way to age out time-series
 *    rows (common practice): no row-by-row DELETE, no undo log, the space is freed at once.
 * Rollups are not touched, so charts of old ranges still draw. Idempotent; one runner at a time
 * through a named lock (a second runner skips).
 */
export const RETENTION_PASS_LOCK = 'duskwatch:retention-pass';
export const MONTHS_AHEAD = 3;
const DAY_MS = 86_400_000;

export interface RetentionReport {
  /** null when retention is off (raw readings kept forever). */
  cutoff: Date | null;
  dropped: string[];
  added: string[];
  /** Row estimate of pmax after the pass: 0 in normal running. */
  pmaxRowsEstimate: number;
}

export async function runRetentionPass({ knex, retentionDays, now = new Date() }: { knex: Knex; retentionDays: number | null; now?: Date }): Promise<LockOutcome<RetentionReport>> {
  return withNamedLock({ knex, name: RETENTION_PASS_LOCK }, async () => {
    // Ahead first: if the clock has run past the last month partition, rows in pmax move into
    // their months before anything is dropped.
    const before = await listReadingPartitionsAsMaintenance(knex);
    const lastBound = before.map((p) => p.lessThan).filter((d): d is Date => d !== null).at(-1) ?? monthStart(now);
    const until = monthStart(now, MONTHS_AHEAD + 1);
    const parts = lastBound < until ? (await addMonthsAsMaintenance(knex, until), await listReadingPartitionsAsMaintenance(knex)) : before;
    const added = parts.filter((p) => !before.some((b) => b.name === p.name)).map((p) => p.name);

    const cutoff = retentionDays === null ? null : new Date(now.getTime() - retentionDays * DAY_MS);
    const dropped = cutoff ? parts.filter((p) => p.lessThan !== null && p.lessThan <= cutoff).map((p) => p.name) : [];
    // One at a time: each drop is checked by the database on its own (the 35-day floor).
    for (const name of dropped) await dropMonthAsMaintenance(knex, name);
    const pmax = parts.find((p) => p.lessThan === null);
    return { cutoff, dropped, added, pmaxRowsEstimate: pmax?.rowsEstimate ?? 0 };
  });
}

export function describeRetention(outcome: LockOutcome<RetentionReport>, retentionDays: number | null): string {
  if (!outcome.ran) return 'skipped: another runner holds the lock';
  const r = outcome.value;
  const kept = r.cutoff ? `raw kept ${retentionDays} d (cutoff ${r.cutoff.toISOString().slice(0, 10)})` : 'raw kept forever';
  const pmax = r.pmaxRowsEstimate > 0 ? `, pmax holds ~${r.pmaxRowsEstimate} rows` : '';
  return `${kept}, dropped [${r.dropped.join(' ')}], added [${r.added.join(' ')}]${pmax}`;
}

/**
 * A small pool as the maintenance user. DDL waits for a metadata lock behind open transactions
 * and everything after it queues behind the DDL, so a short lock_wait_timeout makes the pass
 * give up (and try again next hour) rather than stall ingest.
 */
export function openMaintenanceKnex({ user, password, lockWaitSeconds = 10 }: { user?: string; password?: string; lockWaitSeconds?: number } = {}): Knex {
  const env = getEnv();
  return knexFactory({
    client: 'mysql2',
    connection: { ...connectionOptions(env), user: user ?? env.DB_MAINT_USER, password: password ?? env.DB_MAINT_PASSWORD ?? '' },
    // Two: the named lock keeps one connection, the pass runs on the other.
    pool: {
      min: 0,
      max: 2,
      afterCreate: (conn: { query: (sql: string, cb: (err: Error | null) => void) => void }, done: (err: Error | null, conn: unknown) => void) => {
        conn.query(`SET SESSION lock_wait_timeout = ${Math.max(1, Math.floor(lockWaitSeconds))}`, (err) => done(err, conn));
      },
    },
    acquireConnectionTimeout: 5000,
  });
}
