import type { Env } from '../env';

/**
 * Where and how every pool of the app reaches MariaDB (the Knex pool, the ingest pool, the
 * maintenance pool): the profile's socket when there is one, UTC dates, big numbers kept
 * exact. Each pool adds its own user and limits.
 */
export function connectionOptions(env: Env) {
  return {
    ...(env.DB_SOCKET ? { socketPath: env.DB_SOCKET } : { host: env.DB_HOST, port: env.DB_PORT }),
    user: env.DB_USER,
    password: env.DB_PASSWORD,
    database: env.DB_NAME,
    timezone: 'Z',
    supportBigNumbers: true,
    connectTimeout: 5000,
  };
}
