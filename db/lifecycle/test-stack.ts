import path from 'node:path';
import { ensureChromium } from './chromium';
import { stopMariadb } from './mariadb';
import { ProcessGroup, waitForHttp } from './processes';
import type { Profile } from './profile';
import { seedDemoIfEmpty } from '../seeds/demo-seed';
import { appProcessEnv, binPath, buildAppIfStale, prepareDatabase } from './stack';

/**
 * A fresh test stack (database recreated and seeded, app built and started on the profile's
 * port, mail catcher) around `work`; everything it started is stopped afterwards, even when
 * set-up fails half-way. Used by npm test and npm run bench.
 */
export async function withTestStack<T>(profile: Profile, env: Record<string, string>, work: () => Promise<T>, opts: { browser?: boolean } = {}): Promise<T> {
  const group = new ProcessGroup(path.join(profile.dataDir, 'logs'));
  try {
    await prepareDatabase(profile, { fresh: true });
    await seedDemoIfEmpty(profile);
    buildAppIfStale(profile.root, profile.distDir);
    if (opts.browser) ensureChromium();
    group.start('mail', binPath(profile.root, 'tsx'), ['lib/mail/run-catcher.ts'], env);
    const appEnv = appProcessEnv(env, profile.appPort);
    // DUSKWATCH_APP_CPU_PROFILE=<dir>: the app writes a V8 CPU profile there when stopped (tuning).
    const profileDir = process.env.DUSKWATCH_APP_CPU_PROFILE;
    if (profileDir) group.start('app', process.execPath, ['--cpu-prof', `--cpu-prof-dir=${profileDir}`, '--import', 'tsx', 'lib/server/serve.ts'], appEnv);
    else group.start('app', binPath(profile.root, 'tsx'), ['lib/server/serve.ts'], appEnv);
    await waitForHttp(`${env.APP_URL}/`);
    return await work();
  } finally {
    await group.stopAll();
    await stopMariadb(profile);
  }
}
