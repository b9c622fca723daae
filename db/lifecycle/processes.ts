import { spawn, type ChildProcess } from 'node:child_process';
import { createWriteStream, mkdirSync } from 'node:fs';
import path from 'node:path';

/** Child processes of a launcher: logged to .data/<profile>/logs, all stopped together. */
export class ProcessGroup {
  private children: { name: string; child: ChildProcess }[] = [];
  constructor(private logDir: string) {
    mkdirSync(logDir, { recursive: true });
  }

  start(name: string, command: string, args: string[], env: Record<string, string>, opts: { echo?: boolean } = {}): ChildProcess {
    const log = createWriteStream(path.join(this.logDir, `${name}.log`), { flags: 'a' });
    // Each child leads its own process group, so stopping it also stops what it started (tsx runs
    // the script in a child process of its own).
    const child = spawn(command, args, { env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'], detached: true });
    for (const stream of [child.stdout, child.stderr]) {
      stream?.on('data', (chunk: Buffer) => {
        log.write(chunk);
        if (opts.echo) process.stdout.write(chunk.toString().replace(/^(?=.)/gm, `[${name}] `));
      });
    }
    child.on('exit', (code, signal) => {
      log.write(`\n[exit code=${code} signal=${signal}]\n`);
      this.children = this.children.filter((c) => c.child !== child);
    });
    this.children.push({ name, child });
    return child;
  }

  async stopAll(): Promise<void> {
    const waits = this.children.map(
      ({ child }) =>
        new Promise<void>((resolve) => {
          if (child.exitCode !== null) return resolve();
          child.once('exit', () => resolve());
          signalGroup(child, 'SIGTERM');
          setTimeout(() => signalGroup(child, 'SIGKILL'), 8000).unref();
        }),
    );
    await Promise.all(waits);
  }
}

export async function waitForHttp(url: string, timeoutMs = 120_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  let lastError = '';
  while (Date.now() < until) {
    try {
      const res = await fetch(url, { redirect: 'manual' });
      if (res.status < 500) return;
      lastError = `HTTP ${res.status}`;
    } catch (e) {
      lastError = (e as Error).message;
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`${url} did not answer in time (${lastError})`);
}

function signalGroup(child: ChildProcess, signal: NodeJS.Signals) {
  try {
    if (child.pid) process.kill(-child.pid, signal);
  } catch {
    child.kill(signal);
  }
}
