import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

// The command line as a process: help, refusals, and stopping on a signal. Posts go to a
// closed loopback port, so nothing is stored anywhere.

const root = process.cwd();
const tmp = mkdtempSync(path.join(os.tmpdir(), 'dw-cli-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

function runCli(args: string[], { signalAfterMs }: { signalAfterMs?: number } = {}) {
  return new Promise<{ code: number | null; stdout: string; stderr: string; ms: number }>((resolve) => {
    const started = Date.now();
    const child = spawn(path.join(root, 'node_modules/.bin/tsx'), ['simulator/cli.ts', ...args], { cwd: root });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (c: Buffer) => { stdout += c; if (signalAfterMs !== undefined && stdout.includes('posting to')) setTimeout(() => child.kill('SIGTERM'), signalAfterMs); });
    child.stderr.on('data', (c: Buffer) => { stderr += c; });
    const guard = setTimeout(() => child.kill('SIGKILL'), 20_000);
    child.on('exit', (code) => { clearTimeout(guard); resolve({ code, stdout, stderr, ms: Date.now() - started }); });
  });
}

describe('npm run simulate', () => {
  it('prints its help and exits 0', async () => {
    const r = await runCli(['--help']);
    expect(r.code).toBe(0);
    for (const option of ['--demo', '--nodes', '--tokens', '--url', '--speed', '--duration-seconds']) expect(r.stdout).toContain(option);
  }, 30_000);

  it('refuses a command line it cannot run, with exit code 2', async () => {
    for (const args of [['--nodes', '2'], ['--demo', '--nodes', '2', '--tokens', 'x'], ['--demo', '--speed', 'fast'], ['--demo', '--url', 'ftp://127.0.0.1']]) {
      const r = await runCli(args);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.stderr).toMatch(/^simulate: /);
    }
  }, 60_000);

  it('stops at once on SIGTERM, keeping the readings it could not deliver out of any half-done post', async () => {
    const tokens = path.join(tmp, 'tokens.json');
    writeFileSync(tokens, JSON.stringify({ 1: 'a.b.c', 2: 'd.e.f' }));
    // Port 9 (discard) on loopback: nothing listens there in this sandbox, so posts fail fast.
    const r = await runCli(['--nodes', '2', '--tokens', tokens, '--url', 'http://127.0.0.1:9', '--speed', '3600', '--start', new Date(Date.now() - 6 * 3_600_000).toISOString(), '--json'], { signalAfterMs: 1500 });
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('SIGTERM: stopping');
    const final = JSON.parse(r.stdout.trim().split('\n').at(-1)!).final;
    expect(final.emitted).toBeGreaterThan(0);
    expect(final.acked).toBe(0);
    expect(final.queued).toBe(final.emitted); // nothing was thrown away on the way out
    expect(final.errors.network).toBeGreaterThan(0);
  }, 30_000);
});
