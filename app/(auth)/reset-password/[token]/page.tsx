import type { Metadata } from 'next';
import { TokenPasswordForm } from '@/components/auth/token-password-form';

export const metadata: Metadata = { title: 'Choose a new password' };

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <>
      <h1 className="text-xl font-bold">Choose a new password</h1>
      <p className="mt-1 text-sm text-ink-muted">This link works once, for an hour.</p>
      <TokenPasswordForm token={token} mode="reset" />
    </>
  );
}
