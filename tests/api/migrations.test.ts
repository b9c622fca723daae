import knexFactory from 'knex';
import { describe, expect, it } from 'vitest';
import { migratorConfig as migrationSettings } from '@/db/lifecycle/migration-source';
import { rootConnectionConfig } from '@/db/lifecycle/mariadb';
import { currentTestProfile } from '@/db/lifecycle/profile';
import { rootKnex } from '@/db/lifecycle/stack';

const profile = currentTestProfile();

describe('migrations', () => {
  it('are already applied to the test database, and running them again changes nothing', async () => {
    const knex = rootKnex(profile);
    try {
      const [, files] = await knex.migrate.latest(migrationSettings);
      expect(files).toEqual([]);
    } finally {
      await knex.destroy();
    }
  });

  it('run forward on an empty database, back down, and forward again', async () => {
    const admin = rootKnex(profile);
    await admin.raw('DROP DATABASE IF EXISTS duskwatch_scratch');
    await admin.raw('CREATE DATABASE duskwatch_scratch');
    const scratch = knexFactory({ client: 'mysql2', connection: { ...rootConnectionConfig(profile), database: 'duskwatch_scratch' } });
    try {
      const [, first] = await scratch.migrate.latest(migrationSettings);
      expect(first.length).toBeGreaterThanOrEqual(4);
      for (const table of ['organizations', 'users', 'memberships', 'sites', 'nodes', 'device_credentials', 'readings', 'reading_rollups', 'node_status', 'alerts', 'alert_subscriptions', 'email_outbox', 'imports', 'bench_runs', 'field_visits', 'audit_log']) {
        expect(await scratch.schema.hasTable(table), table).toBe(true);
      }
      await scratch.migrate.rollback(migrationSettings, true);
      expect(await scratch.schema.hasTable('readings')).toBe(false);
      const [, again] = await scratch.migrate.latest(migrationSettings);
      expect(again).toEqual(first);
    } finally {
      await scratch.destroy();
      await admin.raw('DROP DATABASE IF EXISTS duskwatch_scratch');
      await admin.destroy();
    }
  });
});
