import { existsSync } from 'node:fs';
import path from 'node:path';
import { stopMariadb } from './mariadb';
import { ProcessGroup, waitForHttp } from './processes';
import { maintenanceEnv, profileEnv, resolveProfile } from './profile';
import { appProcessEnv, binPath, buildAppIfStale, prepareDatabase } from './stack';
import { seedDemoIfEmpty } from '../seeds/demo-seed';

/** npm run demo: MariaDB, migrations, demo seed, app, job runner, mail catcher, simulator. */
async function main() {
  const profile = resolveProfile('demo');
  const env = profileEnv(profile);
  Object.assign(process.env, env);

  await prepareDatabase(profile);
  await seedDemoIfEmpty(profile);
  buildAppIfStale(profile.root, profile.distDir);

  const group = new ProcessGroup(path.join(profile.dataDir, 'logs'));
  const tsx = binPath(profile.root, 'tsx');
  group.start('mail', tsx, ['lib/mail/run-catcher.ts'], env, { echo: true });
  group.start('app', binPath(profile.root, 'tsx'), ['lib/server/serve.ts'], appProcessEnv(env, profile.appPort));
  if (existsSync(path.join(profile.root, 'lib/jobs/run-jobs.ts'))) group.start('jobs', tsx, ['lib/jobs/run-jobs.ts'], { ...env, ...maintenanceEnv(profile) }, { echo: true });
  await waitForHttp(`${env.APP_URL}/`);
  if (existsSync(path.join(profile.root, 'simulator/cli.ts'))) {
    group.start('sim', tsx, ['simulator/cli.ts', '--demo', '--url', env.APP_URL], env, { echo: true });
  }

  console.log(`\nDuskwatch demo is up: ${env.APP_URL}`);
  console.log(`  sign in as owner@larkspur.example / duskwatch-demo (see README for the other roles)`);
  console.log(`  MariaDB 127.0.0.1:${profile.dbPort}, mail catcher 127.0.0.1:${profile.smtpPort} → ${profile.mailDir}`);
  console.log(`  logs in ${path.join(profile.dataDir, 'logs')}; Ctrl-C stops everything\n`);

  let stopping = false;
  const stop = async () => {
    if (stopping) return;
    stopping = true;
    console.log('\nstopping…');
    await group.stopAll();
    await stopMariadb(profile);
    process.exit(0);
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
