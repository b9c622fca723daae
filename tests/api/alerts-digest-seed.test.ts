import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { runDigestPass } from '@/lib/jobs/digest-pass';
import { runMarginPass } from '@/lib/jobs/margin-pass';
import { demoNodes, demoOrganizations } from '@/simulator/fleet/demo-fleet';
import { createTestOrg, insertReading, voltsForMargin } from './alerts-fixtures';

const APP_URL = 'http://127.0.0.1:3999';
afterAll(async () => {
  await db()('email_outbox').where('to_address', 'like', '%@watch-test.example').andWhere('status', 'pending').update({ status: 'dead', last_error: 'test cleanup' });
  await closeDb();
});

describe('the daily digest', () => {
  it('collects a digest subscriber\u2019s alerts of the day into one mail at 07:00 site time, once', async () => {
    const org = await createTestOrg(db());
    await db()('alert_subscriptions').insert({ membership_id: org.people.viewer.membershipId, site_id: null, kinds: JSON.stringify(['reserve_short']), delivery: 'digest' });
    const opened = new Date('2026-11-23T04:00:00Z'); // 20:00 PST on the 22nd
    await insertReading(db(), org.nodeId, new Date(opened.getTime() - 60_000), voltsForMargin({ at: new Date(opened.getTime() - 60_000), margin: 0.5 }));
    await runMarginPass({ knex: db(), now: opened, appUrl: APP_URL, orgIds: [org.orgId] });
    const digests = () => db()('email_outbox').where({ org_id: org.orgId, purpose: 'digest' });
    // 06:59 PST on the 23rd is before the digest hour; 07:00 PST = 15:00 UTC (UTC−8 in November: common practice).
    await runDigestPass({ knex: db(), now: new Date('2026-11-23T14:59:00Z'), appUrl: APP_URL });
    expect(await digests()).toHaveLength(0);
    await runDigestPass({ knex: db(), now: new Date('2026-11-23T15:00:00Z'), appUrl: APP_URL });
    await runDigestPass({ knex: db(), now: new Date('2026-11-23T15:01:00Z'), appUrl: APP_URL });
    const rows = await digests();
    expect(rows).toHaveLength(1);
    expect(rows[0].to_address).toBe(org.people.viewer.email);
    expect(rows[0].subject).toContain('2026-11-23: 1 alert');
    expect(rows[0].text_body).toContain('short: projected brownout before recharge');
  });
});

describe('the seeded demo data', () => {
  it('a pass opens a short alert with an outbox row for a node the seed left short', async () => {
    // The seed leaves a short node whatever the hour (tests/unit/simulator/demo-any-hour.test.ts).
    const seededShort = await db()('node_status as st').join('nodes as n', 'n.id', 'st.node_id').join('organizations as o', 'o.id', 'n.org_id')
      .where('st.state', 'short').whereIn('o.slug', demoOrganizations.map((o) => o.slug)).whereIn('n.name', demoNodes.map((n) => n.name))
      .select('n.id', 'n.org_id');
    expect(seededShort.length).toBeGreaterThan(0);
    console.info(`[seed check] seeded short nodes: ${seededShort.map((n) => n.id).join(', ')}`);
    const orgIds = [...new Set(seededShort.map((n) => n.org_id as number))];
    const report = await runMarginPass({ knex: db(), now: new Date(), appUrl: APP_URL, orgIds });
    expect(report.ran).toBe(true);
    expect(report.failures).toEqual([]);
    console.info(`[seed check] ${report.nodes.map((n) => `${n.nodeId}:${n.state}[${n.opened.join(',')}]`).join(' ')}`);
    const shortNow = report.nodes.filter((n) => n.state === 'short').map((n) => n.nodeId);
    expect(shortNow.length).toBeGreaterThan(0);
    const alerts = await db()('alerts').whereIn('node_id', shortNow).andWhere({ kind: 'reserve_short' }).whereNot('status', 'resolved');
    expect(alerts.length).toBe(shortNow.length);
    const mail = await db()('email_outbox').whereIn('alert_id', alerts.map((a) => a.id));
    expect(mail.length).toBeGreaterThan(0);
  });
});
