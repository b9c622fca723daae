import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import knexFactory from 'knex';
import { migratorConfig } from './migration-source';
import { grantMaintenanceOnReadings, provisionDatabase, rootConnectionConfig, startMariadb } from './mariadb';
import type { Profile } from './profile';

/** The steps both launchers share: database up and migrated, app built. */
export async function prepareDatabase(profile: Profile, opts: { fresh?: boolean } = {}): Promise<void> {
  const started = await startMariadb(profile);
  console.log(`[db] MariaDB ${started ? 'started' : 'already running'} on 127.0.0.1:${profile.dbPort} (${profile.mysqlDir})`);
  await provisionDatabase(profile, opts);
  const knex = rootKnex(profile);
  try {
    const [batch, files] = await knex.migrate.latest(migratorConfig);
    console.log(`[db] migrations: batch ${batch}, ${files.length} applied`);
  } finally {
    await knex.destroy();
  }
  await grantMaintenanceOnReadings(profile);
}

export function rootKnex(profile: Profile) {
  return knexFactory({ client: 'mysql2', connection: { ...rootConnectionConfig(profile), timezone: 'Z' }, pool: { min: 0, max: 4 } });
}

function newestMtime(dir: string): number {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) newest = Math.max(newest, newestMtime(full));
    else newest = Math.max(newest, statSync(full).mtimeMs);
  }
  return newest;
}

/** Builds the Next app when a source is newer than the last build. */
export function buildAppIfStale(root: string, distDir = '.next'): void {
  const buildId = path.join(root, distDir, 'BUILD_ID');
  const sources = ['app', 'components', 'lib', 'public'].map((d) => path.join(root, d)).filter(existsSync);
  const extra = ['next.config.mjs', 'tailwind.config.ts', 'package-lock.json', 'proxy.ts'].map((f) => path.join(root, f)).filter(existsSync);
  const newestSource = Math.max(...sources.map(newestMtime), ...extra.map((f) => statSync(f).mtimeMs));
  if (existsSync(buildId) && statSync(buildId).mtimeMs > newestSource) {
    console.log('[app] build is current');
    return;
  }
  console.log('[app] building (next build)…');
  // next build adds its build folder to tsconfig.json's include; a test slot's folder must not
  // end up in the committed file, so the file is put back as it was.
  const tsconfigPath = path.join(root, 'tsconfig.json');
  const tsconfig = readFileSync(tsconfigPath, 'utf8');
  const r = spawnSync(path.join(root, 'node_modules', '.bin', 'next'), ['build'], {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, NEXT_TELEMETRY_DISABLED: '1', NEXT_DIST_DIR: distDir },
  });
  if (distDir !== '.next') writeFileSync(tsconfigPath, tsconfig);
  if (r.status !== 0) throw new Error('next build failed');
}

export function binPath(root: string, name: string): string {
  return path.join(root, 'node_modules', '.bin', name);
}

/**
 * The app server's environment. Its V8 old space is capped (APP_HEAP_MB, default 320) so that
 * under sustained ingest the heap is collected instead of left to grow: resident memory stays
 * well under 500 MB where an uncapped heap drifted to about 490 MB in the bench.
 */
export function appProcessEnv(env: Record<string, string>, port: number): Record<string, string> {
  const heap = Number(process.env.APP_HEAP_MB ?? 320);
  const semi = Number(process.env.APP_SEMI_SPACE_MB ?? 16);
  const nodeOptions = [process.env.NODE_OPTIONS, `--max-old-space-size=${heap}`, `--max-semi-space-size=${semi}`].filter(Boolean).join(' ');
  return { ...env, NODE_ENV: 'production', PORT: String(port), NODE_OPTIONS: nodeOptions };
}
