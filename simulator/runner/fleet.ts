import { setTimeout as sleep } from 'node:timers/promises';
import { NodeSender, type SenderOptions } from '../client/node-sender';
import { sumStats, type SenderStats } from '../client/stats';
import type { SimNode } from '../physics/node';
import type { SimReading } from '../physics/types';
import { createSimClock, type SimClock } from './clock';

// A fleet run: step every node's physics to the simulated clock, hand the readings to each
// node's store-and-forward sender, and stop by itself after `durationSeconds` (load tests
// must end on their own) or when stop() is called.

export interface FleetNode {
  nodeId: string;
  token: string;
  label: string;
  sim: SimNode;
  /** Readings at or before this instant were delivered already (the seed, a previous run). */
  sendAfter?: Date;
}

export interface FleetOptions {
  nodes: FleetNode[];
  baseUrl: string;
  speed?: number;
  /** 'instant': the gap up to the wall clock is stepped at once and goes out as a backlog. */
  catchUp?: 'instant' | 'replay';
  tickMs?: number;
  /** Physics step; the history generator uses 60 s, so the live run matches it. */
  stepSeconds?: number;
  durationSeconds?: number;
  /** After the duration, how long to let the queues drain before giving up. */
  drainSeconds?: number;
  sender?: Partial<Omit<SenderOptions, 'nodeId' | 'token' | 'baseUrl' | 'onAdvice'>>;
  /** Keep every emitted reading (tests compare them with the database). */
  recordEmitted?: boolean;
  onTick?: (fleet: Fleet) => void;
}

export interface FleetStats { simAt: Date; live: boolean; nodes: number; totals: SenderStats; perNode: Record<string, SenderStats & { label: string; state: string | null }> }

export interface Fleet {
  stop(opts?: { drainSeconds?: number }): Promise<FleetStats>;
  stats(): FleetStats;
  /** Resolves with the final stats when the run has ended (duration or stop). */
  done: Promise<FleetStats>;
  emitted(nodeId: string): SimReading[];
  doneThrough(): Record<string, Date | null>;
  drained(): boolean;
}

export function startFleet(opts: FleetOptions): Fleet {
  const { nodes, baseUrl, speed = 1, catchUp = 'replay', stepSeconds = 60, drainSeconds = 0 } = opts;
  const tickMs = opts.tickMs ?? (speed > 1 ? 1000 : 5000);
  const senders = new Map(nodes.map((n) => [n.nodeId, new NodeSender({
    ...opts.sender, nodeId: n.nodeId, token: n.token, baseUrl, onAdvice: (seconds) => n.sim.setIntervalSeconds(seconds),
  })]));
  const record = new Map<string, SimReading[]>(nodes.map((n) => [n.nodeId, []]));
  const stepper = new AbortController();
  let clock: SimClock = createSimClock({ fromMs: Math.min(...nodes.map((n) => n.sim.state.at.getTime())), speed });

  const advance = ({ toMs, only = nodes }: { toMs: number; only?: FleetNode[] }) => {
    for (const n of only) {
      const readings = stepNodeTo({ sim: n.sim, toMs, stepSeconds }).filter((r) => !n.sendAfter || r.t > n.sendAfter);
      if (opts.recordEmitted) record.get(n.nodeId)!.push(...readings);
      senders.get(n.nodeId)!.enqueue(readings);
    }
  };
  const stats = (): FleetStats => {
    const perNode: FleetStats['perNode'] = {};
    for (const n of nodes) {
      const s = senders.get(n.nodeId)!;
      perNode[n.nodeId] = { ...s.stats(), label: n.label, state: s.lastState };
    }
    return { simAt: new Date(clock.nowMs()), live: clock.isLive(), nodes: nodes.length, totals: sumStats(Object.values(perNode)), perNode };
  };
  const drained = () => [...senders.values()].every((s) => s.queued === 0);
  let finishing: Promise<FleetStats> | null = null;
  const finish = (seconds: number) => (finishing ??= (async () => {
    stepper.abort();
    await running;
    await waitForDrain({ drained, seconds });
    await Promise.all([...senders.values()].map((s) => s.stop()));
    return stats();
  })());

  const run = async () => {
    for (const s of senders.values()) s.start();
    if (catchUp === 'instant') {
      // Node by node, yielding between them, so a long gap does not starve the senders.
      for (const n of nodes) {
        if (stepper.signal.aborted) return;
        advance({ toMs: Date.now(), only: [n] });
        await sleep(0);
      }
      clock = createSimClock({ fromMs: Date.now(), speed });
    }
    const endAtMs = opts.durationSeconds !== undefined ? Date.now() + opts.durationSeconds * 1000 : Infinity;
    while (!stepper.signal.aborted && Date.now() < endAtMs) {
      advance({ toMs: clock.nowMs() });
      opts.onTick?.(fleet);
      await sleep(Math.min(tickMs, Math.max(0, endAtMs - Date.now())), undefined, { signal: stepper.signal }).catch(() => undefined);
    }
    // The duration is up: the stretch since the last tick still happened.
    if (!stepper.signal.aborted) advance({ toMs: clock.nowMs() });
  };

  const fleet: Fleet = {
    stats, drained,
    emitted: (nodeId) => [...(record.get(nodeId) ?? [])],
    doneThrough: () => Object.fromEntries([...senders].map(([id, s]) => [id, s.doneThrough])),
    stop: (o = {}) => finish(o.drainSeconds ?? 0),
    done: null as unknown as Promise<FleetStats>,
  };
  const running = run();
  fleet.done = running.then(() => finish(drainSeconds));
  return fleet;
}

/** Steps one node's physics up to `toMs` in steps no longer than `stepSeconds`. */
export function stepNodeTo({ sim, toMs, stepSeconds }: { sim: SimNode; toMs: number; stepSeconds: number }): SimReading[] {
  const out: SimReading[] = [];
  for (let leftSeconds = (toMs - sim.state.at.getTime()) / 1000; leftSeconds > 1e-3; leftSeconds = (toMs - sim.state.at.getTime()) / 1000) {
    out.push(...sim.step(Math.min(stepSeconds, leftSeconds)));
  }
  return out;
}

async function waitForDrain({ drained, seconds }: { drained: () => boolean; seconds: number }): Promise<void> {
  const untilMs = Date.now() + seconds * 1000;
  while (!drained() && Date.now() < untilMs) await sleep(100);
}
