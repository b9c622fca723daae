import { readdirSync } from 'node:fs';
import path from 'node:path';
import type { Knex } from 'knex';

/**
 * Migrations loaded with the runtime's own import(), so the same TypeScript files run under
 * tsx (launchers) and vitest (tests). The knex CLI uses knexfile.ts instead; same files.
 */
const DIR = path.join(__dirname, '..', 'migrations');

interface MigrationModule {
  up: (knex: Knex) => Promise<void>;
  down: (knex: Knex) => Promise<void>;
}

export const migrationSource: Knex.MigrationSource<string> = {
  async getMigrations() {
    return readdirSync(DIR).filter((f) => /^\d{14}_.+\.ts$/.test(f)).sort();
  },
  getMigrationName(file) {
    return file;
  },
  async getMigration(file) {
    return (await import(path.join(DIR, file))) as MigrationModule;
  },
};

export const migratorConfig: Knex.MigratorConfig = { migrationSource, tableName: 'knex_migrations' };
