import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

export const CHROMIUM_PATH = '/usr/bin/chromium';

/** Browser tests use Debian's Chromium; never a downloaded browser build. */
export function ensureChromium(): void {
  if (existsSync(CHROMIUM_PATH)) return;
  console.log('[test] installing chromium from Debian packages…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  for (const args of [['update', '-qq'], ['install', '-y', '-qq', 'chromium']]) {
    const r = spawnSync('apt-get', args, { stdio: 'inherit', env });
    if (r.status !== 0) throw new Error(`apt-get ${args.join(' ')} failed`);
  }
}
