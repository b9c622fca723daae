import type { Knex } from 'knex';

/**
 * Readings: keyed by (node, time) and partitioned by month, so that tens of millions of rows
 * stay cheap to query by range and old months can be dropped whole. A partitioned InnoDB
 * table cannot carry foreign keys, and its primary key must include the partition column.
 */
function monthlyPartitions(fromYear: number, toYear: number): string {
  const parts: string[] = [];
  for (let y = fromYear; y <= toYear; y++) {
    for (let m = 1; m <= 12; m++) {
      const next = m === 12 ? `${y + 1}-01-01` : `${y}-${String(m + 1).padStart(2, '0')}-01`;
      parts.push(`PARTITION p${y}${String(m).padStart(2, '0')} VALUES LESS THAN ('${next}')`);
    }
  }
  parts.push('PARTITION pmax VALUES LESS THAN (MAXVALUE)');
  return parts.join(',\n  ');
}

export async function up(knex: Knex): Promise<void> {
  if (!(await knex.schema.hasTable('readings'))) {
    await knex.raw(`
      CREATE TABLE readings (
        node_id INT UNSIGNED NOT NULL,
        t DATETIME(3) NOT NULL,
        v FLOAT NOT NULL COMMENT 'bank volts as reported (before calibration)',
        vp FLOAT NULL COMMENT 'panel volts',
        temp_c FLOAT NULL,
        rssi_dbm SMALLINT NULL,
        seq INT UNSIGNED NULL,
        PRIMARY KEY (node_id, t)
      ) ENGINE=InnoDB
      PARTITION BY RANGE COLUMNS(t) (
        ${monthlyPartitions(2025, 2027)}
      )`);
  }
  if (!(await knex.schema.hasTable('reading_rollups'))) {
    await knex.schema.createTable('reading_rollups', (t) => {
      t.integer('node_id').unsigned().notNullable();
      t.integer('bucket_seconds').unsigned().notNullable(); // 300 and 3600
      t.dateTime('bucket_start', { precision: 0 }).notNullable();
      t.integer('n').unsigned().notNullable();
      t.double('v_min').notNullable();
      t.double('v_max').notNullable();
      t.double('v_sum').notNullable();
      t.double('v_last').notNullable();
      t.dateTime('t_last', { precision: 3 }).notNullable();
      t.double('vp_max').nullable();
      t.primary(['node_id', 'bucket_seconds', 'bucket_start']);
    });
  }
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('reading_rollups');
  await knex.schema.dropTableIfExists('readings');
}
