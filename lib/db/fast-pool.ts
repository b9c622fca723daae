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
    });
  }
  return holder.__duskwatchFastPool;
}

export async function closeFastPool(): Promise<void> {
  await holder.__duskwatchFastPool?.end();
  holder.__duskwatchFastPool = undefined;
}
