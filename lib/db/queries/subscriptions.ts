import type { Knex } from 'knex';
import { ALERT_KINDS, type AlertKind } from '../../alerts/kinds';
import type { MemberContact, SubscriptionRow } from '../../alerts/recipients';

type Db = Knex | Knex.Transaction;

function parseKinds(value: unknown): AlertKind[] {
  const raw = typeof value === 'string' ? JSON.parse(value) : value;
  return Array.isArray(raw) ? raw.filter((k): k is AlertKind => (ALERT_KINDS as readonly string[]).includes(k)) : [];
}

/** Every member of the organization who could receive alert mail. */
export async function listOrgContacts(knex: Db, orgId: number): Promise<MemberContact[]> {
  const rows = await knex('memberships as m').join('users as u', 'u.id', 'm.user_id').where('m.org_id', orgId)
    .select('m.id as membershipId', 'm.role', 'u.email', 'u.name');
  return rows as MemberContact[];
}

export async function listOrgSubscriptions(knex: Db, orgId: number): Promise<SubscriptionRow[]> {
  const rows = await knex('alert_subscriptions as s').join('memberships as m', 'm.id', 's.membership_id').where('m.org_id', orgId)
    .select('s.membership_id', 's.site_id', 's.kinds', 's.delivery');
  return rows.map((r) => ({ membershipId: r.membership_id, siteId: r.site_id, kinds: parseKinds(r.kinds), delivery: r.delivery }));
}

export async function listOwnSubscriptions(knex: Db, membershipId: number) {
  const rows = await knex('alert_subscriptions').where('membership_id', membershipId).orderBy('site_id').select('site_id', 'kinds', 'delivery');
  return rows.map((r) => ({ site_id: r.site_id as number | null, kinds: parseKinds(r.kinds), delivery: r.delivery as 'immediate' | 'digest' }));
}

/** Replaces the caller's rows in one go; returns the site ids that are not the organization's. */
export async function replaceOwnSubscriptions(
  knex: Knex,
  opts: { orgId: number; membershipId: number; rows: { site_id: number | null; kinds: AlertKind[]; delivery: 'immediate' | 'digest' }[] },
): Promise<{ unknownSiteIds: number[] }> {
  return knex.transaction(async (trx) => {
    const siteIds = opts.rows.map((r) => r.site_id).filter((id): id is number => id !== null);
    const known = siteIds.length ? await trx('sites').where('org_id', opts.orgId).whereIn('id', siteIds).pluck('id') : [];
    const unknownSiteIds = siteIds.filter((id) => !known.includes(id));
    if (unknownSiteIds.length) return { unknownSiteIds };
    await trx('alert_subscriptions').where('membership_id', opts.membershipId).delete();
    if (opts.rows.length) {
      await trx('alert_subscriptions').insert(
        opts.rows.map((r) => ({ membership_id: opts.membershipId, site_id: r.site_id, kinds: JSON.stringify([...new Set(r.kinds)]), delivery: r.delivery })),
      );
    }
    return { unknownSiteIds: [] };
  });
}

// ---- the daily digest ----

/** Organizations where someone asked for a digest, with the zone of their first site. */
export async function listDigestOrgs(knex: Db): Promise<{ orgId: number; orgName: string; timeZone: string }[]> {
  const rows = await knex('alert_subscriptions as s').join('memberships as m', 'm.id', 's.membership_id').join('organizations as o', 'o.id', 'm.org_id')
    .where('s.delivery', 'digest').distinct('o.id as orgId', 'o.name as orgName');
  const out = [];
  for (const r of rows) {
    const site = await knex('sites').where('org_id', r.orgId).orderBy('id').first('time_zone');
    out.push({ orgId: r.orgId, orgName: r.orgName, timeZone: site?.time_zone ?? 'UTC' });
  }
  return out;
}

export async function listAlertsOpenedBetween(knex: Db, orgId: number, from: Date, to: Date) {
  return knex('alerts as a').join('nodes as n', 'n.id', 'a.node_id').join('sites as s', 's.id', 'n.site_id')
    .where('a.org_id', orgId).andWhere('a.opened_at', '>=', from).andWhere('a.opened_at', '<', to).orderBy('a.opened_at')
    .select('a.id', 'a.kind', 'a.status', 'a.detail', 'a.opened_at', 'n.id as node_id', 'n.name as node_name', 's.id as site_id', 's.name as site_name', 's.time_zone');
}

/** The digest's Message-ID names the member and the day, so a digest is written once however often the pass runs. */
export async function insertDigestMail(knex: Db, row: { orgId: number; to: string; subject: string; text: string; html: string; messageId: string; now: Date }): Promise<boolean> {
  try {
    await knex('email_outbox').insert({
      org_id: row.orgId, alert_id: null, purpose: 'digest', to_address: row.to.slice(0, 254), subject: row.subject.slice(0, 300),
      text_body: row.text, html_body: row.html, message_id: row.messageId, created_at: row.now, next_attempt_at: row.now,
    });
    return true;
  } catch (error) {
    // Not INSERT IGNORE, which would also swallow real errors: only "already written" is fine.
    if ((error as { code?: string }).code === 'ER_DUP_ENTRY') return false;
    throw error;
  }
}

export async function outboxHasMessage(knex: Db, messageId: string): Promise<boolean> {
  return Boolean(await knex('email_outbox').where('message_id', messageId).first('id'));
}
