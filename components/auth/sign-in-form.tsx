'use client';

import { signIn } from 'next-auth/react';
import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';

export function SignInForm({ next }: { next: string }) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setBusy(true);
    setError(null);
    const result = await signIn('credentials', { email: form.get('email'), password: form.get('password'), redirect: false });
    if (result?.ok && !result.error) {
      window.location.assign(next);
      return;
    }
    setBusy(false);
    // One answer for an unknown e-mail, a wrong password or a throttled account.
    setError('That e-mail and password did not work. Check them, or wait a minute and try again.');
  }

  return (
    <form onSubmit={onSubmit} className="mt-6 flex flex-col gap-4" data-testid="sign-in-form" noValidate>
      <Field id="email" name="email" type="email" label="E-mail" autoComplete="username" required />
      <Field id="password" name="password" type="password" label="Password" autoComplete="current-password" required />
      {error ? <p className="rounded-md border border-hazard/60 bg-dusk-950 p-3 text-sm text-hazard" role="alert" data-testid="sign-in-error">{error}</p> : null}
      <Button type="submit" disabled={busy} data-testid="sign-in-submit">{busy ? 'Signing in…' : 'Sign in'}</Button>
    </form>
  );
}
