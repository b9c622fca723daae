import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { runMarginPass } from '@/lib/jobs/margin-pass';
import { signedIn } from './helpers/session';
import { createTestOrg, insertReading, PASSWORD, voltsForMargin, type TestOrg } from './alerts-fixtures';

// The node and node-state filters of GET /api/v1/alerts (issue 7: the node page lists its own
// alerts; the alerts page filters by state) and the held-mail summary of each alert. The
// expected answers follow from the brief, derived here: a node id is scoped to the caller's
// organization, so another organization's node yields an empty list, not an error.
const T0 = new Date('2026-11-23T04:00:00Z');
const at = (minutes: number) => new Date(T0.getTime() + minutes * 60_000);
const APP_URL = 'http://127.0.0.1:3999';

afterEach(async () => {
  await db()('email_outbox').where('to_address', 'like', '%@watch-test.example').andWhere('status', 'pending').update({ status: 'dead', last_error: 'test cleanup' });
});
afterAll(closeDb);

/** A second node in the same organization and site: a copy of the first under another name. */
async function addSecondNode(org: TestOrg): Promise<number> {
  const { id: _id, ...row } = await db()('nodes').where({ id: org.nodeId }).first();
  const [nodeId] = await db()('nodes').insert({ ...row, name: `${row.name}-b` });
  await db()('node_status').insert({ node_id: nodeId, org_id: org.orgId, state: 'new' });
  return nodeId;
}

/** Drive nodes short (margin 0.5 by the model) and run one pass over their organizations. */
async function driveShort(nodes: { orgId: number; nodeId: number }[]) {
  for (const n of nodes) await insertReading(db(), n.nodeId, at(-1), voltsForMargin({ at: at(-1), margin: 0.5 }));
  await runMarginPass({ knex: db(), now: at(0), appUrl: APP_URL, orgIds: [...new Set(nodes.map((n) => n.orgId))] });
}

describe('GET /api/v1/alerts?node=', () => {
  it('lists only that node\u2019s alerts; another organization\u2019s node gives an empty list, not an error', async () => {
    const mine = await createTestOrg(db());
    const secondNodeId = await addSecondNode(mine);
    const theirs = await createTestOrg(db());
    await driveShort([{ orgId: mine.orgId, nodeId: mine.nodeId }, { orgId: mine.orgId, nodeId: secondNodeId }, theirs]);
    const viewer = await signedIn(mine.people.viewer.email, PASSWORD);
    const list = async (query: string) => {
      const res = await viewer.agent.get(`/api/v1/alerts${query}`);
      expect(res.status).toBe(200);
      return res.body.alerts as { node_id: number; kind: string; node_state: string }[];
    };

    // Both of my nodes are short, so without the filter both alerts are listed.
    expect((await list('')).map((a) => a.node_id).sort()).toEqual([mine.nodeId, secondNodeId].sort());
    const first = await list(`?node=${mine.nodeId}`);
    expect(first).toHaveLength(1);
    expect(first[0]).toMatchObject({ node_id: mine.nodeId, kind: 'reserve_short' });
    expect((await list(`?node=${secondNodeId}`)).map((a) => a.node_id)).toEqual([secondNodeId]);
    // Another organization's node that certainly has an open alert: empty, 200.
    expect(await db()('alerts').where({ node_id: theirs.nodeId, status: 'open' }).pluck('id')).toHaveLength(1);
    expect(await list(`?node=${theirs.nodeId}`)).toEqual([]);
    expect(await list('?node=99999999')).toEqual([]);
    // Combined with the other filters.
    expect(await list(`?node=${mine.nodeId}&kind=node_dark`)).toEqual([]);
    expect(await list(`?node=${mine.nodeId}&status=open&site=${mine.siteId}`)).toHaveLength(1);

    const bad = await viewer.agent.get('/api/v1/alerts?node=abc');
    expect(bad.status).toBe(422);
    expect(bad.body.errors[0].pointer).toBe('/query/node');
  });
});

describe('GET /api/v1/alerts?node_state=', () => {
  it('filters by the node\u2019s state now and reports it on each alert', async () => {
    const org = await createTestOrg(db());
    await driveShort([org]);
    const viewer = await signedIn(org.people.viewer.email, PASSWORD);
    const get = async (query: string) => (await viewer.agent.get(`/api/v1/alerts${query}`)).body.alerts as { node_state: string }[];
    // The margin pass wrote the node's state: short, as its margin of 0.5 is below 1 (DESIGN.md §4).
    const short = await get('?node_state=short');
    expect(short).toHaveLength(1);
    expect(short[0].node_state).toBe('short');
    expect(await get('?node_state=steady')).toEqual([]);
    const bad = await viewer.agent.get('/api/v1/alerts?node_state=glowing');
    expect(bad.status).toBe(422);
    expect(bad.body.errors[0].pointer).toBe('/query/node_state');
  });
});

describe('the e-mail summary of an alert', () => {
  it('counts held mail apart, with the time it goes out', async () => {
    const org = await createTestOrg(db());
    await driveShort([org]);
    const alert = await db()('alerts').where({ node_id: org.nodeId }).first('id');
    const until = new Date('2026-11-23T05:00:00.000Z');
    // The note the sender writes when the hourly cap holds a message (lib/mail/sender.ts).
    await db()('email_outbox').where({ alert_id: alert.id }).update({ last_error: `held: the organization's cap of 1 e-mails an hour is reached; goes out from ${until.toISOString()}`, next_attempt_at: until });
    const viewer = await signedIn(org.people.viewer.email, PASSWORD);
    const [row] = (await viewer.agent.get(`/api/v1/alerts?node=${org.nodeId}`)).body.alerts;
    expect(row.mail).toMatchObject({ pending: 1, held: 1, sent: 0, dead: 0 });
    expect(new Date(row.mail.held_until).toISOString()).toBe(until.toISOString());
    // Sent, it is no longer held.
    await db()('email_outbox').where({ alert_id: alert.id }).update({ status: 'sent', last_error: null, sent_at: until });
    const [after] = (await viewer.agent.get(`/api/v1/alerts?node=${org.nodeId}`)).body.alerts;
    expect(after.mail).toMatchObject({ pending: 0, held: 0, sent: 1, held_until: null });
  });
});
