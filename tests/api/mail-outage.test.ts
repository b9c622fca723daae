import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { runMailPass } from '@/lib/jobs/mail-pass';
import { enqueueMail } from '@/lib/mail/outbox';
import { freePort, readMessages, SMTP_FROM } from './alerts-fixtures';
import { addNode, createOutageOrg, MAIL_TICK_MS, runTicks, startOutage, writeNightReadings, type PlannedNode } from './helpers/mail-outage';
import { watchOutbox, type OutboxRow } from './helpers/mail-outbox-watch';

// Issue 9, "mail outage": the relay down for an hour of simulated time while real margin passes
// open real alerts in two organizations; then the relay is back and the job runner's ticks go on.
// Checklist: OWASP ASVS 5.0 V16.5.2 ("the application continues to operate securely when external
// resource access fails", e.g. graceful degradation: the relay is that resource, no alert is lost)
// and, for the outbox itself, common practice (transactional outbox: at-least-once hand-over,
// one Message-ID per message, capped exponential backoff with jitter).
// Simulated nights in Oct 2026, earlier than every other test's clock, so no other test's mail is due.
const APP_URL = 'http://127.0.0.1:3999';
const RECIPIENTS = ['owner', 'deployer', 'viewer'] as const;
const orgIds: number[] = [];
const stopAfterTest: (() => Promise<unknown>)[] = [];

afterEach(async () => {
  for (const stop of stopAfterTest.splice(0)) await stop().catch(() => undefined);
  await db()('email_outbox').whereIn('org_id', orgIds).andWhere('status', 'pending').update({ status: 'dead', last_error: 'test cleanup' });
});
afterAll(closeDb);

// The retry policy (lib/mail/retry.ts): a message the relay deferred waits at most 1 h, a relay
// that is unavailable (refused, 421, greeting or HELO refused) at most 5 min; a hold at most 1 h.
// Derived here from the shortest waits (half of each ceiling): deferred, 15+30+…+960 s = 1905 s
// < 1 h < 3705 s, so at most 8 failures in the hour and one success; relay down, 15+30+60+120 s
// then 150 s each, so at most 27 failures in the hour and one success.
const DEFERRED = { retryCapMs: 3_600_000, maxAttempts: 9 };
const RELAY_DOWN = { retryCapMs: 300_000, maxAttempts: 28 };

