import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { runMarginPass } from '@/lib/jobs/margin-pass';
import { signedIn } from './helpers/session';
import { createTestOrg, insertReading, PASSWORD, voltsForMargin, type TestOrg } from './alerts-fixtures';

// The alerts and subscriptions API over HTTP against the running app, on throwaway orgs.
const T0 = new Date('2026-11-22T04:00:00Z');
const at = (minutes: number) => new Date(T0.getTime() + minutes * 60_000);
const APP_URL = 'http://127.0.0.1:3999';

afterEach(async () => {
  await db()('email_outbox').where('to_address', 'like', '%@watch-test.example').andWhere('status', 'pending').update({ status: 'dead', last_error: 'test cleanup' });
});
afterAll(closeDb);

async function shortOrg(): Promise<TestOrg & { alertId: number }> {
  const org = await createTestOrg(db());
  await insertReading(db(), org.nodeId, at(-1), voltsForMargin({ at: at(-1), margin: 0.5 }));
  await runMarginPass({ knex: db(), now: at(0), appUrl: APP_URL, orgIds: [org.orgId] });
  const alert = await db()('alerts').where({ node_id: org.nodeId, kind: 'reserve_short' }).first('id');
  return { ...org, alertId: alert.id };
}

describe('GET /api/v1/alerts', () => {
  it('lists the organization\u2019s alerts with their mail state, filtered by site, kind and status', async () => {
    const org = await shortOrg();
    const viewer = await signedIn(org.people.viewer.email, PASSWORD);
    const all = await viewer.agent.get('/api/v1/alerts');
    expect(all.status).toBe(200);
    expect(all.body.alerts).toHaveLength(1);
    expect(all.body.alerts[0]).toMatchObject({ id: org.alertId, kind: 'reserve_short', status: 'open', node_id: org.nodeId, site_id: org.siteId, mail: { pending: 1, sent: 0, dead: 0 } });
    expect(all.body.alerts[0].detail.brownout_at).toEqual(expect.any(String));
    const filtered = async (query: string) => (await viewer.agent.get(`/api/v1/alerts?${query}`)).body.alerts.length;
    expect(await filtered(`site=${org.siteId}&kind=reserve_short&status=open`)).toBe(1);
    expect(await filtered('kind=node_dark')).toBe(0);
    expect(await filtered('status=resolved')).toBe(0);
    expect(await filtered(`site=${org.siteId + 100000}`)).toBe(0);
    const bad = await viewer.agent.get('/api/v1/alerts?status=bogus');
    expect(bad.status).toBe(422);
    expect(bad.body.errors[0].pointer).toBe('/query/status');
  });
});

describe('POST /api/v1/alerts/{id}/acknowledge', () => {
  it('is for deployers and owners; another organization\u2019s alert is not found', async () => {
    const org = await shortOrg();
    const stranger = await shortOrg();
    const viewer = await signedIn(org.people.viewer.email, PASSWORD);
    const deployer = await signedIn(org.people.deployer.email, PASSWORD);
    const ack = (s: typeof viewer, id: number) => s.agent.post(`/api/v1/alerts/${id}/acknowledge`).set('origin', s.origin);
    expect((await ack(viewer, org.alertId)).status).toBe(403);
    expect((await ack(deployer, stranger.alertId)).status).toBe(404);
    expect((await ack(deployer, 99_999_999)).status).toBe(404);
    const res = await ack(deployer, org.alertId);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: org.alertId, status: 'acknowledged' });
    expect((await ack(deployer, org.alertId)).status).toBe(200); // idempotent
    const noOrigin = await deployer.agent.post(`/api/v1/alerts/${org.alertId}/acknowledge`);
    expect(noOrigin.status).toBe(403);
    const audit = await db()('audit_log').where({ org_id: org.orgId, action: 'alert_acknowledged' });
    expect(audit).toHaveLength(1);
    expect((await db()('alerts').where({ id: stranger.alertId }).first()).status).toBe('open');
  });
});

describe('GET /api/v1/alerts/outbox', () => {
  it('shows owners the organization\u2019s e-mails without their bodies', async () => {
    const org = await shortOrg();
    const owner = await signedIn(org.people.owner.email, PASSWORD);
    const res = await owner.agent.get('/api/v1/alerts/outbox');
    expect(res.status).toBe(200);
    expect(res.body.messages).toHaveLength(1);
    expect(res.body.messages[0]).toMatchObject({ purpose: 'alert', to_address: org.people.owner.email, status: 'pending', held: false });
    expect(res.body.messages[0]).not.toHaveProperty('text_body');
    const deployer = await signedIn(org.people.deployer.email, PASSWORD);
    expect((await deployer.agent.get('/api/v1/alerts/outbox')).status).toBe(403);
  });
});

describe('/api/v1/subscriptions', () => {
  it('each member reads and sets their own; the choice decides who is mailed', async () => {
    const org = await createTestOrg(db());
    const deployer = await signedIn(org.people.deployer.email, PASSWORD);
    const owner = await signedIn(org.people.owner.email, PASSWORD);
    expect((await owner.agent.get('/api/v1/subscriptions')).body).toEqual({ subscriptions: [], defaults: [{ site_id: null, kinds: ['reserve_short', 'node_dark', 'dark_through_day', 'node_silent', 'over_voltage'], delivery: 'immediate' }] });
    expect((await deployer.agent.get('/api/v1/subscriptions')).body).toEqual({ subscriptions: [], defaults: [] });

    const put = (s: typeof owner, body: object) => s.agent.put('/api/v1/subscriptions').set('origin', s.origin).send(body);
    const mine = { subscriptions: [{ site_id: org.siteId, kinds: ['reserve_short', 'node_dark'], delivery: 'immediate' }] };
    const saved = await put(deployer, mine);
    expect(saved.status).toBe(200);
    expect(saved.body.subscriptions).toEqual(mine.subscriptions);
    // The owner opts out of everything.
    expect((await put(owner, { subscriptions: [{ site_id: null, kinds: [], delivery: 'immediate' }] })).status).toBe(200);

    const other = await createTestOrg(db());
    const foreign = await put(deployer, { subscriptions: [{ site_id: other.siteId, kinds: ['node_dark'], delivery: 'digest' }] });
    expect(foreign.status).toBe(422);
    expect(foreign.body.errors).toEqual([{ pointer: '/subscriptions/0/site_id', detail: 'Choose one of your sites.' }]);
    const twice = await put(deployer, { subscriptions: [{ site_id: null, kinds: [], delivery: 'digest' }, { site_id: null, kinds: [], delivery: 'digest' }] });
    expect(twice.status).toBe(422);
    expect((await put(deployer, { subscriptions: [{ site_id: null, kinds: ['no_such_kind'], delivery: 'digest' }] })).status).toBe(422);
    expect((await deployer.agent.get('/api/v1/subscriptions')).body.subscriptions).toEqual(mine.subscriptions); // the refused writes changed nothing

    await insertReading(db(), org.nodeId, at(-1), voltsForMargin({ at: at(-1), margin: 0.5 }));
    await runMarginPass({ knex: db(), now: at(0), appUrl: APP_URL, orgIds: [org.orgId] });
    const to = await db()('email_outbox').where({ org_id: org.orgId }).pluck('to_address');
    expect(to).toEqual([org.people.deployer.email]);
  });
});
