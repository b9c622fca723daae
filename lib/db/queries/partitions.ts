import type { Knex } from 'knex';

/**
 * Month partitions of the readings table (see the readings migration): `pYYYYMM` holds
 * [first of the month, first of the next) and `pmax` catches anything later. Bounds are read
 * from information_schema.PARTITIONS, which shows a user the partitions of any table it holds a
 * privilege on (the maintenance user's ALTER is enough).
 */
export interface MonthPartition {
  name: string;
  /** Exclusive upper bound (UTC); null for pmax (MAXVALUE). */
  lessThan: Date | null;
  /** The server's row estimate (InnoDB statistics, not an exact count). */
  rowsEstimate: number;
}

export async function listReadingPartitions(knex: Knex, table = 'readings'): Promise<MonthPartition[]> {
  const [rows] = await knex.raw(
    `SELECT PARTITION_NAME AS name, PARTITION_DESCRIPTION AS bound, TABLE_ROWS AS row_count
     FROM information_schema.PARTITIONS
     WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = ? AND PARTITION_NAME IS NOT NULL
     ORDER BY PARTITION_ORDINAL_POSITION`,
    [table],
  );
  return toPartitions(rows as PartitionRow[]);
}

type PartitionRow = { name: string; bound: string; row_count: number | null };
const toPartitions = (rows: PartitionRow[]): MonthPartition[] =>
  rows.map((r) => ({ name: r.name, lessThan: parseBound(r.bound), rowsEstimate: Number(r.row_count ?? 0) }));

/*
 * The maintenance user's way (see the migration 20261203000005_partition_procedures): it holds
 * EXECUTE on three procedures and no privilege on the table, so it cannot TRUNCATE readings or
 * alter its columns, and the database itself refuses to drop a month younger than 35 days.
 */

/** The month partitions of readings through readings_partitions(). */
export async function listReadingPartitionsAsMaintenance(knex: Knex): Promise<MonthPartition[]> {
  const [result] = await knex.raw('CALL readings_partitions()');
  return toPartitions((result as [PartitionRow[], unknown])[0]);
}

/** Drops one month partition through readings_drop_month(name) (refused unless it ended 35 days ago or more). */
export async function dropMonthAsMaintenance(knex: Knex, name: string): Promise<void> {
  await knex.raw('CALL readings_drop_month(?)', [name]);
}

/** Splits month partitions off pmax up to (not including) the month starting at `until`, through readings_add_months. */
export async function addMonthsAsMaintenance(knex: Knex, until: Date): Promise<void> {
  if (monthStart(until).getTime() !== until.getTime()) throw new Error(`${until.toISOString()} is not the start of a month`);
  await knex.raw('CALL readings_add_months(?)', [ymd(until)]);
}

/** `'2026-02-01'` or `'2026-02-01 00:00:00'` (RANGE COLUMNS on DATETIME) → a UTC date; MAXVALUE → null. */
export function parseBound(bound: string): Date | null {
  if (bound === 'MAXVALUE') return null;
  const m = /^'(\d{4}-\d{2}-\d{2})(?: (\d{2}:\d{2}:\d{2}(?:\.\d+)?))?'$/.exec(bound);
  if (!m) throw new Error(`unexpected partition bound ${bound}`);
  return new Date(`${m[1]}T${m[2] ?? '00:00:00'}Z`);
}

/** The first instant of the UTC month `months` after the one holding `at`. */
export function monthStart(at: Date, months = 0): Date {
  return new Date(Date.UTC(at.getUTCFullYear(), at.getUTCMonth() + months, 1));
}

const ymd = (d: Date) => d.toISOString().slice(0, 10);
const IDENT = /^[A-Za-z0-9_]+$/;

/**
 * Dropping a partition deletes its rows at once, without a row-by-row DELETE (needs ALTER and
 * DROP on the table: root only, as the bench does on its scratch table; the retention pass goes
 * through dropMonthAsMaintenance).
 */
export async function dropPartitions(knex: Knex, names: string[], table = 'readings'): Promise<void> {
  if (!names.length) return;
  if (![table, ...names].every((n) => IDENT.test(n))) throw new Error('bad partition or table name');
  await knex.raw(`ALTER TABLE \`${table}\` DROP PARTITION ${names.map((n) => `\`${n}\``).join(', ')}`);
}
