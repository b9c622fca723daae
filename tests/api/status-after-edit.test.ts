import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { loadNodeForModel, refreshNodeStatus, refreshStatusOfNodes } from '@/lib/db/queries/status';
import { modelBank, nightWindows } from '@/lib/energy';
import { modelSpecFromRows } from '@/lib/status/node-spec';
import { insertReading } from './alerts-fixtures';
import { api } from './helpers/stack';
import { createTestNode } from './helpers/fleet';

afterAll(closeDb);

/**
 * A node's status is worked out again as soon as its settings or its site change, not at its
 * next report: the fleet must never show a charge or a recharge time for settings it no
 * longer has.
 */
type Node = Awaited<ReturnType<typeof createTestNode>>;
type FleetNode = { id: number; volts: number; soc: number; recharge_at: string | null; reserve_joules: number | null };
let node: Node;
let siteBody: Record<string, unknown>;
let siteId: number;

const fleetRow = async (): Promise<FleetNode> =>
  (await node.session.agent.get('/api/v1/fleet')).body.nodes.find((n: FleetNode) => n.id === node.nodeId);

// DESIGN.md §3: charge by energy above the cutoff (derived here from the figures on the wire).
const socOf = (volts: number, maxVolts: number, cut: number) => Math.min(1, Math.max(0, (volts ** 2 - cut ** 2) / (maxVolts ** 2 - cut ** 2)));

beforeAll(async () => {
  node = await createTestNode('status-after-edit');
  const s = node.session;
  // A site of its own, so moving it touches no other test's nodes.
  siteBody = { name: `edit-site-${process.pid}-${Date.now()}`, lat: 45.5, lon: -116.2, time_zone: 'America/Boise', recharge_elevation_deg: 3, notes: '' };
  const site = await s.agent.post('/api/v1/sites').set('origin', s.origin).send(siteBody);
  expect(site.status).toBe(201);
  siteId = site.body.id;
  const moved = await s.agent.put(`/api/v1/nodes/${node.nodeId}`).set('origin', s.origin).send({ ...node.body, site_id: siteId });
  expect(moved.status).toBe(200);
  const post = await api().post('/api/v1/readings').set('authorization', `Bearer ${node.token}`).set('content-type', 'application/json')
    .send(JSON.stringify({ t: new Date(Date.now() - 60_000).toISOString(), v: 4.2 }));
  expect(post.status).toBe(200);
});

describe('status after an edit', () => {
  it('follows a new cutoff and a larger bank at once', async () => {
    const before = await fleetRow();
    const bank = node.body.bank as { cells_series: number; cell_rated_volts: number; cells_parallel: number };
    const converter = node.body.converter as { cutoff_volts: number; start_volts: number };
    const maxVolts = bank.cells_series * bank.cell_rated_volts;
    expect(before.soc).toBeCloseTo(socOf(before.volts, maxVolts, converter.cutoff_volts), 6);

    const cut = Number(((converter.cutoff_volts + Math.min(converter.start_volts, before.volts)) / 2).toFixed(2));
    const body = { ...node.body, site_id: siteId, converter: { ...converter, cutoff_volts: cut }, bank: { ...bank, cells_parallel: bank.cells_parallel * 2 } };
    const put = await node.session.agent.put(`/api/v1/nodes/${node.nodeId}`).set('origin', node.session.origin).send(body);
    expect(put.status, JSON.stringify(put.body)).toBe(200);

    const after = await fleetRow();
    expect(after.soc).toBeCloseTo(socOf(after.volts, maxVolts, cut), 6);
    expect(after.soc).toBeLessThan(before.soc); // a higher cutoff leaves less of the energy usable
    // Twice the cells in parallel hold twice the energy (E = ½CV², C ∝ cells in parallel; derived here).
    if (before.reserve_joules != null && after.reserve_joules != null && before.reserve_joules > 0) {
      expect(after.reserve_joules).toBeGreaterThan(before.reserve_joules * 1.2);
    }
  });

  it('follows the site: a place a quarter of the world further east gets its sunrise 6 h sooner', async () => {
    const before = await fleetRow();
    expect(before.recharge_at).not.toBeNull();
    const put = await node.session.agent.put(`/api/v1/sites/${siteId}`).set('origin', node.session.origin)
      .send({ ...siteBody, lon: -116.2 + 90, time_zone: 'Atlantic/Azores' });
    expect(put.status).toBe(200);
    const after = await fleetRow();
    expect(after.recharge_at).not.toBeNull();
    // 90° of longitude is 6 h of solar time (360° a day; common practice); the next sunrise
    // comes about that much sooner, or a day less that later when the sooner one has passed.
    const shiftHours = (Date.parse(after.recharge_at!) - Date.parse(before.recharge_at!)) / 3_600_000;
    expect(Math.min(Math.abs(shiftHours + 6), Math.abs(shiftHours - 18))).toBeLessThan(1.5);
  });
});

