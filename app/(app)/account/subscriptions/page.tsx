import type { Metadata } from 'next';
import Link from 'next/link';
import { SubscriptionsForm } from '@/components/subscriptions/subscriptions-form';
import type { SubscriptionsView } from '@/components/subscriptions/subscription-model';
import { DEFAULT_OWNER_KINDS } from '@/lib/alerts/recipients';
import { requireMember } from '@/lib/auth/guard';
import { listOrgSites } from '@/lib/db/queries/fleet';
import { listOwnSubscriptions } from '@/lib/db/queries/subscriptions';
import { db } from '@/lib/db/knex';

export const metadata: Metadata = { title: 'Alert e-mail' };

// The caller's own subscriptions; the same view GET /api/v1/subscriptions answers.
export default async function SubscriptionsPage() {
  const member = await requireMember('subscriptions:own');
  const [subscriptions, sites] = await Promise.all([listOwnSubscriptions(db(), member.membershipId), listOrgSites(member.orgId)]);
  const view: SubscriptionsView = {
    subscriptions,
    defaults: subscriptions.length === 0 && member.role === 'owner' ? [{ site_id: null, kinds: DEFAULT_OWNER_KINDS, delivery: 'immediate' }] : [],
  };
  return (
    <section className="max-w-3xl">
      <p className="text-sm"><Link href="/account" className="text-ink-muted underline underline-offset-4 hover:text-ink">Account</Link></p>
      <h1 className="mt-1 text-2xl font-bold">Alert e-mail</h1>
      <p className="mt-1 text-sm text-ink-muted">
        Which alerts of {member.orgName} reach {member.email}, and how. The alerts page lists every alert whatever you choose here.
      </p>
      <SubscriptionsForm initial={view} sites={sites.map((s) => ({ id: s.id, name: s.name }))} isOwner={member.role === 'owner'} />
    </section>
  );
}
