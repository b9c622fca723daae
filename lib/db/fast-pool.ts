import mysql from 'mysql2/promise';
import { getEnv } from '../env';
import { connectionOptions } from './connection';

/**
 * A small mysql2 pool for the ingest hot path only: it may send BEGIN … COMMIT as one
 * multi-statement packet (one round trip for a group of posts instead of six for each).
 * Values go through mysql2's escaping (`format`), except the readings themselves, which lib/ingest/store-fast.ts writes
 * from validated finite numbers and its own time text (held equal to `format` by a property
 * test); the rest of the app uses Knex, whose pool keeps multi-statements off.
 */
const holder = globalThis as typeof globalThis & { __duskwatchFastPool?: mysql.Pool };

export function fastPool(): mysql.Pool {
  if (!holder.__duskwatchFastPool) {
    const env = getEnv();
    holder.__duskwatchFastPool = mysql.createPool({
      ...connectionOptions(env),
      multipleStatements: true,
      connectionLimit: env.DB_INGEST_POOL_MAX,
      queryFormat: fastQueryFormat,
      // No caller stack captured for every query (mysql2's `trace`): about 1 % of the app's
      // CPU in a batch run; an error here still has its own message and SQL state.
      trace: false,
    });
  }
  return holder.__duskwatchFastPool;
}

/**
 * Statements on this pool arrive written out in full, with no values, so mysql2's scan of
 * the whole text for `?` placeholders (about 3 % of the app's CPU in a batch run, over
 * statements of a hundred kilobytes) is skipped. A call with values still gets mysql2's own
 * format; tests/unit/ingest/fast-query-format.test.ts holds the two equal.
 */
export function fastQueryFormat(sql: string, values: unknown, timezone?: string): string {
  if (values === undefined || (Array.isArray(values) && values.length === 0)) return sql;
  return mysql.format(sql, values as never[], false, timezone);
}

export async function closeFastPool(): Promise<void> {
  await holder.__duskwatchFastPool?.end();
  holder.__duskwatchFastPool = undefined;
}
