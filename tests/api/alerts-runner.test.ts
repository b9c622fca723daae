import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { listPassNodes } from '@/lib/db/queries/alerts';
import { applyNodePass } from '@/lib/alerts/apply-alerts';
import { closeDb, db } from '@/lib/db/knex';
import { runMailPass } from '@/lib/jobs/mail-pass';
import { runMarginPass } from '@/lib/jobs/margin-pass';
import { listOrgContacts, listOrgSubscriptions } from '@/lib/db/queries/subscriptions';
import { localTime } from '@/lib/mail/templates/parts';
import { evaluateNode } from '@/lib/energy';
import { deleteNode } from '@/lib/db/queries/nodes';
import { createTestOrg, insertReading, messagesTo, secondKnex, SMTP_FROM, spec, startCatcher, TIME_ZONE, voltsForMargin } from './alerts-fixtures';

// The real runner functions against the test MariaDB and a private SMTP catcher. Time is
// passed in: 20:00 PST on 19 Nov 2026 at a valley near 47° N, a long night ahead.
const T0 = new Date('2026-11-20T04:00:00Z');
const at = (minutes: number) => new Date(T0.getTime() + minutes * 60_000);
const APP_URL = 'http://127.0.0.1:3999';
let mail: Awaited<ReturnType<typeof startCatcher>>;
const smtp = () => ({ host: '127.0.0.1', port: mail.port, from: SMTP_FROM });

beforeAll(async () => {
  mail = await startCatcher('runner');
});
afterEach(async () => {
  // Leave none of our mail due for later tests' passes.
  await db()('email_outbox').where('purpose', 'alert').andWhere('to_address', 'like', '%@watch-test.example').andWhere('status', 'pending')
    .update({ status: 'dead', last_error: 'test cleanup' });
});
afterAll(async () => {
  await mail.catcher.close();
  await closeDb();
});

async function readingAndPass(org: { orgId: number; nodeId: number }, minutes: number, margin: number) {
  await insertReading(db(), org.nodeId, at(minutes - 1), voltsForMargin({ at: at(minutes - 1), margin }));
  const report = await runMarginPass({ knex: db(), now: at(minutes), appUrl: APP_URL, orgIds: [org.orgId] });
  expect(report.ran).toBe(true);
  expect(report.failures).toEqual([]);
  return report.nodes[0];
}

const alertsOf = (nodeId: number) => db()('alerts').where({ node_id: nodeId }).orderBy('id');
const outboxOf = (orgId: number) => db()('email_outbox').where({ org_id: orgId }).orderBy('id');

describe('a node driven short by its readings', () => {
  it('opens exactly one alert and one e-mail naming the brownout time; two clear passes resolve it', async () => {
    const org = await createTestOrg(db());
    const first = await readingAndPass(org, 0, 0.6);
    expect(first.state).toBe('short');
    expect(first.opened).toEqual(['reserve_short']);
    const status = await db()('node_status').where({ node_id: org.nodeId }).first();
    expect(status.state).toBe('short');
    expect(status.margin).toBeCloseTo(0.6, 2);
    const brownout = localTime(new Date(status.brownout_at), TIME_ZONE)!;

    expect((await readingAndPass(org, 1, 0.6)).opened).toEqual([]);
    expect(await alertsOf(org.nodeId)).toHaveLength(1);
    const outbox = await outboxOf(org.orgId);
    expect(outbox).toHaveLength(1); // the owner, by default; nobody else subscribed
    expect(outbox[0].to_address).toBe(org.people.owner.email);

    const sent = await runMailPass({ knex: db(), now: at(2), smtp: smtp() });
    expect(sent.sent).toBeGreaterThanOrEqual(1);
    const messages = messagesTo(mail.dir, org.people.owner.email);
    expect(messages).toHaveLength(1);
    expect(messages[0].body).toMatch(new RegExp(`Projected brownout:\\s+${brownout}`));
    expect(messages[0].headers).toMatch(new RegExp(`^Subject: .*${brownout}`, 'm'));
    expect(messages[0].headers).toContain(`Message-ID: ${outbox[0].message_id}`);
    expect(messages[0].body).toContain(`${APP_URL}/nodes/${org.nodeId}`);
    expect((await outboxOf(org.orgId))[0].status).toBe('sent');

    // Recovery: the first clear pass only counts, the second resolves; no mail either time.
    expect((await readingAndPass(org, 3, 1.6)).resolved).toEqual([]);
    expect((await alertsOf(org.nodeId))[0]).toMatchObject({ status: 'open', clear_passes: 1 });
    expect((await readingAndPass(org, 4, 1.6)).resolved).toEqual(['reserve_short']);
    expect((await alertsOf(org.nodeId))[0].status).toBe('resolved');
    expect(await outboxOf(org.orgId)).toHaveLength(1);

    // Short again later: a new alert (the resolved one no longer holds the open key).
    expect((await readingAndPass(org, 5, 0.5)).opened).toEqual(['reserve_short']);
    expect(await alertsOf(org.nodeId)).toHaveLength(2);
  });

  it('a margin hovering around 1 does not flap: one alert, one e-mail, never resolved', async () => {
    const org = await createTestOrg(db());
    const margins = [0.97, 1.03, 0.98, 1.06, 0.99, 1.08, 0.96, 1.02, 1.04, 0.99];
    for (const [i, margin] of margins.entries()) await readingAndPass(org, i, margin);
    const alerts = await alertsOf(org.nodeId);
    expect(alerts).toHaveLength(1);
    expect(alerts[0].status).toBe('open');
    expect(await outboxOf(org.orgId)).toHaveLength(1);
  });

  it('re-sends an unacknowledged short alert after resend_short_hours; acknowledging stops it', async () => {
    const org = await createTestOrg(db(), { org: { resend_short_hours: 1 } });
    await readingAndPass(org, 0, 0.5);
    await readingAndPass(org, 30, 0.5);
    expect(await outboxOf(org.orgId)).toHaveLength(1);
    const reminder = await readingAndPass(org, 61, 0.5);
    expect(reminder.reminded).toEqual(['reserve_short']);
    const rows = await outboxOf(org.orgId);
    expect(rows).toHaveLength(2);
    expect(rows[1].subject).toMatch(/^Reminder: /);
    await db()('alerts').where({ node_id: org.nodeId }).update({ status: 'acknowledged', acknowledged_at: at(62) });
    await readingAndPass(org, 130, 0.5);
    expect(await outboxOf(org.orgId)).toHaveLength(2);
  });
});

