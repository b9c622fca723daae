import path from 'node:path';
import type { Knex } from 'knex';
import { resolveProfile, type ProfileName } from './db/lifecycle/profile';

/**
 * Migrations and seeds run as MariaDB's root over the profile's private socket: the
 * application user has data privileges only. `DUSKWATCH_PROFILE=test` selects the test stack.
 */
const profile = resolveProfile((process.env.DUSKWATCH_PROFILE as ProfileName) || 'demo', __dirname);

export const migrationSettings: Knex.MigratorConfig = {
  directory: path.join(__dirname, 'db', 'migrations'),
  extension: 'ts',
  loadExtensions: ['.ts'],
  tableName: 'knex_migrations',
};

const config: Knex.Config = {
  client: 'mysql2',
  connection: {
    socketPath: profile.socketPath,
    user: 'root',
    database: profile.dbName,
    timezone: 'Z',
    dateStrings: false,
  },
  pool: { min: 0, max: 4 },
  migrations: migrationSettings,
};

export default config;
