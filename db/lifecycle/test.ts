import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { ensureChromium } from './chromium';
import { stopMariadb } from './mariadb';
import { ProcessGroup, waitForHttp } from './processes';
import { currentTestProfile, profileEnv } from './profile';
import { binPath, buildAppIfStale, prepareDatabase } from './stack';
import { seedDemoIfEmpty } from '../seeds/demo-seed';

/**
 * npm test: the demo's set-up on the isolated test profile (own data dir, port and database,
 * recreated each run), then every vitest project. Prints one line "N passed, N failed".
 */
async function main() {
  const profile = currentTestProfile();
  const env = profileEnv(profile);
  Object.assign(process.env, env);
  const reportFile = path.join(profile.dataDir, 'vitest-report.json');
  rmSync(reportFile, { force: true });
  rmSync(profile.mailDir, { recursive: true, force: true });

  const group = new ProcessGroup(path.join(profile.dataDir, 'logs'));
  let status = 1;
  try {
    await prepareDatabase(profile, { fresh: true });
    await seedDemoIfEmpty(profile);
    buildAppIfStale(profile.root, profile.distDir);
    ensureChromium();
    group.start('mail', binPath(profile.root, 'tsx'), ['lib/mail/run-catcher.ts'], env);
    group.start('app', binPath(profile.root, 'tsx'), ['lib/server/serve.ts'], { ...env, NODE_ENV: 'production', PORT: String(profile.appPort) });
    await waitForHttp(`${env.APP_URL}/`);
    const args = ['run', '--config', 'tests/vitest.config.mts', '--reporter=default', '--reporter=json', `--outputFile.json=${reportFile}`, ...process.argv.slice(2)];
    const r = spawnSync(binPath(profile.root, 'vitest'), args, { stdio: 'inherit', env: { ...process.env, ...env, DUSKWATCH_TEST_STACK: '1' } });
    status = r.status ?? 1;
  } finally {
    // Always leave the machine as we found it, even when set-up failed half-way.
    await group.stopAll();
    await stopMariadb(profile);
  }
  const counts = readCounts(reportFile);
  console.log(`${counts.passed} passed, ${counts.failed} failed`);
  process.exit(status === 0 && counts.failed === 0 && counts.passed > 0 ? 0 : 1);
}

function readCounts(file: string): { passed: number; failed: number } {
  if (!existsSync(file)) return { passed: 0, failed: 1 };
  const report = JSON.parse(readFileSync(file, 'utf8')) as { numPassedTests: number; numFailedTests: number; numTotalTestSuites: number; success: boolean };
  // A suite that failed to load counts as a failure even with no test inside it.
  const failed = report.numFailedTests + (report.success || report.numFailedTests > 0 ? 0 : 1);
  return { passed: report.numPassedTests, failed };
}

main().catch((e) => {
  console.error(e instanceof Error ? e.stack : e);
  console.log('0 passed, 1 failed');
  process.exit(1);
});