describe('a node reading above its rated maximum', () => {
  it('opens an over-voltage alert the owner hears of by default, naming the real figure; the reserve counts no charge above the rating', async () => {
    const org = await createTestOrg(db());
    await insertReading(db(), org.nodeId, at(-1), 9.5); // on a 2 × 2.7 V = 5.4 V bank
    const report = await runMarginPass({ knex: db(), now: at(0), appUrl: APP_URL, orgIds: [org.orgId] });
    expect(report.nodes[0].opened).toEqual(['over_voltage']);
    const status = await db()('node_status').where({ node_id: org.nodeId }).first();
    // Derived here: the reserve and margin of the same node at exactly its rating, 5.4 V.
    const rated = evaluateNode({ ...spec, volts: 5.4, at: at(-1) });
    expect(status.reserve_joules).toBeCloseTo(rated.reserveJoules, 6);
    expect(status.margin).toBeCloseTo(rated.margin, 6);
    expect(status.soc).toBe(1);
    const outbox = await outboxOf(org.orgId);
    expect(outbox.map((m) => m.to_address)).toEqual([org.people.owner.email]);
    expect(outbox[0].subject).toContain('over-voltage (9.50 V, 176 % of its rated 5.40 V)');
  });
});

describe('a node gone dark that a day of sun does not bring back', () => {
  it('has the dark alert in the night, and the escalation once the next day has set without a report, both e-mailed to the owner', async () => {
    const org = await createTestOrg(db());
    // Its last report, at 20:00 PST, already short: it browns out in the night.
    await insertReading(db(), org.nodeId, at(-1), voltsForMargin({ at: at(-1), margin: 0.3 }));
    const night = await runMarginPass({ knex: db(), now: at(10 * 60), appUrl: APP_URL, orgIds: [org.orgId] });
    expect(night.nodes[0].state).toBe('dark');
    expect(night.nodes[0].opened).toEqual(['node_dark']);
    // 20:00 PST the next evening: sunrise and sunset of 20 Nov have passed with no report.
    const evening = await runMarginPass({ knex: db(), now: at(24 * 60), appUrl: APP_URL, orgIds: [org.orgId] });
    expect(evening.nodes[0].opened).toEqual(['dark_through_day']);
    const alert = (await alertsOf(org.nodeId)).find((a) => a.kind === 'dark_through_day');
    const detail = typeof alert.detail === 'string' ? JSON.parse(alert.detail) : alert.detail;
    // the missed day runs from the morning of 20 Nov to its evening, site time
    expect(new Date(detail.missed_day_start_at).getTime()).toBeGreaterThan(at(10 * 60).getTime());
    expect(new Date(detail.missed_day_end_at).getTime()).toBeLessThan(at(24 * 60).getTime());
    const outbox = await outboxOf(org.orgId);
    expect(outbox.map((m) => m.to_address)).toEqual([org.people.owner.email, org.people.owner.email]);
    expect(outbox[1].subject).toContain('still dark after a whole day of sun');
    // a report again clears both (two passes of hysteresis)
    await insertReading(db(), org.nodeId, at(24 * 60 + 1), 4.5);
    for (const m of [24 * 60 + 2, 24 * 60 + 3]) await runMarginPass({ knex: db(), now: at(m), appUrl: APP_URL, orgIds: [org.orgId] });
    const after = await alertsOf(org.nodeId);
    expect(after.filter((a) => a.kind === 'node_dark' || a.kind === 'dark_through_day').map((a) => a.status)).toEqual(['resolved', 'resolved']);
  });
});

