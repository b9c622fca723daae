import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { InvitationRow } from '@/components/team/invitation-row';
import { InviteForm } from '@/components/team/invite-form';
import { MemberRow } from '@/components/team/member-row';
import { currentMember } from '@/lib/auth/guard';
import { can } from '@/lib/auth/roles';
import { listMembersOfOrg } from '@/lib/db/queries/people';
import { listInvitations } from '@/lib/db/queries/team';
import { formatInTimeZone, TIME_PATTERNS } from '@/lib/format/time';

export const metadata: Metadata = { title: 'Team' };

export default async function TeamPage() {
  const member = await currentMember();
  if (!member) redirect('/sign-in');
  if (!can(member.role, 'team:manage')) {
    return <p className="text-ink-muted">Only owners manage the team. Ask an owner of {member.orgName} to change roles or invite people.</p>;
  }
  const [members, invitations] = await Promise.all([listMembersOfOrg(member.orgId), listInvitations(member.orgId)]);
  const owners = members.filter((m) => m.role === 'owner').length;
  return (
    <section className="grid grid-cols-1 gap-8 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
      <div>
        <h1 className="text-2xl font-bold">Team</h1>
        <p className="mt-1 text-sm text-ink-muted">Role changes and removals take effect on the member&apos;s next request.</p>
        <ul className="mt-4" aria-label="Members">
          {/* Keyed by role as well, so a row's select starts again from the role the server holds. */}
          {members.map((m) => <MemberRow key={`${m.membershipId}:${m.role}`} member={m} isSelf={m.userId === member.userId} onlyOwner={m.role === 'owner' && owners <= 1} />)}
        </ul>
        {invitations.length ? (
          <>
            <h2 className="mt-8 font-bold">Open invitations</h2>
            <ul className="mt-2 text-sm text-ink-muted" aria-label="Open invitations">
              {invitations.map((i: { id: number; email: string; role: string; expiresAt: Date }) => (
                <InvitationRow key={i.id} invitation={{ id: i.id, email: i.email, role: i.role }} until={formatInTimeZone(new Date(i.expiresAt), 'UTC', TIME_PATTERNS.record)} />
              ))}
            </ul>
          </>
        ) : null}
      </div>
      <InviteForm />
    </section>
  );
}
