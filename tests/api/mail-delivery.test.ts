import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { runMailPass } from '@/lib/jobs/mail-pass';
import { runMarginPass } from '@/lib/jobs/margin-pass';
import { enqueueMail } from '@/lib/mail/outbox';
import { createTestOrg, insertReading, messagesTo, SMTP_FROM, startCatcher, voltsForMargin, type TestOrg } from './alerts-fixtures';

// The outbox sender against a private catcher that answers 250, 451 or 550, or is not there.
// Simulated time (Nov 2026, before the stack's own rows) keeps these passes off other tests' mail.
const T0 = new Date('2026-11-21T04:00:00Z');
const at = (minutes: number) => new Date(T0.getTime() + minutes * 60_000);
let mail: Awaited<ReturnType<typeof startCatcher>>;
const smtp = () => ({ host: '127.0.0.1', port: mail.port, from: SMTP_FROM });
const orgs: number[] = [];

beforeAll(async () => {
  mail = await startCatcher('delivery');
});
afterEach(async () => {
  mail.catcher.mode = 'accept';
  // Leave nothing of ours due for the next test's passes.
  await db()('email_outbox').whereIn('org_id', orgs).andWhere('status', 'pending').update({ status: 'dead', last_error: 'test cleanup' });
});
afterAll(async () => {
  await mail.catcher.close().catch(() => undefined);
  await closeDb();
});

async function queue(org: TestOrg, n = 1, purpose: 'alert' | 'invitation' = 'alert') {
  orgs.push(org.orgId);
  const ids: number[] = [];
  for (let i = 0; i < n; i++) {
    const id = await enqueueMail(db(), { orgId: org.orgId, purpose, to: org.people.owner.email, subject: `Test ${i}`, text: `body ${i}`, html: `<p>body ${i}</p>` });
    await db()('email_outbox').where({ id }).update({ next_attempt_at: at(0), created_at: at(0) });
    ids.push(id);
  }
  return ids;
}
const row = (id: number) => db()('email_outbox').where({ id }).first();

describe('the outbox sender', () => {
  it('retries a 451 later with backoff and then delivers it, with the same Message-ID', async () => {
    const org = await createTestOrg(db());
    const [id] = await queue(org);
    mail.catcher.mode = 'tempfail';
    await runMailPass({ knex: db(), now: at(0), smtp: smtp(), random: () => 0.5 });
    const failed = await row(id);
    expect(failed).toMatchObject({ status: 'pending', attempts: 1 });
    expect(failed.last_error).toContain('451');
    // First retry after ¾ of 30 s with random 0.5 (equal jitter): 22.5 s (derived here).
    expect(new Date(failed.next_attempt_at).getTime() - at(0).getTime()).toBe(22_500);
    await runMailPass({ knex: db(), now: new Date(at(0).getTime() + 10_000), smtp: smtp() });
    expect((await row(id)).attempts).toBe(1); // not due yet: untouched
    mail.catcher.mode = 'accept';
    await runMailPass({ knex: db(), now: at(1), smtp: smtp() });
    const sent = await row(id);
    expect(sent).toMatchObject({ status: 'sent', attempts: 2, last_error: null });
    const messages = messagesTo(mail.dir, org.people.owner.email);
    expect(messages).toHaveLength(1);
    expect(messages[0].headers).toContain(`Message-ID: ${sent.message_id}`);
  });

  it('dead-letters a 550 at once, visibly', async () => {
    const org = await createTestOrg(db());
    const [id] = await queue(org);
    mail.catcher.mode = 'reject';
    await runMailPass({ knex: db(), now: at(0), smtp: smtp() });
    const dead = await row(id);
    expect(dead).toMatchObject({ status: 'dead', attempts: 1 });
    expect(dead.last_error).toContain('550');
    mail.catcher.mode = 'accept';
    await runMailPass({ knex: db(), now: at(120), smtp: smtp() });
    expect((await row(id)).status).toBe('dead');
    expect(messagesTo(mail.dir, org.people.owner.email)).toHaveLength(0);
  });

  it('loses nothing while the relay is down and delivers once it is back', async () => {
    const org = await createTestOrg(db());
    const ids = await queue(org, 2);
    await mail.catcher.close();
    await runMailPass({ knex: db(), now: at(0), smtp: { ...smtp(), timeoutMs: 2000 } });
    const [a, b] = await Promise.all(ids.map(row));
    expect(a).toMatchObject({ status: 'pending', attempts: 1 });
    expect(a.last_error).toMatch(/ECONNREFUSED/);
    // The second was claimed but not tried against a relay known to be down: due again now.
    expect(b).toMatchObject({ status: 'pending', attempts: 0 });
    mail = await startCatcher('delivery-back', mail.port);
    await runMailPass({ knex: db(), now: at(60), smtp: smtp() });
    for (const r of await Promise.all(ids.map(row))) expect(r.status).toBe('sent');
    expect(messagesTo(mail.dir, org.people.owner.email)).toHaveLength(2);
  });

  it('holds alert mail beyond the hourly cap of the organization and sends it the next hour', async () => {
    const org = await createTestOrg(db(), { org: { mail_cap_per_hour: 2 } });
    const ids = await queue(org, 3);
    const report = await runMailPass({ knex: db(), now: at(0), smtp: smtp() });
    expect(report).toMatchObject({ sent: 2, held: 1 });
    const held = await row(ids[2]);
    expect(held.status).toBe('pending');
    expect(held.attempts).toBe(0);
    expect(held.last_error).toMatch(/^held: .*cap of 2/);
    expect(new Date(held.next_attempt_at).getTime()).toBe(at(60).getTime());
    await runMailPass({ knex: db(), now: at(30), smtp: smtp() });
    expect((await row(ids[2])).status).toBe('pending');
    await runMailPass({ knex: db(), now: at(61), smtp: smtp() });
    expect((await row(ids[2])).status).toBe('sent');
  });

  it('sends invitations through the same sender, never held by the cap', async () => {
    const org = await createTestOrg(db(), { org: { mail_cap_per_hour: 0 } });
    const [id] = await queue(org, 1, 'invitation');
    await runMailPass({ knex: db(), now: at(0), smtp: smtp() });
    expect((await row(id)).status).toBe('sent');
  });

  it('keeps a node name with CR/LF out of the headers of the real message', async () => {
    const org = await createTestOrg(db(), { nodeName: 'Evil\r\nBcc: someone@watch-test.example' });
    orgs.push(org.orgId);
    await insertReading(db(), org.nodeId, at(-1), voltsForMargin({ at: at(-1), margin: 0.4 }));
    await runMarginPass({ knex: db(), now: at(0), appUrl: 'http://127.0.0.1:3999', orgIds: [org.orgId] });
    await runMailPass({ knex: db(), now: at(1), smtp: smtp() });
    const [message] = messagesTo(mail.dir, org.people.owner.email);
    expect(message.headers).toMatch(/^Subject: Evil Bcc: someone@watch-test\.example at /m);
    expect(message.headers).not.toMatch(/^Bcc:/im);
  });
});
