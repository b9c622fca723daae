import { SimNode } from '../physics/node';
import { hashSeed, seedFromText } from '../physics/prng';
import type { SimNodeSpec, SimNodeState, SimReading } from '../physics/types';
import { createWeather, type ForcedSpell, type Weather } from '../physics/weather';
import { demoOrganization, demoOrganizations, demoSites, secondDemoOrganization, secondDemoSites, type DemoSite } from './demo-orgs';
import { estimateDemoState } from './demo-check';
import { demoNodes, secondDemoNodes, type DemoNode } from './demo-nodes';

export { demoOrganization, demoOrganizations, demoSites, secondDemoOrganization, secondDemoSites, demoNodes, secondDemoNodes };
export type { DemoNode, DemoSite };
export type { DemoNodeState, DemoHiddenFaults } from './demo-nodes';
export type { DemoOrganization } from './demo-orgs';

const HOUR_MS = 3_600_000;
/**
 * The demo's last days are scripted: two clear days, then a cloudy spell up to "now" and on
 * through the night (DESIGN.md §1 names "a long cloudy spell" as a cause). The clear days let
 * the shaded panel fill its bank, so its state at "now" does not hang on earlier random weather.
 */
export const CLOUDY_SPELL_HOURS_BEFORE_NOW = 46;
export const CLEAR_SPELL_HOURS_BEFORE_NOW = 94;

function makeDemoSpells(now: Date): ForcedSpell[] {
  const at = (hoursFromNow: number) => new Date(now.getTime() + hoursFromNow * HOUR_MS);
  return [
    { from: at(-CLEAR_SPELL_HOURS_BEFORE_NOW), to: at(-CLOUDY_SPELL_HOURS_BEFORE_NOW), kind: 'clear' },
    { from: at(-CLOUDY_SPELL_HOURS_BEFORE_NOW), to: at(12), kind: 'overcast' },
  ];
}
const allSites = [...demoSites, ...secondDemoSites];

export function findDemoSite(siteSlug: string): DemoSite {
  const site = allSites.find((s) => s.slug === siteSlug);
  if (!site) throw new Error(`unknown demo site ${siteSlug}`);
  return site;
}

/** The full physical spec of a demo node: its configuration plus its hidden faults, timed from `now`. */
export function buildDemoSpec({ node, now }: { node: DemoNode; now: Date }): SimNodeSpec {
  const site = findDemoSite(node.siteSlug);
  const h = node.hidden;
  const before = (hours: number | undefined) => (hours === undefined ? null : new Date(now.getTime() - hours * HOUR_MS));
  return {
    slug: node.slug,
    site: {
      latDeg: site.latDeg, lonDeg: site.lonDeg, timeZone: site.timeZone, meanTempC: site.meanTempC, tempSwingC: site.tempSwingC,
      horizonDeg: site.horizonDeg, rechargeElevationDeg: site.rechargeElevationDeg,
    },
    ...node.config,
    rssiDbm: node.rssiDbm,
    faults: {
      capacitanceFactor: h.capacitanceFactor ?? 1,
      leakageFactor: h.leakageFactor ?? 1,
      shadingFactor: h.shadingFactor ?? 1,
      dirtFactor: h.dirtFactor ?? 1,
      stuckAwakeAmps: h.stuckAwakeAmps ?? null,
      panelLostFrom: before(h.panelLostHoursBeforeNow),
      stuckAwakeFrom: before(h.stuckAwakeHoursBeforeNow),
      linkFaultFrom: h.neverReported ? new Date(0) : before(h.linkFaultHoursBeforeNow),
    },
  };
}

/** The same spec as the owner configured it: no hidden faults (what an energy model would assume). */
export function buildNominalSpec({ node }: { node: DemoNode }): SimNodeSpec {
  const spec = buildDemoSpec({ node, now: new Date(0) });
  return { ...spec, faults: {} };
}

export interface DemoNodeHistory {
  /** The node as configured for this run (a `cadenceFor` node carries its chosen interval). */
  demo: DemoNode;
  readings: SimReading[];
  brownouts: Date[];
  restarts: Date[];
  finalState: SimNodeState;
  /** The node at `now`, ready to keep stepping for a live run. */
  node: SimNode;
}

