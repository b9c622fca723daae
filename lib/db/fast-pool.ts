import mysql from 'mysql2/promise';
import { getEnv } from '../env';

/**
 * A small mysql2 pool for the ingest hot path only: it may send BEGIN … COMMIT as one
 * multi-statement packet (one round trip per post instead of six). Every value goes through
 * mysql2's escaping (`format`), never string concatenation; the rest of the app uses Knex,
 * whose pool keeps multi-statements off.
 */
const holder = globalThis as typeof globalThis & { __duskwatchFastPool?: mysql.Pool };

export function fastPool(): mysql.Pool {
  if (!holder.__duskwatchFastPool) {
    const env = getEnv();
    holder.__duskwatchFastPool = mysql.createPool({
      ...(env.DB_SOCKET ? { socketPath: env.DB_SOCKET } : { host: env.DB_HOST, port: env.DB_PORT }),
      user: env.DB_USER,
      password: env.DB_PASSWORD,
      database: env.DB_NAME,
      timezone: 'Z',
      supportBigNumbers: true,
      multipleStatements: true,
      connectionLimit: env.DB_INGEST_POOL_MAX,
      connectTimeout: 5000,
    });
  }
  return holder.__duskwatchFastPool;
}

export async function closeFastPool(): Promise<void> {
  await holder.__duskwatchFastPool?.end();
  holder.__duskwatchFastPool = undefined;
}
