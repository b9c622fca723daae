import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { api } from './helpers/stack';
import { createTestNode } from './helpers/fleet';
import { signedIn } from './helpers/session';

afterAll(closeDb);

let node: Awaited<ReturnType<typeof createTestNode>>;
const COUNT = 240;
const STEP_S = 300;
let t0: number;

beforeAll(async () => {
  // A calibrated node (invented figures), so reported and calibrated volts differ in the export.
  node = await createTestNode('export', { calibration: { gain: 1.004, offset_volts: -0.003 } });
  // 240 readings five minutes apart, ending an hour ago: 20 hours of made-up discharge.
  t0 = Math.floor(Date.now() / 1000 / STEP_S) * STEP_S - 3600 - COUNT * STEP_S;
  const readings = Array.from({ length: COUNT }, (_, i) => ({ t: t0 + i * STEP_S, v: Number((4.8 - i * 0.004).toFixed(3)), vp: i % 3 ? 0.2 : 5.9, seq: i }));
  const res = await api().post('/api/v1/readings').set('authorization', `Bearer ${node.token}`).set('content-type', 'application/json').send(JSON.stringify({ readings }));
  expect(res.status).toBe(200);
  expect(res.body.accepted).toBe(COUNT);
});

describe('GET /api/v1/nodes/{id}/export (readings CSV)', () => {
  it('streams every reading of [from, to) under a header line, as a download', async () => {
    const from = t0 + 10 * STEP_S;
    const to = t0 + 110 * STEP_S; // exclusive: the reading at `to` stays out
    const res = await node.session.agent.get(`/api/v1/nodes/${node.nodeId}/export?from=${from}&to=${to}`).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toContain('text/csv');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename=".+\.csv"$/);
    expect(res.headers['content-length']).toBeUndefined(); // streamed (chunked), not sized up front
    const lines = res.text.split('\r\n').filter(Boolean);
    expect(lines[0]).toBe('t,v_reported,v_calibrated,vp,temp_c,rssi_dbm,seq');
    expect(lines).toHaveLength(1 + 100);
    const first = lines[1].split(',');
    expect(first[0]).toBe(new Date(from * 1000).toISOString());
    expect(Number(first[1])).toBeCloseTo(4.8 - 10 * 0.004, 5);
    const cal = node.body.calibration as { gain: number; offset_volts: number };
    expect(Number(first[2])).toBeCloseTo(cal.gain * (4.8 - 10 * 0.004) + cal.offset_volts, 4);
    expect(first[6]).toBe('10');
    expect(lines.at(-1)!.split(',')[6]).toBe('109');
  });

  it('exports a whole demo node: as many lines as stored readings', async () => {
    const viewer = await signedIn('viewer@larkspur.example');
    const demo = await db()('nodes').where({ name: 'NF-stage-1' }).first('id'); // a fixed 600 s cadence, never browned out
    const from = Math.floor(Date.now() / 1000) - 30 * 86_400;
    const to = Math.floor(Date.now() / 1000) + 60;
    const [{ n }] = await db()('readings').where('node_id', demo.id).andWhere('t', '>=', new Date(from * 1000)).andWhere('t', '<', new Date(to * 1000)).count({ n: '*' });
    const res = await viewer.agent.get(`/api/v1/nodes/${demo.id}/export?from=${from}&to=${to}`).buffer(true);
    expect(res.status).toBe(200);
    expect(res.text.split('\r\n').filter(Boolean)).toHaveLength(1 + Number(n));
    expect(Number(n)).toBeGreaterThan(1000);
  });

  it('is 404 for another organization, 401 signed out', async () => {
    const stranger = await signedIn('owner@cinderflats.example');
    expect((await stranger.agent.get(`/api/v1/nodes/${node.nodeId}/export`)).status).toBe(404);
    expect((await api().get(`/api/v1/nodes/${node.nodeId}/export`)).status).toBe(401);
  });
});

describe('a retired node\'s readings', () => {
  it('still export in full (kept on record) while its other routes answer 404', async () => {
    const retired = await createTestNode('export-retired');
    const start = Math.floor(Date.now() / 1000 / 60) * 60 - 3 * 3600;
    const readings = Array.from({ length: 30 }, (_, i) => ({ t: start + i * 60, v: Number((4.5 - i * 0.001).toFixed(3)), seq: i }));
    const post = await api().post('/api/v1/readings').set('authorization', `Bearer ${retired.token}`).set('content-type', 'application/json').send(JSON.stringify({ readings }));
    expect(post.status).toBe(200);
    expect((await retired.session.agent.delete(`/api/v1/nodes/${retired.nodeId}`).set('origin', retired.session.origin)).status).toBe(204);

    expect((await retired.session.agent.get(`/api/v1/nodes/${retired.nodeId}/series`)).status).toBe(404);
    expect((await retired.session.agent.get(`/api/v1/nodes/${retired.nodeId}`)).status).toBe(404);
    const res = await retired.session.agent.get(`/api/v1/nodes/${retired.nodeId}/export?from=${start}&to=${start + 30 * 60}`).buffer(true);
    expect(res.status).toBe(200);
    const lines = res.text.split('\r\n').filter(Boolean);
    expect(lines).toHaveLength(1 + 30);
    expect(lines.at(-1)!.split(',')[6]).toBe('29');
    // the file carries the name the node had, not the " (deleted N)" that freed it
    expect(res.headers['content-disposition']).toContain(retired.body.name);
    expect(res.headers['content-disposition']).not.toContain('deleted');
    // and another organization still cannot read it
    const stranger = await signedIn('owner@cinderflats.example');
    expect((await stranger.agent.get(`/api/v1/nodes/${retired.nodeId}/export`)).status).toBe(404);
  });
});