interface HistoryRun {
  now: Date; seed: number; dtSeconds: number; windowStartMs: number; startAt: Date; weathers: Map<string, Weather>; marginOf: DemoMarginOf;
}

/** A node's night margin at `now`, judged from its readings; null when it is not running (dark, silent, new). */
export type DemoMarginOf = (args: { node: DemoNode; history: DemoNodeHistory; now: Date }) => number | null;

/** The simulator's own reckoning (demo-check), for runs without the product's model at hand. */
export const simulatorMarginOf: DemoMarginOf = ({ node, history, now }) => {
  const estimate = estimateDemoState({ spec: buildNominalSpec({ node }), readings: history.readings, now });
  if (estimate.state === 'dark' || estimate.state === 'silent' || estimate.state === 'new') return null;
  return estimate.margin;
};

/**
 * Readings of every demo node (both organizations) for `days` before `now`, from the physics.
 * A two-day warm-up before the window lets each bank settle into its own daily rhythm.
 * Nodes marked `cadenceFor` get the report interval found for them (judged by `marginOf`),
 * unless `cadences` already names it (a live run continuing a seeded history).
 */
export function generateDemoHistory({ now, days = 14, seed = 1, dtSeconds = 60, warmupDays = 2, cadences = {}, marginOf = simulatorMarginOf }: {
  now: Date; days?: number; seed?: number; dtSeconds?: number; warmupDays?: number;
  cadences?: Record<string, number>; marginOf?: DemoMarginOf;
}): Record<string, DemoNodeHistory> {
  const windowStartMs = now.getTime() - days * 24 * HOUR_MS;
  const startAt = new Date(windowStartMs - warmupDays * 24 * HOUR_MS);
  // One sky per organization (its sites share a valley or a mesa), with the scripted cloudy spell.
  const forcedSpells = makeDemoSpells(now);
  const weathers = new Map<string, Weather>();
  for (const site of allSites) {
    weathers.set(site.slug, createWeather({ seed: hashSeed(seed, seedFromText(site.organizationSlug)), lonDeg: site.lonDeg, forcedSpells }));
  }
  const run: HistoryRun = { now, seed, dtSeconds, windowStartMs, startAt, weathers, marginOf };
  const out: Record<string, DemoNodeHistory> = {};
  for (const demoNode of [...demoNodes, ...secondDemoNodes]) {
    const fixed = cadences[demoNode.slug];
    if (fixed !== undefined) out[demoNode.slug] = simulateDemoNode(withInterval(demoNode, fixed), run);
    else if (demoNode.cadenceFor) out[demoNode.slug] = findCadence(demoNode, demoNode.cadenceFor, run);
    else out[demoNode.slug] = simulateDemoNode(demoNode, run);
  }
  return out;
}

/** The report intervals this history chose for its `cadenceFor` nodes (for demo-fleet.json). */
export function chosenCadences(history: Record<string, DemoNodeHistory>): Record<string, number> {
  return Object.fromEntries(Object.values(history).filter((h) => h.demo.cadenceFor).map((h) => [h.demo.slug, h.demo.config.load.intervalSeconds]));
}

function withInterval(demoNode: DemoNode, seconds: number): DemoNode {
  return { ...demoNode, config: { ...demoNode.config, load: { ...demoNode.config.load, intervalSeconds: seconds } } };
}

