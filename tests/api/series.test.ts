import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { readingRowsQuery, rollupRowsQuery } from '@/lib/db/queries/series';
import { api } from './helpers/stack';
import { signedIn } from './helpers/session';

afterAll(closeDb);

type Agent = Awaited<ReturnType<typeof signedIn>>['agent'];
let viewer: Agent;
let nodeId: number;
let node: { cal_gain: number; cal_offset_volts: number; cells_series: number; cells_parallel: number; cell_farads: number };
const nowS = () => Math.floor(Date.now() / 1000);

beforeAll(async () => {
  viewer = (await signedIn('viewer@larkspur.example')).agent;
  // NF-stage-1 is the demo node with a calibration gain ≠ 1 (1.004, offset −3 mV).
  node = await db()('nodes').where({ name: 'NF-stage-1' }).first('id', 'cal_gain', 'cal_offset_volts', 'cells_series', 'cells_parallel', 'cell_farads');
  nodeId = (node as unknown as { id: number }).id;
  expect(node.cal_gain).not.toBe(1);
});

/** Expected buckets computed here from the raw rows, independently of the server's merging. */
async function expectedBuckets(fromS: number, toS: number, width: number) {
  const rows = await db()('readings').where('node_id', nodeId).andWhere('t', '>=', new Date(fromS * 1000)).andWhere('t', '<', new Date(toS * 1000)).select('t', 'v');
  const map = new Map<number, number[]>();
  for (const r of rows) {
    const b = Math.floor(new Date(r.t).getTime() / 1000 / width) * width;
    map.set(b, [...(map.get(b) ?? []), node.cal_gain * Number(r.v) + node.cal_offset_volts]);
  }
  return map;
}

