import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { currentTestProfile, profileEnv } from './profile';
import { binPath } from './stack';
import { withTestStack } from './test-stack';

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

  const status = await withTestStack(profile, env, async () => {
    const args = ['run', '--config', 'tests/vitest.config.mts', '--reporter=default', '--reporter=json', `--outputFile.json=${reportFile}`, ...process.argv.slice(2)];
    const r = spawnSync(binPath(profile.root, 'vitest'), args, { stdio: 'inherit', env: { ...process.env, ...env, DUSKWATCH_TEST_STACK: '1' } });
    return r.status ?? 1;
  }, { browser: true });
  const counts = readCounts(reportFile);
  console.log(`${counts.passed} passed, ${counts.failed} failed`);
  process.exit(status === 0 && counts.failed === 0 && counts.passed > 0 ? 0 : 1);
}

function readCounts(file: string): { passed: number; failed: number } {
  if (!existsSync(file)) return { passed: 0, failed: 1 };
  const report = JSON.parse(readFileSync(file, 'utf8')) as { numPassedTests: number; numFailedTests: number; success: boolean };
  // A suite that failed to load counts as a failure even with no test inside it.
  const failed = report.numFailedTests + (report.success || report.numFailedTests > 0 ? 0 : 1);
  return { passed: report.numPassedTests, failed };
}

main().catch((e) => {
  console.error(e instanceof Error ? e.stack : e);
  console.log('0 passed, 1 failed');
  process.exit(1);
});
