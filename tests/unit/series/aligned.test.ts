import { describe, expect, it } from 'vitest';
import { buildChartColumns, gapBreaks } from '@/lib/series/aligned';
import type { SeriesReply } from '@/lib/series/wire';

function reply(t: number[], withProjection: boolean): SeriesReply {
  const col = t.map((_, i) => 3 + i * 0.01);
  return {
    time_unit: 's', node_id: 1, time_zone: 'UTC', from: t[0], to: t.at(-1)!, bucket_seconds: 60, source: 'raw', count: t.length,
    buckets: {
      t, n: t.map(() => 1), v_min: col, v_mean: col, v_max: col, v_last: col, t_last: t, vp_max: t.map(() => null),
      energy_min_joules: col, energy_mean_joules: col, energy_max_joules: col, reserve_min_joules: col, reserve_mean_joules: col, reserve_max_joules: col,
    },
    has_panel: false, nights: [],
    bank: { farads: 25, max_volts: 5.4, cutoff_volts: 0.5, start_volts: 0.9, burst_floor_volts: 1, energy_full_joules: 364.5 },
    projection: withProjection
      ? { from_at: t.at(-1)!, t: [t.at(-1)!, t.at(-1)! + 600], volts: [3, 2.9], energy_joules: [1, 0.9], reserve_joules: [0.5, 0.4], recharge_at: null, brownout_at: null, ends_at: 'recharge' }
      : null,
  };
}

describe('buildChartColumns', () => {
  it('keeps x strictly ascending with one column per series, all the same length', () => {
    const c = buildChartColumns({ reply: reply([0, 60, 120, 180], true), withProjection: true });
    for (const data of [c.volts, c.energy, c.panel]) {
      const [xs, ...cols] = data;
      for (let i = 1; i < xs.length; i++) expect(xs[i]).toBeGreaterThan(xs[i - 1]);
      for (const col of cols) expect(col).toHaveLength(xs.length);
    }
    // the projection shares the latest reading's x, then continues past it
    expect(c.volts[0]).toEqual([0, 60, 120, 180, 780]);
    expect(c.volts[4]).toEqual([null, null, null, 3, 2.9]);
    expect(c.volts[1][3]).toBeCloseTo(3.03, 9);
    expect(c.panel[0].at(-1)).toBe(780); // the panel chart spans the same time as the others
  });

  it('runs on to the recharge when the projection stops at a brownout first', () => {
    const r = reply([0, 60, 120, 180], true);
    r.projection = { ...r.projection!, ends_at: 'brownout', brownout_at: 780, recharge_at: 5000 };
    const c = buildChartColumns({ reply: r, withProjection: true });
    for (const data of [c.volts, c.energy, c.panel]) expect(data[0].at(-1)).toBe(5000);
    expect(c.volts[4].at(-1)).toBeNull();
  });

  it('breaks the line at a gap instead of bridging it', () => {
    const t = [0, 60, 120, 180, 240, 10_000, 10_060];
    expect(gapBreaks({ t, bucketSeconds: 60 })).toEqual([5120]);
    const c = buildChartColumns({ reply: reply(t, false), withProjection: false });
    const i = c.volts[0].indexOf(5120);
    expect(c.volts[1][i]).toBeNull();
  });
});
