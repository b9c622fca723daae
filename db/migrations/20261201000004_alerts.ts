import type { Knex } from 'knex';

// Alerts, who wants which of them, and the transactional e-mail outbox.
const now = (knex: Knex) => knex.raw('CURRENT_TIMESTAMP(3)');
export const ALERT_KINDS = ['reserve_short', 'reserve_thin', 'node_dark', 'node_silent', 'draw_anomaly', 'not_charging', 'over_voltage'] as const;

export async function up(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasTable('alerts'))) {
    await knex.schema.createTable('alerts', (t) => {
      t.increments('id').unsigned().primary();
      t.integer('org_id').unsigned().notNullable().references('organizations.id').onDelete('CASCADE');
      t.integer('node_id').unsigned().notNullable().references('nodes.id').onDelete('CASCADE');
      t.enum('kind', [...ALERT_KINDS]).notNullable();
      t.enum('status', ['open', 'acknowledged', 'resolved']).notNullable().defaultTo('open');
      t.json('detail').notNullable(); // margin, brownout_at, recharge_at, cause …
      t.integer('clear_passes').unsigned().notNullable().defaultTo(0); // hysteresis on resolve
      t.timestamp('opened_at', { precision: 3 }).notNullable().defaultTo(now(knex));
      t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(now(knex));
      t.timestamp('last_notified_at', { precision: 3 }).nullable();
      t.timestamp('acknowledged_at', { precision: 3 }).nullable();
      t.integer('acknowledged_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
      t.timestamp('resolved_at', { precision: 3 }).nullable();
      t.index(['org_id', 'status']);
    });
    // One unresolved alert per node and kind, enforced by the database itself.
    await knex.raw(`ALTER TABLE alerts ADD COLUMN open_key VARCHAR(64)
      AS (IF(status <> 'resolved', CONCAT(node_id, ':', kind), NULL)) PERSISTENT,
      ADD UNIQUE KEY alerts_open_key_unique (open_key)`);
  }
  if (!(await knex.schema.hasTable('alert_subscriptions'))) {
    await knex.schema.createTable('alert_subscriptions', (t) => {
      t.increments('id').unsigned().primary();
      t.integer('membership_id').unsigned().notNullable().references('memberships.id').onDelete('CASCADE');
      t.integer('site_id').unsigned().nullable().references('sites.id').onDelete('CASCADE'); // null: every site
      t.json('kinds').notNullable();
      t.enum('delivery', ['immediate', 'digest']).notNullable().defaultTo('immediate');
      t.unique(['membership_id', 'site_id']);
    });
  }
  if (!(await knex.schema.hasTable('email_outbox'))) {
    await knex.schema.createTable('email_outbox', (t) => {
      t.bigIncrements('id').unsigned().primary();
      t.integer('org_id').unsigned().nullable().index();
      t.integer('alert_id').unsigned().nullable().references('alerts.id').onDelete('SET NULL');
      t.string('purpose', 40).notNullable(); // alert, digest, invitation, password_reset
      t.string('to_address', 254).notNullable();
      t.string('subject', 300).notNullable();
      t.text('text_body').notNullable();
      t.text('html_body', 'mediumtext').notNullable();
      t.string('message_id', 200).notNullable().unique(); // stable across retries
      t.enum('status', ['pending', 'sent', 'dead']).notNullable().defaultTo('pending');
      t.integer('attempts').unsigned().notNullable().defaultTo(0);
      t.timestamp('next_attempt_at', { precision: 3 }).notNullable().defaultTo(now(knex));
      t.text('last_error').nullable();
      t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(now(knex));
      t.timestamp('sent_at', { precision: 3 }).nullable();
      t.index(['status', 'next_attempt_at']);
    });
  }
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['email_outbox', 'alert_subscriptions', 'alerts']) await knex.schema.dropTableIfExists(table);
}
