import knexFactory, { type Knex } from 'knex';
import { getEnv } from '../env';
import { connectionOptions } from './connection';

/** One pool per process, kept on globalThis so dev reloads do not leak connections. */
const holder = globalThis as typeof globalThis & { __duskwatchKnex?: Knex };

export function db(): Knex {
  if (!holder.__duskwatchKnex) {
    const env = getEnv();
    holder.__duskwatchKnex = knexFactory({
      client: 'mysql2',
      connection: connectionOptions(env),
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
