import type { Metadata } from 'next';
import { PlannerForm } from '@/components/planner/planner-form';
import { requireMember } from '@/lib/auth/guard';
import { listOrgSites } from '@/lib/db/queries/fleet';

export const metadata: Metadata = { title: 'Planner' };

export default async function PlannerPage() {
  const member = await requireMember('planner:use');
  const sites = await listOrgSites(member.orgId);
  return (
    <section>
      <h1 className="text-2xl font-bold">How many cells for the longest night?</h1>
      <p className="mt-1 max-w-3xl text-sm text-ink-muted">
        The planner finds the smallest number of cells in parallel that carries the load from full through the night (the year&apos;s
        longest at the site unless you pick a date) and the extra sunless days with the target margin, and how long the bank takes to charge.
      </p>
      <div className="mt-6">
        <PlannerForm sites={sites.map(({ node_count: _n, ...s }) => s)} />
      </div>
    </section>
  );
}
