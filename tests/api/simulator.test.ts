import { spawn } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { currentTestProfile } from '@/db/lifecycle/profile';
import { closeDb, db } from '@/lib/db/knex';
import { generateDemoHistory } from '@/simulator/fleet/demo-fleet';
import { loadDemoFleet } from '@/simulator/runner/demo-loader';
import { startFleet, stepNodeTo } from '@/simulator/runner/fleet';
import { createTestNode } from './helpers/fleet';
import { appUrl } from './helpers/stack';

// The simulator against the real app and MariaDB (issue 5: "posting through the real contract
// with their device tokens, at real time or accelerated").

afterAll(closeDb);
const profile = currentTestProfile();
const tmp = mkdtempSync(path.join(os.tmpdir(), 'dw-sim-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

const rowsOf = async (nodeIds: (string | number)[], after = new Date(0)) =>
  (await db()('readings').whereIn('node_id', nodeIds.map(Number)).where('t', '>', after).select('node_id', 't', 'v', 'seq'))
    .map((r) => ({ nodeId: String(r.node_id), t: new Date(r.t).getTime(), v: Number(r.v), seq: r.seq }));
const key = (nodeId: string, tMs: number) => `${nodeId}@${tMs}`;

describe('the simulator, demo mode', () => {
  const SLUGS = ['nf-soil-1', 'mp-stage-1', 'nf-stage-1']; // the shortest fixed cadences of the demo fleet

  it('rebuilds the seeded physics: the history it regenerates ends where the seed stored it', async () => {
    const file = JSON.parse(readFileSync(path.join(profile.dataDir, 'demo-fleet.json'), 'utf8'));
    const history = generateDemoHistory({ now: new Date(file.now), seed: file.seed, cadences: file.cadences });
    const { nodes, fleetNow } = loadDemoFleet({ dataDir: profile.dataDir, only: SLUGS });
    expect(nodes.map((n) => n.label).sort()).toEqual([...SLUGS].sort());
    for (const n of nodes) {
      expect(n.sim.state.at.getTime()).toBe(fleetNow.getTime());
      const last = await db()('readings').where({ node_id: Number(n.nodeId) }).where('t', '<=', fleetNow).orderBy('t', 'desc').first('t', 'v', 'seq');
      const expected = history[n.label].readings.at(-1)!;
      expect(new Date(last.t).getTime()).toBe(expected.t.getTime());
      expect(Number(last.v)).toBeCloseTo(expected.v, 3);
      expect(last.seq).toBe(expected.seq);
      expect(n.sim.state.seq).toBeGreaterThanOrEqual(0);
    }
  }, 60_000);

  it('sends exactly the physics\' continuation from the seed to now, then runs live; each reading stored once', async () => {
    const { nodes, fleetNow } = loadDemoFleet({ dataDir: profile.dataDir });
    // A twin of the fleet, stepped here, says what the catch-up must send (the physics is
    // deterministic; cadence advice only changes the timing after the first reply).
    const twin = loadDemoFleet({ dataDir: profile.dataDir }).nodes;
    const catchUpToMs = Date.now();
    const expected = twin.flatMap((n) => stepNodeTo({ sim: n.sim, toMs: catchUpToMs, stepSeconds: 60 }).map((r) => `${key(n.nodeId, r.t.getTime())}=${r.v}`));
    // Run until the next report due among the reporting nodes, if it is near, so that a live one arrives too.
    const reporting = twin.filter((n) => n.sim.state.running && !n.sim.faults.linkFaultFrom);
    const soonestMs = Math.min(...reporting.map((n) => n.sim.state.nextReportAt.getTime()));
    const untilSoonestSeconds = (soonestMs - Date.now()) / 1000 + 3;
    const durationSeconds = untilSoonestSeconds <= 60 ? Math.max(4, untilSoonestSeconds) : 4;
    const before = new Set((await rowsOf(nodes.map((n) => n.nodeId), fleetNow)).map((r) => key(r.nodeId, r.t)));
    const fleet = startFleet({ nodes, baseUrl: appUrl(), speed: 1, catchUp: 'instant', durationSeconds, drainSeconds: 20, recordEmitted: true });
    const final = await fleet.done;
    const emitted = nodes.flatMap((n) => fleet.emitted(n.nodeId).map((r) => ({ k: key(n.nodeId, r.t.getTime()), t: r.t.getTime(), v: r.v })));
    console.log(`[test] demo: ${Math.round((catchUpToMs - fleetNow.getTime()) / 1000)} s since the seed, ${expected.length} caught up, ${emitted.length} sent in ${durationSeconds.toFixed(0)} s`);
    expect(emitted.filter((e) => e.t <= catchUpToMs).map((e) => `${e.k}=${e.v}`).sort()).toEqual([...expected].sort());
    if (soonestMs < Date.now() - 3000) expect(emitted.length).toBeGreaterThan(expected.length); // the live report came
    for (const n of nodes) expect(n.sim.state.at.getTime()).toBeGreaterThan(Date.now() - 30_000); // it reached the wall clock
    expect(final.totals).toMatchObject({ emitted: emitted.length, acked: emitted.length, queued: 0, dropped: 0 });
    const fresh = (await rowsOf(nodes.map((n) => n.nodeId), fleetNow)).map((r) => key(r.nodeId, r.t)).filter((k) => !before.has(k));
    expect(fresh.sort()).toEqual(emitted.map((e) => e.k).sort());
  }, 150_000);

  it('from the command line, writes its progress and does not resend on a second run', async () => {
    const dir = path.join(tmp, 'demo');
    mkdirSync(dir);
    for (const f of ['demo-fleet.json', 'device-tokens.json']) copyFileSync(path.join(profile.dataDir, f), path.join(dir, f));
    const args = ['simulator/cli.ts', '--demo', '--data-dir', dir, '--url', appUrl(), '--duration-seconds', '3', '--drain-seconds', '20', '--json'];
    const first = await runCli(args, 60_000);
    expect(first.code).toBe(0);
    const progress = JSON.parse(readFileSync(path.join(dir, 'simulator-progress.json'), 'utf8'));
    expect(progress.fleetNow).toBe(JSON.parse(readFileSync(path.join(dir, 'demo-fleet.json'), 'utf8')).now);
    const second = await runCli(args, 60_000);
    expect(second.code).toBe(0);
    const finalOf = (out: string) => JSON.parse(out.trim().split('\n').filter((l) => l.startsWith('{')).at(-1)!).final;
    expect(finalOf(first.stdout)).toMatchObject({ queued: 0, dropped: 0 });
    // The same deterministic readings sent again would come back as duplicates.
    expect(finalOf(second.stdout)).toMatchObject({ duplicates: 0, queued: 0, dropped: 0 });
  }, 150_000);
});

describe('the simulator command line, generic fleet', () => {
  it('replays six hours at --speed 3600, stops by itself, and every reading arrives once', async () => {
    const made = await Promise.all([0, 1, 2].map(() => createTestNode('sim-cli')));
    const tokensFile = path.join(tmp, 'tokens.json');
    writeFileSync(tokensFile, JSON.stringify(Object.fromEntries(made.map((m) => [m.nodeId, m.token]))));
    const startedMs = Date.now();
    const args = ['simulator/cli.ts', '--nodes', '3', '--tokens', tokensFile, '--url', appUrl(), '--speed', '3600', '--duration-seconds', '6', '--drain-seconds', '20', '--json'];
    const { code, stdout } = await runCli(args, 60_000);
    expect(code).toBe(0);
    expect(Date.now() - startedMs).toBeLessThan(45_000); // bounded: it ended on its own
    const final = JSON.parse(stdout.trim().split('\n').filter((l) => l.startsWith('{')).at(-1)!).final;
    const rows = await rowsOf(made.map((m) => m.nodeId));
    // Six simulated hours; a node reports at least once an hour (its longest interval, 3600 s),
    // one report each may fall outside the window (derived here).
    expect(rows.length).toBeGreaterThanOrEqual(3 * 6 - 3);
    expect(final).toMatchObject({ emitted: rows.length, accepted: rows.length, queued: 0, dropped: 0, mismatches: 0 });
    for (const m of made) expect(rows.some((r) => r.nodeId === String(m.nodeId))).toBe(true);
    const earliestMs = Math.min(...rows.map((r) => r.t));
    expect(earliestMs).toBeGreaterThanOrEqual(startedMs - 6.5 * 3_600_000); // replayed the six hours before now
    expect(Math.max(...rows.map((r) => r.t))).toBeLessThanOrEqual(Date.now()); // never in the future
  }, 90_000);
});

function runCli(args: string[], timeoutMs: number): Promise<{ code: number | null; stdout: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(path.join(profile.root, 'node_modules/.bin/tsx'), args, { cwd: profile.root, stdio: ['ignore', 'pipe', 'inherit'] });
    let stdout = '';
    child.stdout.on('data', (c: Buffer) => { stdout += c.toString(); });
    const timer = setTimeout(() => { child.kill('SIGKILL'); reject(new Error(`simulator did not stop within ${timeoutMs} ms`)); }, timeoutMs);
    child.on('exit', (code) => { clearTimeout(timer); resolve({ code, stdout }); });
  });
}
