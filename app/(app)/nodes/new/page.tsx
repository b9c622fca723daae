import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { NodeForm } from '@/components/settings/node-form';
import { NEW_NODE } from '@/components/settings/node-fields';
import { currentMember } from '@/lib/auth/guard';
import { can } from '@/lib/auth/roles';
import { listSites } from '@/lib/db/queries/sites';

export const metadata: Metadata = { title: 'New node' };

/** `?site=<id>` (from a site's page) picks that site in advance, if it is one of this organization's. */
export default async function NewNodePage({ searchParams }: { searchParams: Promise<{ site?: string }> }) {
  const member = await currentMember();
  if (!member) redirect('/sign-in');
  if (!can(member.role, 'nodes:write')) {
    return <p className="text-ink-muted" data-testid="read-only-notice">Deployers and owners add nodes. Your role ({member.role}) reads the fleet.</p>;
  }
  const sites = await listSites(member.orgId);
  const asked = Number((await searchParams).site);
  const siteId = sites.find((s) => s.id === asked)?.id ?? (sites.length === 1 ? sites[0].id : 0);
  return (
    <section className="max-w-6xl">
      <Link href="/fleet" className="text-sm text-tide underline-offset-2 hover:underline">← Tonight</Link>
      <h1 className="mt-1 text-2xl font-bold">New node</h1>
      <p className="mt-1 text-sm text-ink-muted">The figures beside the inputs follow what you type. After saving, create the device credential.</p>
      {sites.length === 0 ? (
        <p className="mt-6 rounded-xl border border-dusk-700 bg-dusk-900 p-4" data-testid="no-sites">A node stands on a site: <Link className="text-tide underline" href="/sites/new">add a site first</Link>.</p>
      ) : (
        <div className="mt-6"><NodeForm initial={{ ...NEW_NODE, site_id: siteId }} sites={sites.map((s) => ({ id: s.id, name: s.name }))} /></div>
      )}
    </section>
  );
}