describe('the draw ratio after an edit', () => {
  it('is measured again against the new settings at once: more leakage, more modelled draw, by ΔI·V', async () => {
    const n = await createTestNode('draw-after-edit');
    const loaded = (await loadNodeForModel(n.nodeId))!;
    const spec = modelSpecFromRows(loaded.node, loaded.site);
    const maxVolts = modelBank({ bank: spec.bank }).maxVolts;
    const now = new Date();
    const night = nightWindows({ site: spec.site, from: new Date(now.getTime() - 48 * 3_600_000), to: now })
      .filter((w) => w.end < now && w.end.getTime() - w.start.getTime() > 4 * 3_600_000).pop()!;
    expect(night).toBeDefined();
    // A steady fall from 90 % to 75 % of the bank's maximum, a reading every 10 min through that night.
    const volts: number[] = [];
    const span = night.end.getTime() - night.start.getTime();
    for (let t = night.start.getTime() + 300_000; t < night.end.getTime() - 300_000; t += 600_000) {
      const v = maxVolts * (0.9 - (0.15 * (t - night.start.getTime())) / span);
      volts.push(v);
      await insertReading(db(), n.nodeId, new Date(t), Number(v.toFixed(4)));
    }
    await refreshStatusOfNodes([n.nodeId], now);
    const before = await db()('node_status').where({ node_id: n.nodeId }).first('measured_watts', 'modelled_watts');
    expect(before.measured_watts).toBeGreaterThan(0);
    expect(before.modelled_watts).toBeGreaterThan(0);

    const bank = n.body.bank as { cell_leakage_amps: number; cells_parallel: number };
    const put = await n.session.agent.put(`/api/v1/nodes/${n.nodeId}`).set('origin', n.session.origin)
      .send({ ...n.body, bank: { ...bank, cell_leakage_amps: bank.cell_leakage_amps + 0.001 } });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    const after = await db()('node_status').where({ node_id: n.nodeId }).first('measured_watts', 'modelled_watts');
    // The measured draw is the same night's energy slope: leakage settings do not change it.
    expect(after.measured_watts).toBeCloseTo(before.measured_watts, 9);
    // Leakage is drawn at the bank's voltage: P = V·I (textbook), averaged over the same readings,
    // with 1 mA more a cell and the cells in parallel adding their leakage (common practice).
    const meanVolts = volts.reduce((a, v) => a + v, 0) / volts.length;
    expect(after.modelled_watts - before.modelled_watts).toBeCloseTo(0.001 * bank.cells_parallel * meanVolts, 4);
    const fleet = (await n.session.agent.get('/api/v1/fleet')).body.nodes.find((r: { id: number }) => r.id === n.nodeId);
    expect(fleet.draw_ratio).toBeCloseTo(after.measured_watts / after.modelled_watts, 6);
  });
});

describe('a refresh racing a post', () => {
  it('never overwrites a status that a newer reading wrote meanwhile', async () => {
    // As if a post of a newer reading had committed between the refresh's read and its write:
    // the row reflects a reading a minute in the future of the one the refresh works from.
    const newer = new Date(Date.now() + 60_000);
    await db()('node_status').where({ node_id: node.nodeId }).update({ last_reading_at: newer, volts: 3.333 });
    await refreshNodeStatus(node.nodeId);
    const row = await db()('node_status').where({ node_id: node.nodeId }).first();
    expect(row.volts).toBe(3.333);
    expect(new Date(row.last_reading_at).getTime()).toBe(newer.getTime());
    // With the row back on the latest stored reading, the refresh writes again.
    await db()('node_status').where({ node_id: node.nodeId }).update({ last_reading_at: null });
    await refreshNodeStatus(node.nodeId);
    expect((await db()('node_status').where({ node_id: node.nodeId }).first()).volts).toBeCloseTo(4.2, 6);
  });
});