describe('GET /api/v1/nodes/{id}/nights (the night-by-night table)', () => {
  it('lists the last 14 nights newest first, dusk before dawn, with every field', async () => {
    const viewer = await signedIn('viewer@larkspur.example');
    const demo = await db()('nodes').where({ name: 'NF-stage-1' }).first('id', 'cal_gain', 'cal_offset_volts', 'cells_series', 'cells_parallel', 'cell_farads');
    const res = await viewer.agent.get(`/api/v1/nodes/${demo.id}/nights`);
    expect(res.status).toBe(200);
    const nights = res.body.nights;
    expect(nights).toHaveLength(14);
    const fields = ['dusk_at', 'dawn_at', 'complete', 'readings', 'dusk_volts', 'dawn_volts', 'dusk_energy_joules', 'dawn_energy_joules', 'min_volts', 'measured_watts', 'modelled_watts', 'margin_at_dusk'];
    for (const [i, n] of nights.entries()) {
      for (const f of fields) expect(n).toHaveProperty(f);
      expect(n.dusk_at).toBeLessThan(n.dawn_at);
      if (i) expect(n.dusk_at).toBeLessThan(nights[i - 1].dusk_at);
      // Nights at 47° N last between about 8 h (June) and 16 h (December) at sunrise elevation; a +3°
      // recharge elevation lengthens them by well under an hour (common practice; loose bounds on purpose)
      if (n.complete) {
        expect((n.dawn_at - n.dusk_at) / 3600).toBeGreaterThan(7);
        expect((n.dawn_at - n.dusk_at) / 3600).toBeLessThan(18);
      }
    }
    // The dusk figures are the first reading inside the night, calibrated; energy ½·C·V².
    const night = nights.find((n: { complete: boolean; readings: number }) => n.complete && n.readings > 10);
    const first = await db()('readings').where('node_id', demo.id).andWhere('t', '>=', new Date(night.dusk_at * 1000)).orderBy('t').first('t', 'v');
    const volts = demo.cal_gain * first.v + demo.cal_offset_volts;
    expect(night.dusk_volts).toBeCloseTo(volts, 5);
    expect(night.dusk_energy_joules).toBeCloseTo(0.5 * ((demo.cells_parallel * demo.cell_farads) / demo.cells_series) * volts ** 2, 2);
    expect(night.min_volts).toBeLessThanOrEqual(night.dusk_volts);
    expect(night.measured_watts).toBeGreaterThan(0);
  });

  it('downloads the same table as CSV', async () => {
    const viewer = await signedIn('viewer@larkspur.example');
    const demo = await db()('nodes').where({ name: 'NF-stage-1' }).first('id');
    const res = await viewer.agent.get(`/api/v1/nodes/${demo.id}/nights?format=csv`).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toContain('attachment');
    const lines = res.text.split('\r\n').filter(Boolean);
    expect(lines[0].startsWith('dusk_utc,dawn_utc,dusk_local,dawn_local')).toBe(true);
    expect(lines).toHaveLength(15);
  });
});

describe('a cancelled export', () => {
  it('frees its database connection: twenty abandoned downloads later the API still answers', async () => {
    // 60,000 readings inserted directly (a year of them is issue 8's fixture): big enough that
    // the download cannot sit whole in socket buffers when the client walks away.
    const big = await createTestNode('export-cancel');
    const start = Math.floor(Date.now() / 1000) - 90 * 86_400;
    for (let i = 0; i < 60_000; i += 5000) {
      await db()('readings').insert(Array.from({ length: 5000 }, (_, k) => ({ node_id: big.nodeId, t: new Date((start + (i + k) * 60) * 1000), v: 4.5, vp: 0 })));
    }
    const cookie = big.session.cookies.map((c) => c.split(';')[0]).join('; ');
    const url = `${big.session.origin}/api/v1/nodes/${big.nodeId}/export?from=${start}&to=${start + 60_000 * 60}`;
    for (let i = 0; i < 20; i++) {
      const controller = new AbortController();
      const res = await fetch(url, { headers: { cookie }, signal: controller.signal });
      expect(res.status).toBe(200);
      const reader = res.body!.getReader();
      await reader.read();
      controller.abort();
      await reader.cancel().catch(() => undefined);
    }
    const after = await big.session.agent.get(`/api/v1/nodes/${big.nodeId}/series?from=${start}&to=${start + 86_400}`).timeout(10_000);
    expect(after.status).toBe(200);
    const whole = await big.session.agent.get(`/api/v1/nodes/${big.nodeId}/export?from=${start}&to=${start + 3600}`).buffer(true).timeout(10_000);
    expect(whole.text.split('\r\n').filter(Boolean)).toHaveLength(61);
  }, 90_000);
});
