import { SimNode } from '../physics/node';
import { hashSeed, seedFromText } from '../physics/prng';
import type { SimNodeSpec, SimNodeState, SimReading } from '../physics/types';
import { createWeather, type ForcedSpell, type Weather } from '../physics/weather';
import { demoOrganization, demoOrganizations, demoSites, secondDemoOrganization, secondDemoSites, type DemoSite } from './demo-orgs';
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
    site: { latDeg: site.latDeg, lonDeg: site.lonDeg, timeZone: site.timeZone, meanTempC: site.meanTempC, tempSwingC: site.tempSwingC },
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
  readings: SimReading[];
  brownouts: Date[];
  restarts: Date[];
  finalState: SimNodeState;
  /** The node at `now`, ready to keep stepping for a live run. */
  node: SimNode;
}

/**
 * Readings of every demo node (both organizations) for `days` before `now`, from the physics.
 * A two-day warm-up before the window lets each bank settle into its own daily rhythm.
 */
export function generateDemoHistory({ now, days = 14, seed = 1, dtSeconds = 60, warmupDays = 2 }: {
  now: Date; days?: number; seed?: number; dtSeconds?: number; warmupDays?: number;
}): Record<string, DemoNodeHistory> {
  const windowStartMs = now.getTime() - days * 24 * HOUR_MS;
  const startAt = new Date(windowStartMs - warmupDays * 24 * HOUR_MS);
  // One sky per organization (its sites share a valley or a mesa), with the scripted cloudy spell.
  const forcedSpells = makeDemoSpells(now);
  const weathers = new Map<string, Weather>();
  for (const site of allSites) {
    weathers.set(site.slug, createWeather({ seed: hashSeed(seed, seedFromText(site.organizationSlug)), lonDeg: site.lonDeg, forcedSpells }));
  }
  const out: Record<string, DemoNodeHistory> = {};
  for (const demoNode of [...demoNodes, ...secondDemoNodes]) {
    const spec = buildDemoSpec({ node: demoNode, now });
    const chargeVolts = spec.bank.cellsSeries * spec.bank.cellRatedVolts * 0.96;
    const sim = new SimNode(spec, {
      seed: hashSeed(seed, seedFromText(demoNode.slug)), startAt, initialVolts: 0.9 * chargeVolts,
      weather: weathers.get(demoNode.siteSlug),
    });
    const history: DemoNodeHistory = { readings: [], brownouts: [], restarts: [], finalState: sim.state, node: sim };
    while (sim.state.at.getTime() < now.getTime()) {
      const step = sim.stepDetailed(Math.min(dtSeconds, (now.getTime() - sim.state.at.getTime()) / 1000));
      for (const r of step.readings) if (r.t.getTime() >= windowStartMs) history.readings.push(r);
      for (const b of step.brownouts) if (b.getTime() >= windowStartMs) history.brownouts.push(b);
      for (const r of step.restarts) if (r.getTime() >= windowStartMs) history.restarts.push(r);
    }
    history.finalState = sim.state;
    out[demoNode.slug] = history;
  }
  return out;
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
