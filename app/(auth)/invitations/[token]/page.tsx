import type { Metadata } from 'next';
import { TokenPasswordForm } from '@/components/auth/token-password-form';

export const metadata: Metadata = { title: 'Accept invitation' };

export default async function AcceptInvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <>
      <h1 className="text-xl font-bold">Join your team on Duskwatch</h1>
      <p className="mt-1 text-sm text-ink-muted">Choose your password. This link works once.</p>
      <TokenPasswordForm token={token} mode="invitation" />
    </>
  );
}
