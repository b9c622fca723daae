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
  return (rows as { name: string; bound: string; row_count: number | null }[]).map((r) => ({
    name: r.name,
    lessThan: parseBound(r.bound),
    rowsEstimate: Number(r.row_count ?? 0),
  }));
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
const partitionName = (start: Date) => `p${start.getUTCFullYear()}${String(start.getUTCMonth() + 1).padStart(2, '0')}`;
const IDENT = /^[A-Za-z0-9_]+$/;

/** Dropping a partition deletes its rows at once, without a row-by-row DELETE (needs ALTER and DROP). */
export async function dropPartitions(knex: Knex, names: string[], table = 'readings'): Promise<void> {
  if (!names.length) return;
  if (![table, ...names].every((n) => IDENT.test(n))) throw new Error('bad partition or table name');
  await knex.raw(`ALTER TABLE \`${table}\` DROP PARTITION ${names.map((n) => `\`${n}\``).join(', ')}`);
}

/**
 * Splits month partitions off the front of pmax, one per month from `from` up to (not including)
 * `until`, in one statement. pmax is empty in normal running, so the split copies nothing.
 * Returns the names added.
 */
export async function splitMonthsFromMax(knex: Knex, { from, until, table = 'readings' }: { from: Date; until: Date; table?: string }): Promise<string[]> {
  if (monthStart(from).getTime() !== from.getTime()) throw new Error(`the last partition bound ${from.toISOString()} is not the start of a month`);
  if (!IDENT.test(table)) throw new Error('bad table name');
  const parts: string[] = [];
  const names: string[] = [];
  for (let start = monthStart(from); start < until; start = monthStart(start, 1)) {
    names.push(partitionName(start));
    parts.push(`PARTITION \`${partitionName(start)}\` VALUES LESS THAN ('${ymd(monthStart(start, 1))}')`);
  }
  if (!parts.length) return [];
  await knex.raw(`ALTER TABLE \`${table}\` REORGANIZE PARTITION pmax INTO (${parts.join(', ')}, PARTITION pmax VALUES LESS THAN (MAXVALUE))`);
  return names;
}
