import type { Knex } from 'knex';

// Organizations, people and their roles; invitations, password resets and the audit log.
export async function up(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasTable('organizations'))) {
    await knex.schema.createTable('organizations', (t) => {
      t.increments('id').unsigned().primary();
      t.string('name', 200).notNullable();
      t.string('slug', 80).notNullable().unique();
      // State thresholds on the night margin (DESIGN.md §4), per organization.
      t.double('steady_margin').notNullable().defaultTo(1.5);
      t.double('thin_margin').notNullable().defaultTo(1.0);
      t.boolean('alert_on_thin').notNullable().defaultTo(false);
      t.integer('resend_short_hours').unsigned().notNullable().defaultTo(6);
      t.integer('mail_cap_per_hour').unsigned().notNullable().defaultTo(60);
      t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    });
  }
  if (!(await knex.schema.hasTable('users'))) {
    await knex.schema.createTable('users', (t) => {
      t.increments('id').unsigned().primary();
      t.string('email', 254).notNullable().unique();
      t.string('name', 200).notNullable().defaultTo('');
      t.string('password_hash', 100).nullable();
      t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
      t.timestamp('password_changed_at', { precision: 3 }).nullable();
    });
  }
  if (!(await knex.schema.hasTable('memberships'))) {
    await knex.schema.createTable('memberships', (t) => {
      t.increments('id').unsigned().primary();
      t.integer('org_id').unsigned().notNullable().references('organizations.id').onDelete('CASCADE');
      t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
      t.enum('role', ['owner', 'deployer', 'viewer']).notNullable();
      t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
      t.unique(['org_id', 'user_id']);
    });
  }
  if (!(await knex.schema.hasTable('invitations'))) {
    await knex.schema.createTable('invitations', (t) => {
      t.increments('id').unsigned().primary();
      t.integer('org_id').unsigned().notNullable().references('organizations.id').onDelete('CASCADE');
      t.string('email', 254).notNullable();
      t.enum('role', ['owner', 'deployer', 'viewer']).notNullable();
      t.specificType('token_sha256', 'BINARY(32)').notNullable().unique(); // only the hash is kept
      t.integer('invited_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
      t.timestamp('expires_at', { precision: 3 }).notNullable();
      t.timestamp('used_at', { precision: 3 }).nullable();
      t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    });
  }
  if (!(await knex.schema.hasTable('password_resets'))) {
    await knex.schema.createTable('password_resets', (t) => {
      t.increments('id').unsigned().primary();
      t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
      t.specificType('token_sha256', 'BINARY(32)').notNullable().unique();
      t.timestamp('expires_at', { precision: 3 }).notNullable();
      t.timestamp('used_at', { precision: 3 }).nullable();
      t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    });
  }
  if (!(await knex.schema.hasTable('signin_throttle'))) {
    await knex.schema.createTable('signin_throttle', (t) => {
      t.string('throttle_key', 300).primary(); // "email:<addr>" or "ip:<addr>"
      t.integer('failures').unsigned().notNullable().defaultTo(0);
      t.timestamp('window_started_at', { precision: 3 }).notNullable();
      t.timestamp('blocked_until', { precision: 3 }).nullable();
    });
  }
  if (!(await knex.schema.hasTable('audit_log'))) {
    await knex.schema.createTable('audit_log', (t) => {
      t.bigIncrements('id').unsigned().primary();
      t.integer('org_id').unsigned().nullable().index();
      t.integer('user_id').unsigned().nullable().index();
      t.string('action', 60).notNullable();
      t.string('target', 200).nullable();
      t.json('detail').nullable();
      t.string('ip', 64).nullable();
      t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
      t.index(['org_id', 'created_at']);
    });
  }
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['audit_log', 'signin_throttle', 'password_resets', 'invitations', 'memberships', 'users', 'organizations']) {
    await knex.schema.dropTableIfExists(table);
  }
}
