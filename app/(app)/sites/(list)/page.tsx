import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { SiteCard } from '@/components/sites/site-card';
import { currentMember } from '@/lib/auth/guard';
import { can } from '@/lib/auth/roles';
import { listSites } from '@/lib/db/queries/sites';

export const metadata: Metadata = { title: 'Sites' };

export default async function SitesPage() {
  const member = await currentMember();
  if (!member) redirect('/sign-in');
  const sites = await listSites(member.orgId);
  const canEdit = can(member.role, 'sites:write');
  return (
    <section className="max-w-5xl">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold">Sites</h1>
        {canEdit ? (
          <div className="flex gap-2">
            <Link href="/nodes/new" className="rounded-md border border-dusk-600 px-4 py-2 text-sm font-bold hover:bg-dusk-800" data-testid="node-new-link">New node</Link>
            <Link href="/sites/new" className="rounded-md bg-ember px-4 py-2 text-sm font-bold text-dusk-950 hover:opacity-90" data-testid="site-new-link">New site</Link>
          </div>
        ) : null}
      </div>
      <p className="mt-1 text-sm text-ink-muted">Each site sets where the sun is for its nodes, and the time zone their times are shown in.</p>
      {sites.length === 0 ? (
        <p className="mt-6 rounded-xl border border-dashed border-dusk-600 p-4 text-sm text-ink-muted" data-testid="sites-empty">No sites yet.{canEdit ? ' Add the first one to place nodes on it.' : ''}</p>
      ) : (
        <ul className="mt-6 grid gap-3 md:grid-cols-2" aria-label="Sites">{sites.map((s) => <SiteCard key={s.id} site={s} canEdit={canEdit} />)}</ul>
      )}
    </section>
  );
}
