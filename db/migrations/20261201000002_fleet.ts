import type { Knex } from 'knex';

// Sites, nodes (bank, converter, load, calibration), credentials, latest status, and the
// records kept around a node: imports, bench runs, field visits.
const now = (knex: Knex) => knex.raw('CURRENT_TIMESTAMP(3)');

export async function up(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasTable('sites'))) {
    await knex.schema.createTable('sites', (t) => {
      t.increments('id').unsigned().primary();
      t.integer('org_id').unsigned().notNullable().references('organizations.id').onDelete('CASCADE');
      t.string('name', 200).notNullable();
      t.double('lat').notNullable();
      t.double('lon').notNullable();
      t.string('time_zone', 64).notNullable();
      t.double('recharge_elevation_deg').notNullable().defaultTo(-0.833);
      t.text('notes').nullable();
      t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(now(knex));
      t.unique(['org_id', 'name']);
    });
  }
  if (!(await knex.schema.hasTable('nodes'))) {
    await knex.schema.createTable('nodes', (t) => {
      t.increments('id').unsigned().primary();
      t.integer('org_id').unsigned().notNullable().references('organizations.id').onDelete('CASCADE');
      t.integer('site_id').unsigned().notNullable().references('sites.id').onDelete('RESTRICT');
      t.string('name', 120).notNullable();
      t.string('purpose', 200).notNullable().defaultTo('');
      // Bank: ns in series × np in parallel of one cell type.
      t.integer('cells_series').unsigned().notNullable();
      t.integer('cells_parallel').unsigned().notNullable();
      t.double('cell_farads').notNullable();
      t.double('cell_rated_volts').notNullable();
      t.double('cell_esr_ohms').notNullable();
      t.double('cell_leakage_amps').notNullable();
      // Boost converter.
      t.double('start_volts').notNullable();
      t.double('cutoff_volts').notNullable();
      t.double('output_volts').notNullable();
      t.json('efficiency').notNullable(); // a number, or [[volts, eta], ...]
      t.double('input_limit_amps').notNullable();
      // Load profile at the converter output.
      t.double('sleep_amps').notNullable();
      t.double('awake_seconds').notNullable();
      t.double('awake_amps').notNullable();
      t.double('burst_seconds').notNullable();
      t.double('burst_amps').notNullable();
      t.integer('interval_seconds').unsigned().notNullable();
      t.integer('max_interval_seconds').unsigned().notNullable();
      // Reported volts → true volts: v_true = gain·v + offset.
      t.double('cal_gain').notNullable().defaultTo(1);
      t.double('cal_offset_volts').notNullable().defaultTo(0);
      t.double('panel_watts').nullable();
      t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(now(knex));
      t.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(now(knex));
      t.timestamp('deleted_at', { precision: 3 }).nullable();
      t.unique(['org_id', 'name']);
    });
  }
  if (!(await knex.schema.hasTable('device_credentials'))) {
    await knex.schema.createTable('device_credentials', (t) => {
      t.increments('id').unsigned().primary();
      t.integer('org_id').unsigned().notNullable().references('organizations.id').onDelete('CASCADE');
      t.integer('node_id').unsigned().notNullable().references('nodes.id').onDelete('CASCADE');
      t.specificType('credential_id', 'CHAR(32)').notNullable().unique(); // 128 random bits, hex; never the token
      t.string('label', 120).notNullable().defaultTo('');
      t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
      t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(now(knex));
      t.timestamp('last_used_at', { precision: 3 }).nullable();
      t.timestamp('revoked_at', { precision: 3 }).nullable();
    });
  }
  if (!(await knex.schema.hasTable('node_status'))) {
    await knex.schema.createTable('node_status', (t) => {
      t.integer('node_id').unsigned().primary().references('nodes.id').onDelete('CASCADE');
      t.integer('org_id').unsigned().notNullable().index();
      t.enum('state', ['steady', 'thin', 'short', 'dark', 'silent', 'new']).notNullable().defaultTo('new');
      t.timestamp('last_reading_at', { precision: 3 }).nullable();
      t.double('volts').nullable();
      t.double('panel_volts').nullable();
      t.double('energy_joules').nullable();
      t.double('soc').nullable();
      t.double('burst_floor_volts').nullable();
      t.double('reserve_joules').nullable();
      t.double('margin').nullable();
      t.double('load_watts').nullable();
      t.double('measured_watts').nullable();
      t.timestamp('recharge_at', { precision: 3 }).nullable();
      t.timestamp('brownout_at', { precision: 3 }).nullable();
      t.integer('next_report_s').unsigned().nullable();
      t.timestamp('evaluated_at', { precision: 3 }).nullable();
    });
  }
  if (!(await knex.schema.hasTable('imports'))) {
    await knex.schema.createTable('imports', (t) => {
      t.increments('id').unsigned().primary();
      t.integer('org_id').unsigned().notNullable().references('organizations.id').onDelete('CASCADE');
      t.integer('node_id').unsigned().notNullable().references('nodes.id').onDelete('CASCADE');
      t.string('filename', 255).notNullable();
      t.integer('uploaded_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
      t.enum('status', ['running', 'done', 'failed']).notNullable().defaultTo('running');
      t.integer('lines').unsigned().notNullable().defaultTo(0);
      t.integer('accepted').unsigned().notNullable().defaultTo(0);
      t.integer('duplicates').unsigned().notNullable().defaultTo(0);
      t.integer('rejected').unsigned().notNullable().defaultTo(0);
      t.json('report').nullable(); // first rejected lines with reasons
      t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(now(knex));
      t.timestamp('finished_at', { precision: 3 }).nullable();
    });
  }
  if (!(await knex.schema.hasTable('bench_runs'))) {
    await knex.schema.createTable('bench_runs', (t) => {
      t.increments('id').unsigned().primary();
      t.integer('org_id').unsigned().notNullable().references('organizations.id').onDelete('CASCADE');
      t.string('batch_label', 120).notNullable();
      t.string('cell_label', 120).notNullable();
      t.double('nominal_farads').notNullable();
      t.double('nominal_esr_ohms').notNullable();
      t.double('rated_volts').notNullable();
      t.double('current_amps').notNullable();
      t.double('capacitance_farads').notNullable();
      t.double('esr_ohms').notNullable();
      t.double('t1_seconds').notNullable();
      t.double('t2_seconds').notNullable();
      t.integer('uploaded_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
      t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(now(knex));
      t.index(['org_id', 'batch_label']);
    });
  }
  if (!(await knex.schema.hasTable('field_visits'))) {
    await knex.schema.createTable('field_visits', (t) => {
      t.increments('id').unsigned().primary();
      t.integer('org_id').unsigned().notNullable().references('organizations.id').onDelete('CASCADE');
      t.integer('node_id').unsigned().notNullable().references('nodes.id').onDelete('CASCADE');
      t.integer('user_id').unsigned().nullable().references('users.id').onDelete('SET NULL');
      t.date('visited_on').notNullable();
      t.text('work_done').notNullable();
      t.string('photo_path', 255).nullable();
      t.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(now(knex));
    });
  }
}

export async function down(knex: Knex): Promise<void> {
  for (const table of ['field_visits', 'bench_runs', 'imports', 'node_status', 'device_credentials', 'nodes', 'sites']) {
    await knex.schema.dropTableIfExists(table);
  }
}
