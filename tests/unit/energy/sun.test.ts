import { describe, expect, it } from 'vitest';
import * as SunCalc from 'suncalc';
import { isSunBelow, longestNight, nextRechargeAt, nextSunsetAt, nightAfter, nightWindows } from '@/lib/energy';
import type { SiteSpec } from '@/lib/energy';

const kyiv: SiteSpec = { lat: 50.45466, lon: 30.5238, rechargeElevationDeg: -0.833 };
const istanbul: SiteSpec = { lat: 41.01384, lon: 28.94966, rechargeElevationDeg: -0.833 };
const minutesFrom = (d: Date | null, iso: string) => Math.abs(d!.getTime() - Date.parse(iso)) / 60_000;

describe('sunrise and sunset against US Naval Observatory tables', () => {
  // REFERENCES.md, US Naval Observatory data, to the minute: allow ±2 min.
  it('Kyiv 2026-06-21: 01:46 / 18:13 UTC', () => {
    expect(minutesFrom(nextRechargeAt({ site: kyiv, at: new Date('2026-06-20T20:00:00Z') }), '2026-06-21T01:46:00Z')).toBeLessThanOrEqual(2); // USNO
    expect(minutesFrom(nextSunsetAt({ site: kyiv, at: new Date('2026-06-21T12:00:00Z') }), '2026-06-21T18:13:00Z')).toBeLessThanOrEqual(2); // USNO
  });

  it('Istanbul 2026-03-20: 04:08 / 16:16 UTC', () => {
    expect(minutesFrom(nextRechargeAt({ site: istanbul, at: new Date('2026-03-19T17:00:00Z') }), '2026-03-20T04:08:00Z')).toBeLessThanOrEqual(2); // USNO
    expect(minutesFrom(nextSunsetAt({ site: istanbul, at: new Date('2026-03-20T10:00:00Z') }), '2026-03-20T16:16:00Z')).toBeLessThanOrEqual(2); // USNO
  });

  it('Istanbul 2026-06-21: 02:32 / 17:40 UTC', () => {
    expect(minutesFrom(nextRechargeAt({ site: istanbul, at: new Date('2026-06-20T23:59:00Z') }), '2026-06-21T02:32:00Z')).toBeLessThanOrEqual(2); // USNO
    expect(minutesFrom(nextSunsetAt({ site: istanbul, at: new Date('2026-06-21T03:00:00Z') }), '2026-06-21T17:40:00Z')).toBeLessThanOrEqual(2); // USNO
  });

  it('agrees with suncalc getTimes to a few seconds (independent path through the same library)', () => {
    const times = SunCalc.getTimes(new Date('2026-06-21T12:00:00Z'), kyiv.lat, kyiv.lon);
    const ours = nextRechargeAt({ site: kyiv, at: new Date('2026-06-20T20:00:00Z') })!;
    expect(Math.abs(ours.getTime() - times.sunrise!.getTime())).toBeLessThan(5_000);
  });
});

describe('recharge instant', () => {
  it('is strictly after the evaluation instant: by day it is the next morning', () => {
    const at = new Date('2026-06-21T09:00:00Z');
    const next = nextRechargeAt({ site: kyiv, at })!;
    expect(minutesFrom(next, '2026-06-22T01:46:00Z')).toBeLessThanOrEqual(3); // derived here: sunrise moves < 1 min/day at the solstice
  });

  it('a higher recharge elevation comes later', () => {
    const at = new Date('2026-03-19T20:00:00Z');
    const standard = nextRechargeAt({ site: istanbul, at })!;
    const panel = nextRechargeAt({ site: { ...istanbul, rechargeElevationDeg: 10 }, at })!;
    // derived here: ~10.8° more at ≈ 0.19°/min near the equinox at 41° N (15°/h · cos 41°) → ~57 min
    expect((panel.getTime() - standard.getTime()) / 60_000).toBeGreaterThan(50);
    expect((panel.getTime() - standard.getTime()) / 60_000).toBeLessThan(65);
  });

  it('polar night at 78° N in December: none within 7 days', () => {
    const arctic: SiteSpec = { lat: 78, lon: 15, rechargeElevationDeg: -0.833 };
    expect(nextRechargeAt({ site: arctic, at: new Date('2026-12-15T12:00:00Z') })).toBeNull();
    expect(isSunBelow({ site: arctic, at: new Date('2026-12-15T12:00:00Z') })).toBe(true);
  });

  it('isSunBelow by night and by day', () => {
    expect(isSunBelow({ site: kyiv, at: new Date('2026-06-21T00:00:00Z') })).toBe(true);
    expect(isSunBelow({ site: kyiv, at: new Date('2026-06-21T10:00:00Z') })).toBe(false);
  });
});

describe('nights', () => {
  it('night windows alternate with days', () => {
    const windows = nightWindows({ site: kyiv, from: new Date('2026-06-20T12:00:00Z'), to: new Date('2026-06-23T12:00:00Z') });
    expect(windows).toHaveLength(3);
    for (const w of windows) {
      const hours = (w.end.getTime() - w.start.getTime()) / 3_600_000;
      expect(hours).toBeGreaterThan(7.3); // derived here: 24 h − (18:13 − 01:46) ≈ 7.55 h
      expect(hours).toBeLessThan(7.8);
    }
  });

  it('the longest night falls in December in the north and June in the south', () => {
    const north = longestNight({ site: { lat: 47, lon: 8, rechargeElevationDeg: -0.833 }, year: 2026 });
    const south = longestNight({ site: { lat: -41.3, lon: 174.8, rechargeElevationDeg: -0.833 }, year: 2026 });
    expect([11, 0]).toContain(north.start!.getUTCMonth());
    expect([5, 6]).toContain(south.start!.getUTCMonth());
    // derived here: at 47° N on the solstice, cos H0 = (sin(−0.833°) − sin 47°·sin(−23.44°))/(cos 47°·cos 23.44°)
    const rad = Math.PI / 180;
    const cosH0 = (Math.sin(-0.833 * rad) - Math.sin(47 * rad) * Math.sin(-23.44 * rad)) / (Math.cos(47 * rad) * Math.cos(23.44 * rad));
    const dayHours = (2 * Math.acos(cosH0)) / rad / 15;
    expect(Math.abs(north.seconds / 3600 - (24 - dayHours))).toBeLessThan(0.05);
    expect(nightAfter({ site: { lat: 47, lon: 8, rechargeElevationDeg: -0.833 }, date: new Date('2026-06-21') }).seconds).toBeLessThan(north.seconds);
  });
});