describe.each([
  { relay: 'stopped (connection refused)', failing: null, day: '2026-10-13', policy: RELAY_DOWN },
  { relay: 'answering 421 to every command', failing: 421 as const, day: '2026-10-15', policy: RELAY_DOWN },
  { relay: 'answering 451 to every command', failing: 451 as const, day: '2026-10-17', policy: RELAY_DOWN },
  { relay: 'deferring every message with 451 after DATA', failing: 'tempfail' as const, day: '2026-10-19', policy: DEFERRED },
])('an hour-long mail outage, relay $relay', ({ relay, failing, day, policy }) => {
  it('every alert e-mail arrives after it, exactly once; none dead, none dropped by the cap; backoff bounded', async () => {
    const start = new Date(`${day}T04:00:00Z`); // 21:00 local, a long night ahead
    const at = (minutes: number) => new Date(start.getTime() + minutes * 60_000);
    const label = `outage-${day}`;
    const a = await createOutageOrg(db(), { capPerHour: 60, label: `${label}-a` });
    const b = await createOutageOrg(db(), { capPerHour: 4, label: `${label}-b` });
    orgIds.push(a.orgId, b.orgId);
    const plan: PlannedNode[] = [
      { nodeId: a.nodeId, orgId: a.orgId, shortFromMinutes: 0 },
      { nodeId: await addNode(db(), a, `${label}-a-2`), orgId: a.orgId, shortFromMinutes: 0 },
      { nodeId: await addNode(db(), a, `${label}-a-3`), orgId: a.orgId, shortFromMinutes: 15 },
      { nodeId: await addNode(db(), a, `${label}-a-4`), orgId: a.orgId, shortFromMinutes: 45 },
      { nodeId: await addNode(db(), a, `${label}-a-5`), orgId: a.orgId, shortFromMinutes: 75 }, // after the outage
      { nodeId: b.nodeId, orgId: b.orgId, shortFromMinutes: 0 },
      { nodeId: await addNode(db(), b, `${label}-b-2`), orgId: b.orgId, shortFromMinutes: 0 }, // six e-mails at once: more than b's cap
      { nodeId: await addNode(db(), b, `${label}-b-3`), orgId: b.orgId, shortFromMinutes: 45 },
    ];
    await writeNightReadings(db(), plan, start, 6);

    const port = await freePort();
    const smtp = { host: '127.0.0.1', port, from: SMTP_FROM, timeoutMs: 5000 };
    const relayDown = await startOutage({ port, failing, label });
    stopAfterTest.push(relayDown.stop);
    const rows = () => db()('email_outbox').whereIn('org_id', [a.orgId, b.orgId]).orderBy('id') as Promise<OutboxRow[]>;
    const watch = watchOutbox({ rows, caps: new Map([[a.orgId, 60], [b.orgId, 4]]), retryCapMs: policy.retryCapMs, maxAttempts: policy.maxAttempts });

    // The outage: one hour of runner ticks, alerts opening all along; nothing can be sent.
    await runTicks({ knex: db(), from: at(0), to: at(60), orgIds: [a.orgId, b.orgId], smtp, appUrl: APP_URL, afterTick: watch.check });
    const duringOutage = await rows();
    expect(duringOutage.length).toBe(7 * RECIPIENTS.length); // seven alerts opened during the outage, three people each
    expect(duringOutage.every((r) => r.status === 'pending')).toBe(true);
    expect(duringOutage.filter((r) => r.attempts > 0).length).toBeGreaterThan(0);
    const expectedError = failing === null ? /ECONNREFUSED/ : new RegExp(`^${failing === 'tempfail' ? 451 : failing} `);
    expect(duringOutage.filter((r) => r.last_error && !r.last_error.startsWith('held')).every((r) => expectedError.test(r.last_error!))).toBe(true);
    expect(relayDown.received()).toBe(0);

    // The relay is back on the same port; the runner keeps ticking until all is sent, and 15 minutes more.
    const mail = await relayDown.restore();
    let allSentAt: Date | null = null;
    const end = await runTicks({
      knex: db(), from: at(60), to: at(6 * 60), orgIds: [a.orgId, b.orgId], smtp, appUrl: APP_URL,
      afterTick: async (now) => {
        await watch.check(now);
        const current = await rows();
        if (!allSentAt && current.length === 8 * RECIPIENTS.length && current.every((r) => r.status === 'sent')) allSentAt = now;
        return allSentAt !== null && now.getTime() - allSentAt.getTime() >= 15 * 60_000;
      },
    });
    expect(allSentAt, `still pending at ${end.toISOString()}`).not.toBeNull();

    // One alert per node, and one outbox row per alert and person.
    const alerts = await db()('alerts').whereIn('node_id', plan.map((p) => p.nodeId)).andWhere('kind', 'reserve_short');
    expect(alerts.map((x) => x.node_id).sort()).toEqual(plan.map((p) => p.nodeId).sort());
    const final = await rows();
    const people = (org: typeof a) => RECIPIENTS.map((role) => org.people[role].email).sort();
    for (const alert of alerts) {
      expect(final.filter((r) => r.alert_id === alert.id).map((r) => r.to_address).sort()).toEqual(people(alert.org_id === a.orgId ? a : b));
    }
    expect(final).toHaveLength(alerts.length * RECIPIENTS.length);

    // Every one arrived exactly once, by Message-ID, and nothing else arrived for these people.
    const addresses = new Set([...people(a), ...people(b)]);
    const received = readMessages(mail.dir).filter((m) => [...addresses].some((address) => m.headers.includes(address)));
    const ids = received.map((m) => /^Message-ID: (\S+)/im.exec(m.headers)?.[1]);
    expect(ids.sort()).toEqual(final.map((r) => r.message_id).sort());
    expect(new Set(ids).size).toBe(ids.length);
    expect(final.every((r) => r.status === 'sent' && r.attempts <= policy.maxAttempts)).toBe(true);

    // The cap of organization b held mail back and let it go later: never more than 4 in an hour.
    const sentB = final.filter((r) => r.org_id === b.orgId).map((r) => new Date(r.sent_at!).getTime()).sort((x, y) => x - y);
    for (let i = 4; i < sentB.length; i++) expect(sentB[i] - sentB[i - 4]).toBeGreaterThanOrEqual(3_600_000);
    expect([...watch.everHeld].some((id) => final.find((r) => r.id === id)?.org_id === b.orgId)).toBe(true);
    // Organization a has no cap in the way: its mail waited at most one retry ceiling after the relay came back.
    const waitedMs = final.filter((x) => x.org_id === a.orgId).map((r) => new Date(r.sent_at!).getTime() - Math.max(at(60).getTime(), new Date(r.created_at).getTime()));
    for (const w of waitedMs) expect(w).toBeLessThanOrEqual(policy.retryCapMs + MAIL_TICK_MS);
    console.log(`[mail-outage] ${relay}: ${final.length} e-mails, all sent ${(allSentAt!.getTime() - at(60).getTime()) / 60_000} min after recovery;`
      + ` org a waited at most ${Math.max(...waitedMs) / 60_000} min; attempts ≤ ${Math.max(...final.map((r) => r.attempts))}; ${watch.everHeld.size} held by the cap`);
  }, 600_000);
});