function simulateDemoNode(demoNode: DemoNode, run: HistoryRun): DemoNodeHistory {
  const { now, windowStartMs } = run;
  const spec = buildDemoSpec({ node: demoNode, now });
  const chargeVolts = spec.bank.cellsSeries * spec.bank.cellRatedVolts * 0.96;
  const sim = new SimNode(spec, {
    seed: hashSeed(run.seed, seedFromText(demoNode.slug)), startAt: run.startAt, initialVolts: 0.9 * chargeVolts,
    weather: run.weathers.get(demoNode.siteSlug),
  });
  const history: DemoNodeHistory = { demo: demoNode, readings: [], brownouts: [], restarts: [], finalState: sim.state, node: sim };
  while (sim.state.at.getTime() < now.getTime()) {
    const step = sim.stepDetailed(Math.min(run.dtSeconds, (now.getTime() - sim.state.at.getTime()) / 1000));
    for (const r of step.readings) if (r.t.getTime() >= windowStartMs) history.readings.push(r);
    for (const b of step.brownouts) if (b.getTime() >= windowStartMs) history.brownouts.push(b);
    for (const r of step.restarts) if (r.getTime() >= windowStartMs) history.restarts.push(r);
  }
  history.finalState = sim.state;
  return history;
}

/** Night margins the tuned nodes aim at, and the bands they must land in (DESIGN.md §4 default thresholds 1.0 and 1.5). */
export const CADENCE_TARGET = {
  thin: { margin: 1.25, band: [1.0, 1.5] },
  short: { margin: 0.55, band: [0.1, 1.0] },
} as const;
const CADENCE_STEP_SECONDS = 1;
const MIN_CADENCE_SECONDS = 60;
const NEIGHBOUR_STEPS = 24;

/**
 * The report interval, in whole steps, at which the node's night margin at `now` sits in its
 * band. A longer interval draws less all day and all night, so the margin rises with it and
 * a bisection finds where it crosses the target. Close before a recharge the margin also
 * jumps with when the last report fell, so when the crossing lands outside the band the
 * neighbouring intervals are tried and the one nearest the target is kept. A node that is
 * not running counts as margin 0; one whose margin has no bound as above any target.
 */
function findCadence(demoNode: DemoNode, state: 'thin' | 'short', run: HistoryRun): DemoNodeHistory {
  const { margin: target, band } = CADENCE_TARGET[state];
  const inBand = (m: number) => m >= band[0] && m < band[1];
  const tried = new Map<number, { history: DemoNodeHistory; margin: number }>();
  const tryInterval = (steps: number) => {
    const node = withInterval(demoNode, steps * CADENCE_STEP_SECONDS);
    const history = simulateDemoNode(node, run);
    const attempt = { history, margin: run.marginOf({ node, history, now: run.now }) ?? 0 };
    tried.set(steps, attempt);
    return attempt;
  };
  const minSteps = MIN_CADENCE_SECONDS / CADENCE_STEP_SECONDS;
  const maxSteps = Math.floor(demoNode.config.load.maxIntervalSeconds / CADENCE_STEP_SECONDS);
  let [lo, hi] = [minSteps, maxSteps];
  if (tryInterval(hi).margin >= target) {
    while (hi - lo > 1) {
      const mid = Math.floor((lo + hi) / 2);
      if (tryInterval(mid).margin >= target) hi = mid;
      else lo = mid;
    }
  }
  const nearest = () => [...tried.values()].reduce((a, b) => (Math.abs(b.margin - target) < Math.abs(a.margin - target) ? b : a));
  if (inBand(tried.get(hi)!.margin)) return tried.get(hi)!.history;
  for (let d = 1; d <= NEIGHBOUR_STEPS; d += 1) {
    for (const steps of [hi - d, hi + d]) {
      if (steps < minSteps || steps > maxSteps || tried.has(steps)) continue;
      if (inBand(tryInterval(steps).margin)) return tried.get(steps)!.history;
    }
  }
  return nearest().history; // no cadence nearby lands in the band: the closest one
}

/** The latest instant at or before `at` that is `localHour`:00 in `timeZone` (the demo tells its story at 22:00). */
export function alignDemoNow({ at, timeZone = 'America/Los_Angeles', localHour = 22 }: { at: Date; timeZone?: string; localHour?: number }): Date {
  const hourIn = new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', hourCycle: 'h23' });
  let t = Math.floor(at.getTime() / HOUR_MS) * HOUR_MS;
  for (let i = 0; i < 48; i += 1, t -= HOUR_MS) {
    if (Number(hourIn.format(new Date(t))) === localHour) return new Date(t);
  }
  throw new Error(`no ${localHour}:00 in ${timeZone} within two days`);
}
