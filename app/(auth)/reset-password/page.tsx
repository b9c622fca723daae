import type { Metadata } from 'next';
import { ResetRequestForm } from '@/components/auth/reset-request-form';

export const metadata: Metadata = { title: 'Reset password' };

export default function ResetRequestPage() {
  return (
    <>
      <h1 className="text-xl font-bold">Reset your password</h1>
      <p className="mt-1 text-sm text-ink-muted">We will e-mail you a single-use link.</p>
      <ResetRequestForm />
    </>
  );
}
