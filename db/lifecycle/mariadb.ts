import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import mysql from 'mysql2/promise';
import type { Profile } from './profile';
import { loadSecrets } from './profile';

/** Debian's MariaDB, run by the project itself: private data dir, loopback only, no systemd. */

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

function hasCommand(name: string): boolean {
  return spawnSync('sh', ['-c', `command -v ${name}`], { stdio: 'ignore' }).status === 0;
}

export function ensureMariadbInstalled(): void {
  if (hasCommand('mariadbd') || existsSync('/usr/sbin/mariadbd')) return;
  if (!isRoot) throw new Error('MariaDB is missing: run as root once, or apt-get install mariadb-server');
  console.log('[db] installing mariadb-server from Debian packages…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  for (const args of [['update', '-qq'], ['install', '-y', '-qq', 'mariadb-server']]) {
    const r = spawnSync('apt-get', args, { stdio: 'inherit', env });
    if (r.status !== 0) throw new Error(`apt-get ${args.join(' ')} failed`);
  }
}

function writeConfig(profile: Profile): string {
  const file = path.join(profile.dataDir, 'my.cnf');
  // Durable commits (flush at every commit, binlog-less so sync_binlog is moot), loopback only.
  const lines = [
    '[mariadbd]',
    `datadir=${profile.mysqlDir}`,
    `socket=${profile.socketPath}`,
    `port=${profile.dbPort}`,
    'bind-address=127.0.0.1',
    'skip-name-resolve',
    `pid-file=${path.join(profile.dataDir, 'mysqld.pid')}`,
    `log-error=${path.join(profile.dataDir, 'mysqld.err')}`,
    'innodb_flush_log_at_trx_commit=1',
    // No gap locks: posts of different nodes never wait on each other (common practice for OLTP).
    'transaction-isolation=READ-COMMITTED',
    'innodb_doublewrite=1',
    'innodb_buffer_pool_size=512M',
    'innodb_log_file_size=256M',
    'max_connections=400',
    'character-set-server=utf8mb4',
    'collation-server=utf8mb4_unicode_ci',
    "sql_mode=STRICT_ALL_TABLES,NO_ZERO_DATE,NO_ZERO_IN_DATE,ERROR_FOR_DIVISION_BY_ZERO,NO_ENGINE_SUBSTITUTION",
    'default-time-zone=+00:00',
    '',
  ];
  writeFileSync(file, lines.join('\n'));
  return file;
}

export function initDataDir(profile: Profile): void {
  if (existsSync(path.join(profile.mysqlDir, 'mysql'))) return;
  mkdirSync(profile.mysqlDir, { recursive: true });
  const args = ['--auth-root-authentication-method=normal', `--datadir=${profile.mysqlDir}`, '--skip-test-db'];
  if (isRoot) args.unshift('--user=root');
  const r = spawnSync('mariadb-install-db', args, { stdio: ['ignore', 'ignore', 'inherit'] });
  if (r.status !== 0) throw new Error('mariadb-install-db failed');
}

async function rootConnection(profile: Profile) {
  return mysql.createConnection({ socketPath: profile.socketPath, user: 'root', multipleStatements: false });
}

export async function isMariadbUp(profile: Profile): Promise<boolean> {
  try {
    const c = await rootConnection(profile);
    await c.query('SELECT 1');
    await c.end();
    return true;
  } catch {
    return false;
  }
}

export async function waitForMariadb(profile: Profile, timeoutMs = 60_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    if (await isMariadbUp(profile)) return;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`MariaDB did not become ready; see ${path.join(profile.dataDir, 'mysqld.err')}`);
}

/** Starts mariadbd unless this profile's server already answers; returns the child we started. */
export async function startMariadb(profile: Profile): Promise<ChildProcess | null> {
  ensureMariadbInstalled();
  initDataDir(profile);
  if (await isMariadbUp(profile)) return null;
  const cnf = writeConfig(profile);
  const args = [`--defaults-file=${cnf}`];
  if (isRoot) args.push('--user=root');
  const child = spawn('mariadbd', args, { stdio: 'ignore', detached: true });
  child.unref();
  await waitForMariadb(profile);
  return child;
}

/**
 * Creates the database, an application user with data privileges only (no DDL), and a
 * maintenance user for the retention pass (its rights: see grantMaintenanceOnReadings).
 */
export async function provisionDatabase(profile: Profile, opts: { fresh?: boolean } = {}): Promise<void> {
  const { dbPassword, maintPassword } = loadSecrets(profile);
  const c = await rootConnection(profile);
  try {
    if (opts.fresh) await c.query(`DROP DATABASE IF EXISTS \`${profile.dbName}\``);
    await c.query(`CREATE DATABASE IF NOT EXISTS \`${profile.dbName}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
    // The same application user over TCP (127.0.0.1) and over the private socket (localhost).
    for (const host of ['127.0.0.1', 'localhost']) {
      await c.query(`CREATE USER IF NOT EXISTS 'duskwatch_app'@'${host}' IDENTIFIED BY ?`, [dbPassword]);
      await c.query(`ALTER USER 'duskwatch_app'@'${host}' IDENTIFIED BY ?`, [dbPassword]);
      await c.query(`GRANT SELECT, INSERT, UPDATE, DELETE ON \`${profile.dbName}\`.* TO 'duskwatch_app'@'${host}'`);
      await c.query(`CREATE USER IF NOT EXISTS 'duskwatch_maint'@'${host}' IDENTIFIED BY ?`, [maintPassword]);
      await c.query(`ALTER USER 'duskwatch_maint'@'${host}' IDENTIFIED BY ?`, [maintPassword]);
    }
  } finally {
    await c.end();
  }
}

/**
 * After the migrations (a grant needs its object): the maintenance user may call the three
 * partition procedures of readings (db/migrations/20261203000005_partition_procedures.ts) and
 * nothing else. The ALTER and DROP on readings that databases made before them had granted are
 * taken back: DROP alone let it TRUNCATE the table. Idempotent.
 */
export async function grantMaintenanceOnReadings(profile: Profile): Promise<void> {
  const c = await rootConnection(profile);
  try {
    for (const host of ['127.0.0.1', 'localhost']) {
      const user = `'duskwatch_maint'@'${host}'`;
      await c.query(`REVOKE ALTER, DROP ON \`${profile.dbName}\`.\`readings\` FROM ${user}`).catch((e: { code?: string }) => {
        if (e.code !== 'ER_NONEXISTING_TABLE_GRANT') throw e; // nothing to take back
      });
      for (const procedure of ['readings_partitions', 'readings_drop_month', 'readings_add_months']) {
        await c.query(`GRANT EXECUTE ON PROCEDURE \`${profile.dbName}\`.\`${procedure}\` TO ${user}`);
      }
    }
  } finally {
    await c.end();
  }
}

export async function stopMariadb(profile: Profile): Promise<void> {
  if (!(await isMariadbUp(profile))) return;
  spawnSync('mariadb-admin', [`--socket=${profile.socketPath}`, '-uroot', 'shutdown'], { stdio: 'inherit' });
}

export function rootConnectionConfig(profile: Profile) {
  return { socketPath: profile.socketPath, user: 'root', database: profile.dbName };
}
