import { describe, expect, it } from 'vitest';
import { dischargeWindow, evaluateNode, marginOverWindow, modelBank, solveBurstFloor, type SiteSpec } from '@/lib/energy';
import { projectDischarge } from '@/lib/series/projection';
import { bank, converter, load } from './fixtures';

// REFERENCES.md, US Naval Observatory data: Istanbul 41.01384 N 28.94966 E on 2026-06-21,
// sunrise 02:32, sunset 17:40 UTC; allow ±2 min. Recharge elevation −0.833° is the sunrise of
// the tables (common practice). A day later the sunrise moves by well under a minute at the
// solstice (common practice), so the next morning's is taken as 02:32 too, ±2 min.
const istanbul: SiteSpec = { lat: 41.01384, lon: 28.94966, rechargeElevationDeg: -0.833 };
const minutesFrom = (d: Date | null, iso: string) => Math.abs(d!.getTime() - Date.parse(iso)) / 60_000;
const noon = new Date('2026-06-21T10:00:00Z');

describe('the stretch a bank carries alone', () => {
  it('by day starts at the sunset and runs to the next sunrise (USNO times)', () => {
    const w = dischargeWindow({ site: istanbul, at: noon });
    expect(w.chargingNow).toBe(true);
    expect(minutesFrom(w.startAt, '2026-06-21T17:40:00Z')).toBeLessThanOrEqual(2);
    expect(minutesFrom(w.rechargeAt, '2026-06-22T02:32:00Z')).toBeLessThanOrEqual(2);
    expect(w.delaySeconds).toBeCloseTo((w.startAt!.getTime() - noon.getTime()) / 1000, 6);
    expect(w.seconds).toBeCloseTo((w.rechargeAt!.getTime() - w.startAt!.getTime()) / 1000, 6);
  });

  it('at night starts now', () => {
    const night = new Date('2026-06-21T20:00:00Z');
    const w = dischargeWindow({ site: istanbul, at: night });
    expect(w).toMatchObject({ chargingNow: false, delaySeconds: 0, startAt: night });
    expect(minutesFrom(w.rechargeAt, '2026-06-22T02:32:00Z')).toBeLessThanOrEqual(2);
  });

  it('in polar day leaves nothing to carry (Svalbard, 78° N, at the June solstice: no sunset, common practice)', () => {
    const w = dischargeWindow({ site: { lat: 78.2, lon: 15.6, rechargeElevationDeg: -0.833 }, at: noon });
    expect(w).toMatchObject({ chargingNow: true, startAt: null, seconds: 0 });
    const e = evaluateNode({ bank, converter, load, site: { lat: 78.2, lon: 15.6, rechargeElevationDeg: -0.833 }, volts: 4, at: noon });
    expect(e.margin).toBe(Number.POSITIVE_INFINITY);
    expect(e.brownoutAt).toBeNull();
  });
});

describe('a node evaluated by day', () => {
  const spec = { bank, converter, load, site: istanbul };
  const volts = 2.2;

  it('gets the margin its bank would have at dusk with the volts it has now', () => {
    const day = evaluateNode({ ...spec, volts, at: noon });
    const dusk = dischargeWindow({ site: istanbul, at: noon }).startAt!;
    const atDusk = evaluateNode({ ...spec, volts, at: dusk });
    expect(day.chargingUntil).toEqual(dusk);
    expect(atDusk.chargingUntil).toBeNull();
    expect(day.margin).toBeCloseTo(atDusk.margin, 9);
    expect(day.brownoutAt?.getTime()).toBe(atDusk.brownoutAt?.getTime());
    expect(day.rechargeAt?.getTime()).toBe(atDusk.rechargeAt?.getTime());
  });

  it('is never worse off than counting the draw from now, as before dusk the panel carries the load', () => {
    const day = evaluateNode({ ...spec, volts, at: noon });
    const model = modelBank({ bank });
    const floorVolts = solveBurstFloor({ bank: model, converter, load }).volts;
    const fromNow = marginOverWindow({ bank: model, converter, load, volts, floorVolts, windowSeconds: (day.rechargeAt!.getTime() - noon.getTime()) / 1000 });
    expect(day.margin).toBeGreaterThan(fromNow.margin);
    // A brownout, when there is one, is projected for the night, never for the afternoon.
    if (day.brownoutAt) expect(day.brownoutAt.getTime()).toBeGreaterThanOrEqual(day.chargingUntil!.getTime());
  });

  it('draws the projection flat until dusk, then falling', () => {
    const p = projectDischarge({ spec, volts, at: noon });
    const dusk = dischargeWindow({ site: istanbul, at: noon }).startAt!.getTime() / 1000;
    expect(p.volts[0]).toBe(volts);
    expect(p.t[1]).toBeCloseTo(dusk, 0);
    expect(p.volts[1]).toBeCloseTo(volts, 5);
    expect(p.volts.at(-1)!).toBeLessThan(volts);
    if (p.brownout_at !== null) expect(p.brownout_at).toBeGreaterThan(dusk);
  });
});
