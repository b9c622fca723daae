import { describe, expect, it } from 'vitest';
import { createSimClock } from '../../../simulator/runner/clock';
import { startFleet } from '../../../simulator/runner/fleet';
import { buildGenericNodes } from '../../../simulator/runner/generic-fleet';
import { createFakeServer } from './fake-server';

// The runner: the simulated clock and the physics feeding the senders.

describe('the simulated clock', () => {
  it('runs `speed` times faster and never passes the wall clock (DESIGN.md §5 refuses readings >5 min ahead)', () => {
    let wall = 1_000_000;
    const clock = createSimClock({ fromMs: wall - 3_600_000, speed: 600, wallNow: () => wall });
    wall += 3000; // 3 s of wall time = 30 simulated minutes (derived here)
    expect(clock.nowMs()).toBe(1_000_000 - 3_600_000 + 1_800_000);
    expect(clock.isLive()).toBe(false);
    wall += 10_000;
    expect(clock.nowMs()).toBe(wall);
    expect(clock.isLive()).toBe(true);
  });
});

describe('a generic fleet', () => {
  it('replays the past at speed, delivers every reading once and applies next_report_s to the node', async () => {
    const server = createFakeServer(() => ({ status: 200, nextReportSeconds: 1200 }));
    const startAt = new Date(Date.now() - 4 * 3_600_000);
    const sims = buildGenericNodes({ count: 3, seed: 4, latDeg: 47.1, lonDeg: -120.5, startAt });
    const nodes = sims.map((sim, i) => ({ nodeId: String(i + 1), token: `t${i}`, label: sim.spec.slug, sim }));
    const fleet = startFleet({
      nodes, baseUrl: 'http://127.0.0.1:9', speed: 4 * 3600 / 1.5, tickMs: 50, durationSeconds: 2, drainSeconds: 3,
      recordEmitted: true, sender: { fetchImpl: server.fetch, minPostGapMs: 20, log: () => undefined },
    });
    const final = await fleet.done;
    const emitted = nodes.flatMap((n) => fleet.emitted(n.nodeId));
    // Four hours from three nodes reporting at most every 1200 s once advised (derived here;
    // one report each may fall on either side of the window).
    expect(emitted.length).toBeGreaterThanOrEqual(3 * (4 * 3600 / 1200) - 3);
    expect(final.totals).toMatchObject({ emitted: emitted.length, acked: emitted.length, queued: 0, dropped: 0 });
    expect(Math.max(...emitted.map((r) => r.t.getTime()))).toBeLessThanOrEqual(Date.now());
    expect(final.simAt.getTime()).toBeGreaterThan(Date.now() - 10_000); // caught up with the wall clock
    // The three nodes share no timestamps here, so the server's map holds every reading once.
    expect(server.stored.size).toBe(new Set(emitted.map((r) => r.t.getTime())).size);
    for (const sim of sims) expect(sim.state.intervalSeconds).toBe(1200);
  });

  it('stops by itself after its duration, even with the server unreachable', async () => {
    const server = createFakeServer(() => 'network');
    const sims = buildGenericNodes({ count: 2, seed: 1, latDeg: 47, lonDeg: -120, startAt: new Date(Date.now() - 3_600_000) });
    const started = Date.now();
    const fleet = startFleet({
      nodes: sims.map((sim, i) => ({ nodeId: String(i), token: 't', label: 'x', sim })), baseUrl: 'http://127.0.0.1:9',
      speed: 3600, tickMs: 50, durationSeconds: 1, drainSeconds: 0.5, sender: { fetchImpl: server.fetch, backoffBaseMs: 5, log: () => undefined },
    });
    const final = await fleet.done;
    expect(Date.now() - started).toBeLessThan(4000);
    expect(final.totals.queued).toBe(final.totals.emitted); // kept, not dropped
    expect(final.totals.errors.network).toBeGreaterThan(0);
  });

  it('steps the last stretch before its duration ends, whatever the tick', async () => {
    const server = createFakeServer(() => ({ status: 200 }));
    const [sim] = buildGenericNodes({ count: 1, seed: 2, latDeg: 47, lonDeg: -120, startAt: new Date() });
    const fleet = startFleet({
      nodes: [{ nodeId: '1', token: 't', label: 'x', sim }], baseUrl: 'http://127.0.0.1:9', tickMs: 60_000, durationSeconds: 0.8,
      sender: { fetchImpl: server.fetch },
    });
    await fleet.done;
    expect(sim.state.at.getTime()).toBeGreaterThan(Date.now() - 300); // not stuck at the last tick, 0.8 s earlier
  });
});
