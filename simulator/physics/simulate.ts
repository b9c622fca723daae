import { SimNode, type SimNodeOptions } from './node';
import type { SimNodeSpec, SimNodeState, SimReading } from './types';

export interface SimulateNodeOptions {
  from: Date;
  to: Date;
  dtSeconds: number;
  seed: number;
  initialVolts: number;
  weather?: SimNodeOptions['weather'];
  noSun?: boolean;
}

export interface SimulateNodeResult {
  readings: SimReading[];
  brownouts: Date[];
  restarts: Date[];
  finalState: SimNodeState;
}

/** Runs one node from `from` to `to` and collects what it posted, when it browned out and restarted. */
export function simulateNode(spec: SimNodeSpec, opts: SimulateNodeOptions): SimulateNodeResult {
  const node = new SimNode(spec, { seed: opts.seed, startAt: opts.from, initialVolts: opts.initialVolts, weather: opts.weather, noSun: opts.noSun });
  const result: SimulateNodeResult = { readings: [], brownouts: [], restarts: [], finalState: node.state };
  const endMs = opts.to.getTime();
  while (node.state.at.getTime() < endMs) {
    const seconds = Math.min(opts.dtSeconds, (endMs - node.state.at.getTime()) / 1000);
    const step = node.stepDetailed(seconds);
    for (const r of step.readings) result.readings.push(r);
    for (const b of step.brownouts) result.brownouts.push(b);
    for (const r of step.restarts) result.restarts.push(r);
  }
  result.finalState = node.state;
  return result;
}

/**
 * The first failed report (the simulator's brownout) in the dark from `initialVolts`, or null
 * within `maxSeconds`. Reports start one interval after `from`, as for a node mid-cycle.
 * Faults that act from a date are applied as the spec says.
 */
export function simulateDischargeUntilBrownout(spec: SimNodeSpec, opts: {
  from: Date; initialVolts: number; noSun?: boolean; dtSeconds?: number; maxSeconds?: number; seed?: number;
}): Date | null {
  const node = new SimNode(spec, {
    seed: opts.seed ?? 1, startAt: opts.from, initialVolts: opts.initialVolts,
    noSun: opts.noSun ?? true, firstReportAfterSeconds: spec.load.intervalSeconds,
  });
  if (!node.state.running) return opts.from;
  const endMs = opts.from.getTime() + (opts.maxSeconds ?? 14 * 86_400) * 1000;
  while (node.state.at.getTime() < endMs) {
    const step = node.stepDetailed(opts.dtSeconds ?? 30);
    if (step.brownouts.length > 0) return step.brownouts[0];
  }
  return null;
}
