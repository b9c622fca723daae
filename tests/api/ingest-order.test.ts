import { afterAll, describe, expect, it } from 'vitest';
import { closeFastPool } from '@/lib/db/fast-pool';
import { closeDb, db } from '@/lib/db/knex';
import { deleteNode } from '@/lib/db/queries/nodes';
import { storeAllNew } from '@/lib/ingest/store-fast';
import type { DerivedStatus } from '@/lib/status/derive-status';
import { createTestNode } from './helpers/fleet';

// Two posts of one node can commit out of order (two app instances, or a backlog batch beside a
// live reading, each having read the status before the other wrote it). The status row must end
// on the newest reading whatever the commit order (common practice: last-writer-wins by event
// time, not by arrival).
// The statuses written here are made up, in a node of the demo organization: it is retired
// after, so that no fleet test finds a charge that does not follow from its settings.
let made: { orgId: number; nodeId: number } | null = null;
afterAll(async () => {
  if (made) await deleteNode(made.orgId, made.nodeId);
  await closeFastPool();
  await closeDb();
});

const status = (t: Date, volts: number): DerivedStatus => ({
  state: volts > 4.5 ? 'steady' : 'thin', last_reading_at: t, volts, panel_volts: null, energy_joules: volts * 100, soc: volts / 5.4,
  burst_floor_volts: 2.1, reserve_joules: 50, margin: volts - 4, load_watts: 0.01, recharge_at: null, brownout_at: null, next_report_s: 600, evaluated_at: new Date(),
});

describe('node status after posts that commit out of order', () => {
  it('keeps the newer reading when the older post commits last', async () => {
    const node = await createTestNode('ingest-order');
    const orgId = (await db()('nodes').where({ id: node.nodeId }).first('org_id')).org_id as number;
    made = { orgId, nodeId: node.nodeId };
    const newer = new Date(Date.now() - 60_000);
    const older = new Date(Date.now() - 3_600_000);
    const reading = (t: Date, v: number) => ({ t, v, seq: null, vp: null, temp: null, rssi: null });

    expect(await storeAllNew({ nodeId: node.nodeId, orgId, readings: [reading(newer, 4.9)], status: status(newer, 4.9) })).toBe(true);
    expect(await storeAllNew({ nodeId: node.nodeId, orgId, readings: [reading(older, 4.2)], status: status(older, 4.2) })).toBe(true);
    const row = await db()('node_status').where({ node_id: node.nodeId }).first();
    expect(new Date(row.last_reading_at).getTime()).toBe(newer.getTime());
    expect(row.volts).toBeCloseTo(4.9, 5);
    expect(row.state).toBe('steady');
    // Both readings are stored all the same.
    expect(Number((await db()('readings').where({ node_id: node.nodeId }).count({ n: '*' }))[0].n)).toBe(2);

    // And a newer one still moves it on.
    const newest = new Date(Date.now() - 1000);
    await storeAllNew({ nodeId: node.nodeId, orgId, readings: [reading(newest, 4.4)], status: status(newest, 4.4) });
    const after = await db()('node_status').where({ node_id: node.nodeId }).first();
    expect(new Date(after.last_reading_at).getTime()).toBe(newest.getTime());
    expect(after.state).toBe('thin');
  });
});