describe('a node retired with an open alert', () => {
  it('resolves its alerts and drops its waiting mail; later passes leave it alone', async () => {
    const org = await createTestOrg(db());
    expect((await readingAndPass(org, 0, 0.5)).opened).toEqual(['reserve_short']);
    expect((await outboxOf(org.orgId)).map((m) => m.status)).toEqual(['pending']);
    await deleteNode(org.orgId, org.nodeId);
    expect((await alertsOf(org.nodeId)).map((a) => a.status)).toEqual(['resolved']);
    expect(await outboxOf(org.orgId)).toMatchObject([{ status: 'dead', last_error: 'node retired' }]);
    const report = await runMarginPass({ knex: db(), now: at(1), appUrl: APP_URL, orgIds: [org.orgId] });
    expect(report.nodes).toEqual([]);
  });
});

describe('two runners at once', () => {
  it('a pass finds the named lock taken and skips', async () => {
    const org = await createTestOrg(db());
    await insertReading(db(), org.nodeId, at(-1), voltsForMargin({ at: at(-1), margin: 0.5 }));
    const other = secondKnex();
    const held = await other.client.acquireConnection();
    try {
      const [rows] = await other.raw("SELECT GET_LOCK('duskwatch:margin-pass', 0) AS got").connection(held);
      expect(Number(rows[0].got)).toBe(1);
      const skipped = await runMarginPass({ knex: db(), now: at(0), appUrl: APP_URL, orgIds: [org.orgId] });
      expect(skipped).toMatchObject({ ran: false, nodes: [] });
      expect(await alertsOf(org.nodeId)).toHaveLength(0);
      await other.raw("SELECT RELEASE_LOCK('duskwatch:margin-pass')").connection(held);
      expect((await runMarginPass({ knex: db(), now: at(0), appUrl: APP_URL, orgIds: [org.orgId] })).ran).toBe(true);
      expect(await alertsOf(org.nodeId)).toHaveLength(1);
    } finally {
      await other.client.releaseConnection(held);
      await other.destroy();
    }
  });

  it('run one pass between them and send one e-mail', async () => {
    const org = await createTestOrg(db());
    await insertReading(db(), org.nodeId, at(-1), voltsForMargin({ at: at(-1), margin: 0.5 }));
    const other = secondKnex();
    try {
      const passes = await Promise.all([
        runMarginPass({ knex: db(), now: at(0), appUrl: APP_URL, orgIds: [org.orgId] }),
        runMarginPass({ knex: other, now: at(0), appUrl: APP_URL, orgIds: [org.orgId] }),
      ]);
      expect(passes.some((p) => p.ran)).toBe(true);
      expect(await alertsOf(org.nodeId)).toHaveLength(1);
      expect(await outboxOf(org.orgId)).toHaveLength(1);
      // Without the lock (as if it were lost mid-pass) the open key still admits one alert.
      const [passNode] = await listPassNodes(db(), { orgIds: [org.orgId] });
      const audienceOf = async (orgId: number) => ({ members: await listOrgContacts(db(), orgId), subscriptions: await listOrgSubscriptions(db(), orgId) });
      await db()('alerts').where({ node_id: org.nodeId }).delete();
      await db()('email_outbox').where({ org_id: org.orgId }).delete();
      const racing = await Promise.all([db(), other].map((knex) => applyNodePass({ knex, passNode, now: at(1), appUrl: APP_URL, audienceOf })));
      expect(racing.flatMap((r) => r.opened)).toEqual(['reserve_short']);
      expect(await alertsOf(org.nodeId)).toHaveLength(1);
      expect(await outboxOf(org.orgId)).toHaveLength(1);

      const mails = await Promise.all([db(), other].map((knex) => runMailPass({ knex, now: at(2), smtp: smtp() })));
      expect(mails.some((m) => m.ran)).toBe(true);
      expect(messagesTo(mail.dir, org.people.owner.email)).toHaveLength(1);
      expect((await outboxOf(org.orgId))[0]).toMatchObject({ status: 'sent', attempts: 1 });
    } finally {
      await other.destroy();
    }
  });
});
