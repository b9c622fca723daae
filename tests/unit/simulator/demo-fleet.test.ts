import { beforeAll, describe, expect, it } from 'vitest';
import { estimateDemoState } from '../../../simulator/fleet/demo-check';
import {
  alignDemoNow, buildDemoSpec, buildNominalSpec, demoNodes, demoOrganization, demoSites, generateDemoHistory,
  secondDemoNodes, secondDemoSites, type DemoNodeHistory,
} from '../../../simulator/fleet/demo-fleet';
import { simulateDischargeUntilBrownout } from '../../../simulator/physics/simulate';
import { getNextSunrise } from '../../../simulator/physics/sun';

// A December evening, 22:00 in the valley: the moment the demo tells its story.
const now = alignDemoNow({ at: new Date('2026-12-02T12:00:00Z') });
const DAY_MS = 86_400_000;
let history: Record<string, DemoNodeHistory>;
let elapsedMs = 0;

beforeAll(() => {
  const started = Date.now();
  history = generateDemoHistory({ now, days: 14, seed: 1 });
  elapsedMs = Date.now() - started;
});

const localHour = (t: Date) => Number(new Intl.DateTimeFormat('en-GB', { timeZone: 'America/Los_Angeles', hour: '2-digit', hourCycle: 'h23' }).format(t));

describe('demo fleet', () => {
  it('is the invented scenario: one trust, four named sites, twelve nodes; a second organization', () => {
    expect(now.toISOString()).toBe('2026-12-02T06:00:00.000Z');
    expect(demoOrganization.name).toBe('Larkspur Hollow Watershed Trust');
    expect(demoSites.map((s) => s.name)).toEqual(['North Fork weir', 'Mill Pond outlet', 'Upper Meadow piezometer', 'Quarry Road culvert']);
    expect(demoNodes).toHaveLength(12);
    expect(new Set(demoNodes.map((n) => n.slug)).size).toBe(12);
    expect(secondDemoSites).toHaveLength(1);
    expect(secondDemoNodes).toHaveLength(2);
    const states = new Set(demoNodes.map((n) => n.intendedState));
    expect([...states].sort()).toEqual(['dark', 'new', 'short', 'silent', 'steady', 'thin']);
  });

  it('produces 14 days of readings for 11 of 12 nodes, quickly', () => {
    expect(elapsedMs).toBeLessThan(30_000);
    const withReadings = demoNodes.filter((n) => history[n.slug].readings.length > 0);
    expect(withReadings).toHaveLength(11);
    for (const n of withReadings) {
      const { readings } = history[n.slug];
      expect(readings[0].t.getTime() - (now.getTime() - 14 * DAY_MS)).toBeLessThan(2 * history[n.slug].demo.config.load.intervalSeconds * 1000);
      expect(readings.every((r, i) => i === 0 || r.t > readings[i - 1].t)).toBe(true);
    }
    expect(history['um-piezo-2'].readings).toHaveLength(0);
  });

  it('shows each node in its intended state by the simulator’s own margin reckoning', () => {
    for (const n of demoNodes) {
      const estimate = estimateDemoState({ spec: buildNominalSpec({ node: history[n.slug].demo }), readings: history[n.slug].readings, now });
      expect({ slug: n.slug, state: estimate.state }).toEqual({ slug: n.slug, state: n.intendedState });
    }
  });

  it('has the dark node quiet since a brownout in the small hours, its last reading near the burst floor', () => {
    const n = demoNodes.find((d) => d.intendedState === 'dark')!;
    const h = history[n.slug];
    const last = h.readings[h.readings.length - 1];
    const estimate = estimateDemoState({ spec: buildNominalSpec({ node: n }), readings: h.readings, now });
    expect(last.v - estimate.floorVolts).toBeLessThan(0.15);
    expect(h.finalState.running).toBe(false);
    const brownout = h.brownouts[h.brownouts.length - 1];
    expect(brownout.getTime()).toBeGreaterThan(last.t.getTime());
    expect(localHour(brownout)).toBeLessThan(6);
    expect(h.readings.filter((r) => r.t > brownout)).toHaveLength(0);
  });

  it('has the silent node running and sending while nothing arrives', () => {
    const h = history['qr-soil-1'];
    expect(h.finalState.running).toBe(true);
    expect(h.finalState.undelivered).toBeGreaterThan(50);
    expect(h.readings[h.readings.length - 1].v).toBeGreaterThan(4);
  });

  it('has short nodes fail before sunrise in the physics and thin ones make it', () => {
    for (const n of demoNodes.filter((d) => d.intendedState === 'short' || d.intendedState === 'thin')) {
      const h = history[n.slug];
      const tuned = h.demo; // as configured for this run (a chosen cadence for some)
      const spec = n.intendedState === 'short' ? buildDemoSpec({ node: tuned, now }) : buildNominalSpec({ node: tuned });
      const sunrise = getNextSunrise({ from: now, latDeg: spec.site.latDeg, lonDeg: spec.site.lonDeg })!;
      const brownout = simulateDischargeUntilBrownout(spec, { from: now, initialVolts: h.finalState.volts });
      if (n.intendedState === 'short') expect(brownout!.getTime()).toBeLessThan(sunrise.getTime());
      else expect(brownout!.getTime()).toBeGreaterThan(sunrise.getTime());
    }
  });
});
