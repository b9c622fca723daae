import Link from 'next/link';
import { notFound, redirect } from 'next/navigation';
import { currentMember } from '@/lib/auth/guard';
import { getNodeInOrg } from '@/lib/db/queries/nodes';
import { ProblemError } from '@/lib/errors';

/** The node behind one of its record pages; another organization's node is a plain 404. */
export async function loadNodeForPage(nodeIdParam: string) {
  const member = await currentMember();
  if (!member) redirect('/sign-in');
  const nodeId = Number(nodeIdParam);
  if (!Number.isSafeInteger(nodeId) || nodeId <= 0 || String(nodeId) !== nodeIdParam) notFound();
  try {
    return { member, node: await getNodeInOrg(member.orgId, nodeId) };
  } catch (e) {
    if (e instanceof ProblemError && e.status === 404) notFound();
    throw e;
  }
}

const TABS = [
  { slug: 'settings', label: 'Settings' },
  { slug: 'credentials', label: 'Credentials' },
  { slug: 'imports', label: 'Imports' },
  { slug: 'visits', label: 'Visits' },
] as const;

export function NodePageHeader({ node, current }: { node: { id: number; name: string; site_name: string }; current: (typeof TABS)[number]['slug'] }) {
  const title = TABS.find((t) => t.slug === current)!.label;
  return (
    <header className="mb-6">
      <Link href={`/nodes/${node.id}`} className="text-sm text-tide underline-offset-2 hover:underline" data-testid="back-to-node">← {node.name} overview</Link>
      <h1 className="mt-1 text-2xl font-bold"><span data-testid="node-name">{node.name}</span> <span className="text-ink-muted">· {title}</span></h1>
      <p className="text-sm text-ink-faint">{node.site_name}</p>
      <nav aria-label="Node records" className="mt-3 flex flex-wrap gap-1 text-sm">
        {TABS.map((t) => (
          <Link key={t.slug} href={`/nodes/${node.id}/${t.slug}`} aria-current={t.slug === current ? 'page' : undefined}
            className={`rounded-md px-3 py-1.5 ${t.slug === current ? 'bg-dusk-700 font-bold text-ink' : 'text-ink-muted hover:bg-dusk-800'}`}>{t.label}</Link>
        ))}
      </nav>
    </header>
  );
}