describe('a relay down for two days', () => {
  it('retries until exactly 48 h after the e-mail was written, never later, then dead-letters it visibly', async () => {
    const org = await createOutageOrg(db(), { capPerHour: 60, label: 'outage-48h' });
    orgIds.push(org.orgId);
    const created = new Date('2026-10-01T00:00:00Z');
    const giveUpAt = created.getTime() + 48 * 3_600_000; // lib/mail/retry.ts GIVE_UP_MS
    const id = await enqueueMail(db(), { orgId: org.orgId, purpose: 'alert', to: org.people.owner.email, subject: 'Long outage', text: 'x', html: '<p>x</p>' });
    await db()('email_outbox').where({ id }).update({ created_at: created, next_attempt_at: created });
    const smtp = { host: '127.0.0.1', port: await freePort(), from: SMTP_FROM, timeoutMs: 2000 }; // nobody listens there
    // Each step is the first runner tick that finds the row due (the ticks between find nothing).
    let now = created;
    let row = await db()('email_outbox').where({ id }).first();
    let lastDue = 0;
    while (row.status === 'pending' && now.getTime() <= giveUpAt + 3_600_000) {
      await runMailPass({ knex: db(), now, smtp });
      row = await db()('email_outbox').where({ id }).first();
      if (row.status !== 'pending') break;
      lastDue = new Date(row.next_attempt_at).getTime();
      expect(lastDue).toBeLessThanOrEqual(giveUpAt);
      now = new Date(Math.max(now.getTime() + MAIL_TICK_MS, new Date(row.next_attempt_at).getTime()));
    }
    expect(row.status).toBe('dead');
    // The last try was due at 48 h exactly (never a jittered backoff past it), and a runner
    // finds it on its first tick from then: within one tick after 48 h.
    expect(lastDue).toBe(giveUpAt);
    expect(now.getTime()).toBeGreaterThanOrEqual(giveUpAt);
    expect(now.getTime()).toBeLessThanOrEqual(giveUpAt + MAIL_TICK_MS);
    expect(row.last_error).toMatch(/^gave up after 48 h: .*ECONNREFUSED/);
    // Derived here: after the first four waits, one try every 150–300 s for 48 h: between 576 and 1152 tries.
    expect(row.attempts).toBeGreaterThanOrEqual(576);
    expect(row.attempts).toBeLessThanOrEqual(1153);
  }, 120_000);
});
