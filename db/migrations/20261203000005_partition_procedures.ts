import type { Knex } from 'knex';

/**
 * Partition upkeep of readings through three stored procedures (SQL SECURITY DEFINER), so the
 * maintenance user holds EXECUTE on these alone and no table privilege at all. MariaDB asks
 * ALTER and DROP on a table for ALTER TABLE ... DROP PARTITION, and those would also let
 * their holder TRUNCATE the table or drop a column; a procedure can do only what its body does:
 *  - readings_partitions(): the month partitions, their bounds and row estimates;
 *  - readings_drop_month(name): drops one month partition `pYYYYMM`, and only when its upper
 *    bound is at least 35 days in the past (the shortest retention the app accepts), so no
 *    caller can age out recent readings;
 *  - readings_add_months(until): splits month partitions off the front of pmax up to `until`
 *    (at most 36 months ahead), which moves rows and loses none.
 * Dynamic SQL runs with the definer's rights (the user that ran the migrations).
 */
const PROCEDURES = ['readings_partitions', 'readings_drop_month', 'readings_add_months'];

// The same floor as READINGS_RETENTION_DAYS's lowest value (lib/env.ts).
const MIN_RETENTION_DAYS_IN_DB = 35;
const MAX_MONTHS_AHEAD_IN_DB = 36;

const fail = (message: string) => `SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = '${message}'`;
const BOUND = "CAST(TRIM(BOTH '''' FROM PARTITION_DESCRIPTION) AS DATETIME)";
const OF_READINGS = "TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'readings' AND PARTITION_NAME IS NOT NULL";

export async function up(knex: Knex): Promise<void> {
  for (const name of PROCEDURES) await knex.raw(`DROP PROCEDURE IF EXISTS ${name}`);

  await knex.raw(`
    CREATE PROCEDURE readings_partitions()
    SQL SECURITY DEFINER READS SQL DATA
    SELECT PARTITION_NAME AS name, PARTITION_DESCRIPTION AS bound, TABLE_ROWS AS row_count
      FROM information_schema.PARTITIONS
     WHERE ${OF_READINGS}
     ORDER BY PARTITION_ORDINAL_POSITION`);

  await knex.raw(`
    CREATE PROCEDURE readings_drop_month(IN p_name VARCHAR(200))
    SQL SECURITY DEFINER MODIFIES SQL DATA
    BEGIN
      DECLARE v_bound VARCHAR(64) DEFAULT NULL;
      DECLARE CONTINUE HANDLER FOR NOT FOUND SET v_bound = NULL;
      IF p_name IS NULL OR p_name NOT REGEXP '^p[0-9]{6}$' THEN
        ${fail('readings_drop_month: not a month partition name (pYYYYMM)')};
      END IF;
      SELECT PARTITION_DESCRIPTION INTO v_bound FROM information_schema.PARTITIONS WHERE ${OF_READINGS} AND PARTITION_NAME = p_name;
      IF v_bound IS NULL THEN
        ${fail('readings_drop_month: no such partition of readings')};
      END IF;
      IF v_bound = 'MAXVALUE' OR CAST(TRIM(BOTH '''' FROM v_bound) AS DATETIME) > UTC_TIMESTAMP() - INTERVAL ${MIN_RETENTION_DAYS_IN_DB} DAY THEN
        ${fail(`readings_drop_month: that partition may hold readings from the last ${MIN_RETENTION_DAYS_IN_DB} days`)};
      END IF;
      SET @duskwatch_partition_sql = CONCAT('ALTER TABLE readings DROP PARTITION ', p_name);
      PREPARE stmt FROM @duskwatch_partition_sql;
      EXECUTE stmt;
      DEALLOCATE PREPARE stmt;
    END`);

  await knex.raw(`
    CREATE PROCEDURE readings_add_months(IN p_until DATE)
    SQL SECURITY DEFINER MODIFIES SQL DATA
    BEGIN
      DECLARE v_start DATE DEFAULT NULL;
      DECLARE v_parts TEXT DEFAULT '';
      IF p_until IS NULL OR p_until > UTC_DATE() + INTERVAL ${MAX_MONTHS_AHEAD_IN_DB} MONTH THEN
        ${fail(`readings_add_months: at most ${MAX_MONTHS_AHEAD_IN_DB} months ahead`)};
      END IF;
      SELECT MAX(${BOUND}) INTO v_start FROM information_schema.PARTITIONS WHERE ${OF_READINGS} AND PARTITION_DESCRIPTION <> 'MAXVALUE';
      IF v_start IS NULL OR DAYOFMONTH(v_start) <> 1 THEN
        ${fail('readings_add_months: the last partition bound is not the start of a month')};
      END IF;
      WHILE v_start < p_until DO
        SET v_parts = CONCAT(v_parts, 'PARTITION p', DATE_FORMAT(v_start, '%Y%m'), ' VALUES LESS THAN (''', DATE_FORMAT(v_start + INTERVAL 1 MONTH, '%Y-%m-%d'), '''), ');
        SET v_start = v_start + INTERVAL 1 MONTH;
      END WHILE;
      IF v_parts <> '' THEN
        SET @duskwatch_partition_sql = CONCAT('ALTER TABLE readings REORGANIZE PARTITION pmax INTO (', v_parts, 'PARTITION pmax VALUES LESS THAN (MAXVALUE))');
        PREPARE stmt FROM @duskwatch_partition_sql;
        EXECUTE stmt;
        DEALLOCATE PREPARE stmt;
      END IF;
    END`);
}

export async function down(knex: Knex): Promise<void> {
  for (const name of PROCEDURES) await knex.raw(`DROP PROCEDURE IF EXISTS ${name}`);
}
