import { readFileSync } from 'node:fs';
import path from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import { afterAll, describe, expect, it } from 'vitest';
import { isMariadbUp, startMariadb, stopMariadb } from '@/db/lifecycle/mariadb';
import { currentTestProfile } from '@/db/lifecycle/profile';
import { closeDb, db } from '@/lib/db/knex';
import { startFleet, type Fleet, type FleetOptions } from '@/simulator/runner/fleet';
import { buildGenericNodes } from '@/simulator/runner/generic-fleet';
import { createTestNode } from './helpers/fleet';
import { api, appUrl } from './helpers/stack';

// Issue 5: "With MariaDB stopped, posts answer 503 with Retry-After and nothing is half stored;
// after restart the simulator's queued readings arrive and none is lost or doubled."

afterAll(closeDb);
const profile = currentTestProfile();

async function waitFor(check: () => boolean | Promise<boolean>, timeoutMs: number, what: string) {
  const until = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await sleep(200);
  }
}

function killMariadbHard(): void {
  const pid = Number(readFileSync(path.join(profile.dataDir, 'mysqld.pid'), 'utf8').trim());
  process.kill(pid, 'SIGKILL'); // a crash: no clean shutdown, InnoDB recovers on the next start
}

/** `count` new test nodes, each driven by a simulated node replaying the last `hours` at `speed`×. */
async function startTestFleet(opts: { count: number; prefix: string; seed: number; hours: number; speed: number; tickMs: number; sender: FleetOptions['sender'] }) {
  const made = await Promise.all(Array.from({ length: opts.count }, () => createTestNode(opts.prefix)));
  const sims = buildGenericNodes({ count: opts.count, seed: opts.seed, latDeg: 47.1, lonDeg: -120.5, startAt: new Date(Date.now() - opts.hours * 3_600_000) });
  const fleet: Fleet = startFleet({
    nodes: sims.map((sim, i) => ({ nodeId: String(made[i].nodeId), token: made[i].token, label: sim.spec.slug, sim })),
    baseUrl: appUrl(), speed: opts.speed, tickMs: opts.tickMs, recordEmitted: true, sender: opts.sender,
  });
  return { made, fleet };
}

async function runOutage(stop: 'clean' | 'kill') {
  // Ten simulated hours replayed at 600× (60 s of wall time): readings keep coming through the outage.
  const { made, fleet } = await startTestFleet({
    count: 3, prefix: `sim-outage-${stop}`, seed: stop === 'clean' ? 11 : 12, hours: 10, speed: 600, tickMs: 250,
    sender: { backoffMaxMs: 3000, timeoutMs: 5000, log: (l) => console.log(l) },
  });
  const probe = [0, 1, 2].map((i) => ({ t: new Date(Date.now() - 3_600_000 - i * 1000 - 7).toISOString(), v: 4.1 }));
  let reached = false;
  try {
    await waitFor(() => fleet.stats().totals.acked >= 6, 30_000, 'the first readings to arrive');
    if (stop === 'clean') await stopMariadb(profile);
    else killMariadbHard();
    await waitFor(async () => !(await isMariadbUp(profile)), 20_000, 'MariaDB to be down');

    const direct = await api().post('/api/v1/readings').set('authorization', `Bearer ${made[0].token}`)
      .set('content-type', 'application/json').send(JSON.stringify({ readings: probe }));
    expect(direct.status).toBe(503); // DESIGN.md §5: 503 with Retry-After when storage is down
    expect(direct.headers['content-type']).toContain('application/problem+json');
    expect(Number(direct.headers['retry-after'])).toBeGreaterThan(0);

    await waitFor(() => (fleet.stats().totals.errors['503'] ?? 0) >= 3, 20_000, 'the simulator to meet 503s');
    await sleep(3000);
    const during = fleet.stats().totals;
    expect(during.queued).toBeGreaterThan(0); // it keeps them
    expect(during.dropped).toBe(0);
    reached = true;
  } finally {
    // Whatever happened, the next tests get their database back.
    await startMariadb(profile);
    if (!reached) await fleet.stop();
  }
  // Stop stepping (the emitted set is final), then let the queues drain.
  const final = await fleet.stop({ drainSeconds: 60 });
  await closeDb(); // the test's own pool held connections to the old server
  return { made, fleet, final, probe };
}

