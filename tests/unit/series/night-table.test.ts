import { describe, expect, it } from 'vitest';
import { drawScaleFrom, modelBank, nightMargin } from '@/lib/energy';
import { buildNightRows, lastNights } from '@/lib/series/night-table';
import { bank, converter, load, site } from '../energy/fixtures';

const spec = { bank, converter, load, site };
const farads = modelBank({ bank }).farads; // 3·100/2 = 150 F (derived here)
const start = new Date('2026-12-20T16:00:00Z');
const end = new Date('2026-12-21T07:00:00Z');

/** A bank drawn at a constant 2 mW from 3 V: V(t) = √(V0² − 2Pt/C) (constant-power discharge, derived here). */
function samples(stepSeconds: number) {
  const out = [];
  for (let t = -3600; t <= (end.getTime() - start.getTime()) / 1000 + 3600; t += stepSeconds) {
    const inside = Math.max(0, Math.min(t, (end.getTime() - start.getTime()) / 1000));
    out.push({ t: new Date(start.getTime() + t * 1000), volts: Math.sqrt(9 - (2 * 0.002 * inside) / farads) });
  }
  return out;
}

describe('buildNightRows', () => {
  const [row] = buildNightRows({ spec, nights: [{ start, end }], samples: samples(600), now: new Date('2026-12-22T00:00:00Z') });

  it('takes dusk and dawn from the first and last reading inside the night', () => {
    expect(row.dusk_at).toBe(start.getTime() / 1000);
    expect(row.dawn_at).toBe(end.getTime() / 1000);
    expect(row.dusk_at).toBeLessThan(row.dawn_at);
    expect(row.dusk_volts).toBeCloseTo(3, 9);
    expect(row.dusk_energy_joules).toBeCloseTo(0.5 * 150 * 9, 6); // ½·C·V² (OpenStax College Physics 2e §19.7)
    expect(row.min_volts).toBe(row.dawn_volts);
    expect(row.readings).toBe(91); // 15 h at one reading every 10 min, both ends included
    expect(row.complete).toBe(true);
  });

  it('measures the draw from the slope of ½·C·V²: 2 mW in, 2 mW out', () => {
    // constant-power discharge: ½C(V0² − V²) = P·t exactly, so the fitted slope is P
    expect(row.measured_watts).toBeCloseTo(0.002, 6);
    expect(row.modelled_watts).toBeGreaterThan(0);
  });

  it('gives the margin the model gives from the dusk reading to dawn', () => {
    const m = nightMargin({ ...spec, volts: 3, at: start, rechargeAt: end });
    expect(row.margin_at_dusk).toBeCloseTo(m.margin, 9);
  });

  it('says where a node fell silent inside the night (our rule: more than three report intervals)', () => {
    expect(row.quiet_from).toBeNull();
    const all = samples(600);
    const cut = start.getTime() + 5 * 3600_000;
    const [dropped] = buildNightRows({ spec, nights: [{ start, end }], samples: all.filter((x) => x.t.getTime() <= cut), now: new Date('2026-12-22T00:00:00Z') });
    expect(dropped.quiet_from).toBe(cut / 1000);
    expect(dropped.quiet_volts).toBe(all.find((x) => x.t.getTime() === cut)!.volts);
    // A hole from 3 h to 6 h, then reports again until dawn: silent from the last one before it.
    const holeFrom = start.getTime() + 3 * 3600_000;
    const withHole = all.filter((x) => x.t.getTime() <= holeFrom || x.t.getTime() >= start.getTime() + 6 * 3600_000);
    expect(buildNightRows({ spec, nights: [{ start, end }], samples: withHole, now: end })[0].quiet_from).toBe(holeFrom / 1000);
    // Tonight, still reporting: counted up to now, not to a dawn still ahead.
    const now = new Date(start.getTime() + 2 * 3600_000 + 60_000);
    const tonight = buildNightRows({ spec, nights: [{ start, end }], samples: all.filter((x) => x.t.getTime() <= now.getTime()), now })[0];
    expect(tonight.complete).toBe(false);
    expect(tonight.quiet_from).toBeNull();
  });

  it('leaves a night without readings empty rather than invented', () => {
    const [empty] = buildNightRows({ spec, nights: [{ start, end }], samples: [], now: end });
    expect(empty).toMatchObject({ readings: 0, dusk_volts: null, min_volts: null, measured_watts: null, margin_at_dusk: null });
  });
});

describe('the margin at dusk after a night of heavy draw', () => {
  // The night before (19–20 Dec) drawn at a constant 10 mW from 3 V (540 J of the 675 J at dusk), five times the 2 mW night above.
  const prevStart = new Date('2026-12-19T16:00:00Z');
  const prevEnd = new Date('2026-12-20T07:00:00Z');
  const heavy = [];
  for (let t = 0; t <= (prevEnd.getTime() - prevStart.getTime()) / 1000; t += 600) {
    heavy.push({ t: new Date(prevStart.getTime() + t * 1000), volts: Math.sqrt(9 - (2 * 0.01 * t) / farads) });
  }
  const rows = buildNightRows({
    spec, nights: [{ start, end }, { start: prevStart, end: prevEnd }], samples: [...samples(600), ...heavy], now: new Date('2026-12-22T00:00:00Z'),
  });

  it('is projected with the night before’s measured draw, as the live status is', () => {
    const [tonight, before] = rows;
    const scale = drawScaleFrom({ measuredWatts: before.measured_watts, modelledWatts: before.modelled_watts });
    expect(before.measured_watts).toBeCloseTo(0.01, 5); // ½C(V0² − V²) = P·t (derived here)
    expect(scale).toBeGreaterThan(1);
    expect(tonight.margin_draw_scale).toBe(scale);
    expect(tonight.margin_at_dusk).toBeCloseTo(nightMargin({ ...spec, volts: 3, at: start, rechargeAt: end, drawScale: scale }).margin, 9);
    expect(tonight.margin_at_dusk!).toBeLessThan(nightMargin({ ...spec, volts: 3, at: start, rechargeAt: end }).margin);
  });

  it('the oldest night, with none before it, keeps the plain model', () => {
    expect(rows[1].margin_draw_scale).toBe(1);
    expect(rows[1].margin_at_dusk).toBeCloseTo(nightMargin({ ...spec, volts: 3, at: prevStart, rechargeAt: prevEnd }).margin, 9);
  });
});

describe('lastNights', () => {
  it('keeps the nights begun by now, newest first', () => {
    const w = (d: number) => ({ start: new Date(Date.UTC(2026, 11, d, 16)), end: new Date(Date.UTC(2026, 11, d + 1, 7)) });
    const nights = lastNights({ windows: [w(1), w(2), w(3), w(4)], now: new Date(Date.UTC(2026, 11, 3, 20)), count: 2 });
    expect(nights.map((n) => n.start.getUTCDate())).toEqual([3, 2]);
  });
});
