import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { SignOutButton } from '@/components/shell/sign-out-button';
import { currentMember } from '@/lib/auth/guard';
import { listMembershipsOfUser } from '@/lib/db/queries/people';

export const metadata: Metadata = { title: 'Account' };

export default async function AccountPage() {
  const member = await currentMember();
  if (!member) redirect('/sign-in');
  const memberships = await listMembershipsOfUser(member.userId);
  return (
    <section className="max-w-xl">
      <h1 className="text-2xl font-bold">Account</h1>
      <dl className="mt-4 grid grid-cols-[8rem_1fr] gap-y-2 text-sm">
        <dt className="text-ink-faint">Name</dt><dd>{member.name || '—'}</dd>
        <dt className="text-ink-faint">E-mail</dt><dd>{member.email}</dd>
      </dl>
      <h2 className="mt-8 font-bold">Organizations</h2>
      <ul className="mt-2 text-sm">
        {memberships.map((m) => (
          <li key={m.membershipId} className="border-t border-dusk-800 py-2">{m.orgName} — <span className="text-ink-muted">{m.role}</span>{m.orgId === member.orgId ? <span className="ml-2 text-xs text-tide">current</span> : null}</li>
        ))}
      </ul>
      <h2 className="mt-8 font-bold">More</h2>
      <ul className="mt-2 flex flex-wrap gap-2 text-sm">
        <li><Link href="/account/subscriptions" className="rounded-md border border-dusk-600 px-3 py-1.5 hover:bg-dusk-800">Which alerts reach me</Link></li>
        <li><Link href="/settings" className="rounded-md border border-dusk-600 px-3 py-1.5 hover:bg-dusk-800">Organization settings</Link></li>
        {member.role === 'owner' ? <li><Link href="/team" className="rounded-md border border-dusk-600 px-3 py-1.5 hover:bg-dusk-800">Team</Link></li> : null}
      </ul>
      <div className="mt-8 flex flex-wrap gap-3">
        <Link href="/reset-password" className="rounded-md border border-dusk-600 px-4 py-2 text-sm font-bold hover:bg-dusk-800">Change password by e-mail link</Link>
        <SignOutButton />
      </div>
    </section>
  );
}
