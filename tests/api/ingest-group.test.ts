import { afterAll, describe, expect, it } from 'vitest';
import { closeFastPool } from '@/lib/db/fast-pool';
import { closeDb, db } from '@/lib/db/knex';
import { deleteNode } from '@/lib/db/queries/nodes';
import { rebuildRollups } from '@/lib/db/queries/rollups';
import { storeAllNew, storeAllNewGrouped } from '@/lib/ingest/store-fast';
import type { DerivedStatus } from '@/lib/status/derive-status';
import { createTestNode } from './helpers/fleet';
import { api } from './helpers/stack';

// Posts that arrive together are committed in one transaction (lib/ingest/coalesce.ts). What
// must hold is what holds for one post alone: an answer means committed, one post's duplicate
// costs no other post anything, the rollups equal a rebuild from the readings, and the status
// ends on each node's newest reading (common practice: all-or-nothing per request, event time
// wins).
// The statuses written here are made up (soc = volts / 5.4, not the model's), and the nodes
// stand in the demo organization: retire them after, or a fleet test reading that
// organization later finds a charge that does not follow from its node's settings.
const made: { nodeId: number }[] = [];
afterAll(async () => {
  for (const { nodeId } of made) await deleteNode(await orgOf(nodeId), nodeId);
  await closeFastPool();
  await closeDb();
});

const reading = (t: Date, v: number) => ({ t, v, seq: null, vp: null, temp: null, rssi: null });
const status = (t: Date, volts: number): DerivedStatus => ({
  state: volts > 4.5 ? 'steady' : 'thin', last_reading_at: t, volts, panel_volts: null, energy_joules: volts * 100, soc: volts / 5.4,
  burst_floor_volts: 2.1, reserve_joules: 50, margin: volts - 4, load_watts: 0.01, recharge_at: null, brownout_at: null, next_report_s: 600, evaluated_at: new Date(),
});
const times = async (nodeId: number) => (await db()('readings').where({ node_id: nodeId }).orderBy('t').select('t')).map((r) => new Date(r.t).getTime());
// Sums to 5 decimals: a rebuild adds the stored FLOAT volts, the deltas the posted doubles.
const rollups = async (nodeId: number) => (await db()('reading_rollups').where({ node_id: nodeId }).orderBy(['bucket_seconds', 'bucket_start'])
  .select('bucket_seconds', 'bucket_start', 'n', 'v_min', 'v_max', 'v_sum', 'v_last', 't_last')).map((r) => ({ ...r, v_sum: Number(r.v_sum).toFixed(5), v_last: Number(r.v_last).toFixed(5) }));
const orgOf = async (nodeId: number) => (await db()('nodes').where({ id: nodeId }).first('org_id')).org_id as number;

describe('posts committed together', () => {
  it('stores every post of a group, and a duplicate in one post refuses only that post', async () => {
    const [a, b, c] = await Promise.all(['group-a', 'group-b', 'group-c'].map((p) => createTestNode(p)));
    made.push(a, b, c);
    const [orgA, orgB, orgC] = await Promise.all([a, b, c].map((n) => orgOf(n.nodeId)));
    const at = (minutesAgo: number) => new Date(Math.floor(Date.now() / 60_000) * 60_000 - minutesAgo * 60_000);
    expect(await storeAllNew({ nodeId: b.nodeId, orgId: orgB, readings: [reading(at(30), 4.4)], status: status(at(30), 4.4) })).toBe(true);

    // Submitted in one turn, so they travel together; node A's newer post comes first.
    const answers = await Promise.all([
      storeAllNewGrouped({ nodeId: a.nodeId, orgId: orgA, readings: [reading(at(5), 4.9)], status: status(at(5), 4.9) }),
      storeAllNewGrouped({ nodeId: b.nodeId, orgId: orgB, readings: [reading(at(30), 4.4), reading(at(20), 4.5)], status: status(at(20), 4.5) }),
      storeAllNewGrouped({ nodeId: c.nodeId, orgId: orgC, readings: [reading(at(7), 4.6), reading(at(6), 4.7)], status: status(at(6), 4.7) }),
      storeAllNewGrouped({ nodeId: a.nodeId, orgId: orgA, readings: [reading(at(65), 4.2)], status: status(at(65), 4.2) }),
    ]);
    expect(answers).toEqual([true, false, true, true]);

    expect(await times(a.nodeId)).toEqual([at(65), at(5)].map((d) => d.getTime()));
    expect(await times(b.nodeId)).toEqual([at(30).getTime()]); // the refused post left nothing
    expect(await times(c.nodeId)).toEqual([at(7), at(6)].map((d) => d.getTime()));

    const statusA = await db()('node_status').where({ node_id: a.nodeId }).first();
    expect(new Date(statusA.last_reading_at).getTime()).toBe(at(5).getTime());
    expect(statusA.volts).toBeCloseTo(4.9, 5);
    const statusB = await db()('node_status').where({ node_id: b.nodeId }).first();
    expect(new Date(statusB.last_reading_at).getTime()).toBe(at(30).getTime());

    // The deltas folded in together equal the buckets rebuilt from the stored readings.
    for (const node of [a, b, c]) {
      const folded = await rollups(node.nodeId);
      await rebuildRollups(db(), node.nodeId);
      expect(folded.length).toBeGreaterThan(0);
      expect(await rollups(node.nodeId)).toEqual(folded);
    }
  });

  it('answers forty posts sent at once over HTTP, each stored once, and the same posts again as duplicates', async () => {
    const nodes = await Promise.all(Array.from({ length: 8 }, (_, i) => createTestNode(`group-http-${i}`)));
    const base = Math.floor(Date.now() / 60_000) * 60_000 - 3_600_000;
    const posts = Array.from({ length: 40 }, (_, i) => ({ node: nodes[i % 8], t: new Date(base + Math.floor(i / 8) * 60_000).toISOString(), v: 4.5 + i / 100 }));
    const send = () => Promise.all(posts.map((p) => api().post('/api/v1/readings').set('content-type', 'application/json')
      .set('authorization', `Bearer ${p.node.token}`).send(JSON.stringify({ t: p.t, v: p.v }))));

    const first = await send();
    expect(first.map((r) => r.status)).toEqual(posts.map(() => 200));
    expect(first.map((r) => r.body.accepted)).toEqual(posts.map(() => 1));
    const again = await send();
    expect(again.map((r) => [r.status, r.body.accepted, r.body.duplicates])).toEqual(posts.map(() => [200, 0, 1]));

    for (const [i, node] of nodes.entries()) {
      const mine = posts.filter((_, k) => k % 8 === i);
      expect(await times(node.nodeId)).toEqual(mine.map((p) => new Date(p.t).getTime()));
      const row = await db()('node_status').where({ node_id: node.nodeId }).first();
      expect(new Date(row.last_reading_at).toISOString()).toBe(mine[mine.length - 1].t);
    }
  });
});