/**
 * Issue 9, crash safety (OWASP ASVS 5.0 V16 "Security logging and error handling": fail safely, from memory;
 * common practice for store-and-forward telemetry): thirty nodes posting without pause while
 * MariaDB is killed with SIGKILL and restarted three times.
 */
async function runRepeatedKills(kills: number) {
  const count = 30;
  const { made, fleet } = await startTestFleet({ count, prefix: 'sim-kill-loop', seed: 21, hours: 20, speed: 1200, tickMs: 200, sender: { backoffMaxMs: 2000, timeoutMs: 5000 } });
  const log: string[] = [];
  try {
    for (let k = 1; k <= kills; k++) {
      const before = fleet.stats().totals;
      // Load resumed after the last restart: fresh 2xx answers are arriving again.
      await waitFor(() => fleet.stats().totals.acked >= before.acked + 2 * count, 60_000, `ingest to resume before kill ${k}`);
      const failedBefore = Object.values(fleet.stats().totals.errors).reduce((a, b) => a + b, 0);
      killMariadbHard();
      await waitFor(async () => !(await isMariadbUp(profile)), 20_000, 'MariaDB to be down');
      await waitFor(() => Object.values(fleet.stats().totals.errors).reduce((a, b) => a + b, 0) > failedBefore, 20_000, 'the simulator to meet failures');
      await sleep(1500);
      await startMariadb(profile);
      log.push(`kill ${k}: acked ${fleet.stats().totals.acked}, queued ${fleet.stats().totals.queued}`);
    }
  } finally {
    if (!(await isMariadbUp(profile))) await startMariadb(profile);
  }
  const final = await fleet.stop({ drainSeconds: 90 });
  await closeDb();
  console.log(`[test] repeated kills: ${log.join('; ')}`);
  return { made, fleet, final, probe: [] as { t: string; v: number }[] };
}

async function checkNoneLostOrDoubled({ made, fleet, final, probe }: Awaited<ReturnType<typeof runOutage>>) {
  expect(final.totals.queued).toBe(0);
  expect(final.totals.dropped).toBe(0);
  for (const m of made) {
    const emitted = fleet.emitted(String(m.nodeId)).map((r) => r.t.getTime());
    const rows = (await db()('readings').where({ node_id: m.nodeId }).select('t')).map((r) => new Date(r.t).getTime());
    expect(emitted.length).toBeGreaterThan(0);
    expect(new Set(emitted).size).toBe(emitted.length);
    // Every emitted reading stored, exactly once, and nothing else (the 503'd probe included).
    expect(rows.sort((a, b) => a - b)).toEqual([...emitted].sort((a, b) => a - b));
  }
  const s = final.totals;
  expect(s.acked).toBe(s.emitted);
  expect(s.accepted + s.duplicates).toBe(s.acked); // a retried commit comes back as a duplicate, not a second row
  expect(s.mismatches).toBe(0); // every 2xx accounted for each reading it was sent
  if (probe.length) {
    const probeRows = await db()('readings').where({ node_id: made[0].nodeId }).whereIn('t', probe.map((p) => new Date(p.t)));
    expect(probeRows).toHaveLength(0); // the post answered 503 stored nothing
  }
  console.log(`[test] outage: ${s.emitted} readings, ${s.accepted} new, ${s.duplicates} duplicates, errors ${JSON.stringify(s.errors)}`);
}

describe('the simulator through a MariaDB outage', () => {
  it('after a clean stop and restart, every queued reading arrives once', async () => {
    await checkNoneLostOrDoubled(await runOutage('clean'));
  }, 240_000);

  it('after kill -9 and restart (crash recovery), every queued reading arrives once', async () => {
    await checkNoneLostOrDoubled(await runOutage('kill'));
  }, 240_000);

  it('killed with SIGKILL three times under steady load: acknowledged = stored, once each, queues drained', async () => {
    await checkNoneLostOrDoubled(await runRepeatedKills(3));
  }, 360_000);
});
