import type { Metadata } from 'next';
import Link from 'next/link';
import { SignInForm } from '@/components/auth/sign-in-form';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string }> }) {
  const { callbackUrl } = await searchParams;
  // Only our own paths are followed after sign-in (no open redirect).
  const next = callbackUrl && /^\/(?!\/)/.test(callbackUrl) ? callbackUrl : '/fleet';
  return (
    <>
      <h1 className="text-xl font-bold">Sign in</h1>
      <p className="mt-1 text-sm text-ink-muted">Your fleet, before dusk.</p>
      <SignInForm next={next} />
      <p className="mt-6 text-sm text-ink-muted">
        <Link href="/reset-password" className="underline underline-offset-4 hover:text-ink">Forgot your password?</Link>
      </p>
    </>
  );
}
