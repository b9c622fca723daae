import knexFactory, { type Knex } from 'knex';
import { getEnv } from '../env';

/** One pool per process, kept on globalThis so dev reloads do not leak connections. */
const holder = globalThis as typeof globalThis & { __duskwatchKnex?: Knex };

export function db(): Knex {
  if (!holder.__duskwatchKnex) {
    const env = getEnv();
    holder.__duskwatchKnex = knexFactory({
      client: 'mysql2',
      connection: {
        ...(env.DB_SOCKET ? { socketPath: env.DB_SOCKET } : { host: env.DB_HOST, port: env.DB_PORT }),
        user: env.DB_USER,
        password: env.DB_PASSWORD,
        database: env.DB_NAME,
        timezone: 'Z',
        supportBigNumbers: true,
        connectTimeout: 5000,
      },
      pool: { min: 0, max: env.DB_POOL_MAX },
      acquireConnectionTimeout: 5000,
    });
  }
  return holder.__duskwatchKnex;
}

export async function closeDb(): Promise<void> {
  await holder.__duskwatchKnex?.destroy();
  holder.__duskwatchKnex = undefined;
}
