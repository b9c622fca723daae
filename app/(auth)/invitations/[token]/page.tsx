import type { Metadata } from 'next';
import Link from 'next/link';
import { JoinExistingForm } from '@/components/auth/join-existing-form';
import { TokenPasswordForm } from '@/components/auth/token-password-form';
import { oneTimeTokenSchema } from '@/lib/schemas/team';
import { describeInvitation } from '@/lib/db/queries/team';

export const metadata: Metadata = { title: 'Accept invitation' };
export const dynamic = 'force-dynamic';

export default async function AcceptInvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = oneTimeTokenSchema.safeParse(token).success ? await describeInvitation(token) : null;
  if (!invitation) {
    return (
      <>
        <h1 className="text-xl font-bold">This invitation link does not work</h1>
        <p className="mt-2 text-sm text-ink-muted" data-testid="invitation-gone">
          It was used already, it has expired (links last 7 days), or it was copied incompletely. Ask the owner who invited you for a new one.
        </p>
        <p className="mt-4 text-sm"><Link href="/sign-in" className="font-bold underline underline-offset-4">Sign in</Link></p>
      </>
    );
  }
  const { orgName, role, email, existingAccount } = invitation;
  return (
    <>
      <h1 className="text-xl font-bold">Join {orgName} on Duskwatch</h1>
      <p className="mt-1 text-sm text-ink-muted">
        As <strong className="text-ink">{role}</strong>, for <span className="text-ink">{email}</span>. This link works once.
      </p>
      {existingAccount ? (
        <>
          <p className="mt-3 text-sm text-ink-muted">You already have a Duskwatch account with this e-mail address. Joining keeps your password and your other organizations.</p>
          <JoinExistingForm token={token} orgName={orgName} />
        </>
      ) : (
        <>
          <p className="mt-3 text-sm text-ink-muted">Choose your password.</p>
          <TokenPasswordForm token={token} mode="invitation" />
        </>
      )}
    </>
  );
}
