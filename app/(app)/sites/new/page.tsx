import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { SiteForm } from '@/components/sites/site-form';
import { currentMember } from '@/lib/auth/guard';
import { can } from '@/lib/auth/roles';

export const metadata: Metadata = { title: 'New site' };

export default async function NewSitePage() {
  const member = await currentMember();
  if (!member) redirect('/sign-in');
  if (!can(member.role, 'sites:write')) return <p className="text-ink-muted" data-testid="read-only-notice">Deployers and owners add sites. Your role ({member.role}) reads them.</p>;
  return (
    <section>
      <Link href="/sites" className="text-sm text-tide underline-offset-2 hover:underline">← Sites</Link>
      <h1 className="mb-4 mt-1 text-2xl font-bold">New site</h1>
      <SiteForm initial={null} />
    </section>
  );
}