describe('GET /api/v1/nodes/{id}/series', () => {
  it('answers a year with at most 2000 buckets from the hourly rollups, min ≤ mean ≤ max in each', async () => {
    const res = await viewer.get(`/api/v1/nodes/${nodeId}/series?from=${nowS() - 365 * 86_400}&to=${nowS()}&buckets=2000`);
    expect(res.status).toBe(200);
    const b = res.body.buckets;
    expect(res.body.source).toBe('rollup-3600');
    expect(res.body.count).toBeGreaterThan(0);
    expect(res.body.count).toBeLessThanOrEqual(2000);
    expect(b.t.length).toBe(res.body.count);
    for (let i = 0; i < b.t.length; i++) {
      expect(b.v_min[i]).toBeLessThanOrEqual(b.v_mean[i]);
      expect(b.v_mean[i]).toBeLessThanOrEqual(b.v_max[i]);
      if (i) expect(b.t[i]).toBeGreaterThan(b.t[i - 1]);
    }
    expect(res.body.time_unit).toBe('s');
    expect(res.body.time_zone).toBe('America/Los_Angeles');
  });

  it('gives calibrated volts that match the raw rows, for raw and rollup sources alike', async () => {
    const to = nowS();
    for (const [span, source] of [[86_400, 'raw'], [7 * 86_400, 'rollup-300']] as const) {
      const res = await viewer.get(`/api/v1/nodes/${nodeId}/series?from=${to - span}&to=${to}&buckets=2000`);
      expect(res.status).toBe(200);
      expect(res.body.source).toBe(source);
      const width = res.body.bucket_seconds;
      const expected = await expectedBuckets(Math.floor((to - span) / width) * width, Math.ceil(to / width) * width, width);
      const b = res.body.buckets;
      expect(b.t.length).toBe(expected.size);
      b.t.forEach((t: number, i: number) => {
        const volts = expected.get(t)!;
        // calibrated = gain·v + offset (lib/status/node-spec.ts); FLOAT storage keeps ~7 digits
        expect(b.v_min[i]).toBeCloseTo(Math.min(...volts), 4);
        expect(b.v_max[i]).toBeCloseTo(Math.max(...volts), 4);
        expect(b.v_mean[i]).toBeCloseTo(volts.reduce((a, v) => a + v, 0) / volts.length, 4);
        expect(b.n[i]).toBe(volts.length);
      });
    }
  });

  it('gives energy ½·C·V² and reserve above the burst floor per bucket, C = np·C/ns (DESIGN.md §3)', async () => {
    const res = await viewer.get(`/api/v1/nodes/${nodeId}/series`);
    const farads = (node.cells_parallel * node.cell_farads) / node.cells_series;
    expect(res.body.bank.farads).toBeCloseTo(farads, 9);
    const { buckets: b, bank } = res.body;
    b.t.forEach((_: number, i: number) => {
      expect(b.energy_mean_joules[i]).toBeCloseTo(0.5 * farads * b.v_mean[i] ** 2, 1);
      const reserve = b.v_mean[i] > bank.burst_floor_volts ? 0.5 * farads * (b.v_mean[i] ** 2 - bank.burst_floor_volts ** 2) : 0;
      expect(b.reserve_mean_joules[i]).toBeCloseTo(reserve, 1);
    });
    expect(bank.cutoff_volts).toBeLessThan(bank.burst_floor_volts);
  });

  it('carries the nights of the range and the projection from the latest reading to recharge or brownout', async () => {
    const res = await viewer.get(`/api/v1/nodes/${nodeId}/series?from=${nowS() - 3 * 86_400}&to=${nowS()}`);
    const { nights, projection } = res.body;
    expect(nights.length).toBeGreaterThanOrEqual(2); // three days at 47° N in any season hold two nights or more (common practice)
    for (const n of nights) expect(n.start).toBeLessThan(n.end);
    const latest = await db()('readings').where('node_id', nodeId).andWhere('t', '<=', new Date()).orderBy('t', 'desc').first('t', 'v');
    expect(projection.from_at).toBeCloseTo(new Date(latest.t).getTime() / 1000, 3);
    expect(projection.volts[0]).toBeCloseTo(node.cal_gain * latest.v + node.cal_offset_volts, 4);
    const end = projection.ends_at === 'brownout' ? projection.brownout_at : projection.recharge_at;
    expect(projection.t.at(-1)).toBeCloseTo(end, 0);
    for (let i = 1; i < projection.t.length; i++) expect(projection.volts[i]).toBeLessThanOrEqual(projection.volts[i - 1]);
  });

  it('is 404 for another organization’s node, 401 signed out, 422 for a bad range', async () => {
    const stranger = await signedIn('owner@cinderflats.example');
    const other = await stranger.agent.get(`/api/v1/nodes/${nodeId}/series`);
    expect(other.status).toBe(404);
    expect(other.headers['content-type']).toContain('application/problem+json');
    expect((await api().get(`/api/v1/nodes/${nodeId}/series`)).status).toBe(401);
    expect((await viewer.get(`/api/v1/nodes/${nodeId}/series?from=soon`)).status).toBe(422);
    expect((await viewer.get(`/api/v1/nodes/${nodeId}/series?from=200&to=100`)).status).toBe(422);
    expect((await viewer.get(`/api/v1/nodes/${nodeId}/series?buckets=90000`)).status).toBe(422);
    expect((await viewer.get('/api/v1/nodes/abc/series')).status).toBe(404);
  });

  it('reads rollups and readings by a range on their primary keys (EXPLAIN)', async () => {
    const from = new Date(Date.now() - 365 * 86_400_000);
    const to = new Date();
    const [rollupPlan] = (await db().raw(`EXPLAIN ${rollupRowsQuery({ nodeId, readSeconds: 3600, from, to }).toString()}`))[0];
    expect(rollupPlan).toMatchObject({ key: 'PRIMARY', type: 'range' });
    const [readingPlan] = (await db().raw(`EXPLAIN PARTITIONS ${readingRowsQuery({ nodeId, from: new Date(Date.now() - 86_400_000), to }).select('t', 'v').toString()}`))[0];
    expect(readingPlan).toMatchObject({ key: 'PRIMARY', type: 'range' });
    // a day spans one or two monthly partitions, never the whole table
    expect(String(readingPlan.partitions).split(',').length).toBeLessThanOrEqual(2);
  });
});

describe('GET /api/v1/nodes/{id}/status', () => {
  it('answers the state as of now from the latest reading, with calibrated volts', async () => {
    const res = await viewer.get(`/api/v1/nodes/${nodeId}/status`);
    expect(res.status).toBe(200);
    const latest = await db()('readings').where('node_id', nodeId).andWhere('t', '<=', new Date()).orderBy('t', 'desc').first('t', 'v');
    expect(res.body.volts).toBeCloseTo(node.cal_gain * latest.v + node.cal_offset_volts, 6);
    expect(['steady', 'thin', 'short', 'dark', 'silent', 'new']).toContain(res.body.state);
    expect(res.body.node).toMatchObject({ id: nodeId, name: 'NF-stage-1', time_zone: 'America/Los_Angeles' });
    // state of charge is energy-based: (V² − Vcut²)/(Vmax² − Vcut²) (DESIGN.md §3)
    const { cutoff_volts: c, max_volts: m } = res.body.bank;
    expect(res.body.soc).toBeCloseTo(Math.min(1, Math.max(0, (res.body.volts ** 2 - c ** 2) / (m ** 2 - c ** 2))), 9);
    const stranger = await signedIn('owner@cinderflats.example');
    expect((await stranger.agent.get(`/api/v1/nodes/${nodeId}/status`)).status).toBe(404);
  });
});
