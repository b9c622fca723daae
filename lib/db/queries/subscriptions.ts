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
