import { DEFAULT_OWNER_KINDS } from '@/lib/alerts/recipients';
import { db } from '@/lib/db/knex';
import { listOwnSubscriptions, replaceOwnSubscriptions } from '@/lib/db/queries/subscriptions';
import { problems } from '@/lib/errors';
import { memberRoute } from '@/lib/http/route';
import { subscriptionsBody } from '@/lib/schemas/alerts';

// A member's own choice of sites, kinds and delivery. With no rows an owner still gets short alerts.
async function ownView(member: { membershipId: number; role: string }) {
  const subscriptions = await listOwnSubscriptions(db(), member.membershipId);
  const defaults = subscriptions.length === 0 && member.role === 'owner' ? [{ site_id: null, kinds: DEFAULT_OWNER_KINDS, delivery: 'immediate' }] : [];
  return { subscriptions, defaults };
}

export const GET = memberRoute({ permission: 'subscriptions:own' }, async ({ member }) => Response.json(await ownView(member)));

export const PUT = memberRoute({ permission: 'subscriptions:own', body: subscriptionsBody }, async ({ member, body }) => {
  const { unknownSiteIds } = await replaceOwnSubscriptions(db(), { orgId: member.orgId, membershipId: member.membershipId, rows: body.subscriptions });
  if (unknownSiteIds.length) {
    throw problems.invalid(body.subscriptions.flatMap((r, i) => (r.site_id !== null && unknownSiteIds.includes(r.site_id) ? [{ pointer: `/subscriptions/${i}/site_id`, detail: 'Choose one of your sites.' }] : [])));
  }
  return Response.json(await ownView(member));
});
