'use client';

import Link from 'next/link';
import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { apiFetch, fieldErrors } from '@/lib/client/api';

/** Sets a password through a single-use link: accepting an invitation, or a reset. */
export function TokenPasswordForm({ token, mode }: { token: string; mode: 'invitation' | 'reset' }) {
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    if (form.get('password') !== form.get('repeat')) {
      setErrors({ repeat: 'The two passwords differ.' });
      return;
    }
    setBusy(true);
    const res = mode === 'invitation'
      ? await apiFetch('/api/v1/invitations/accept', { method: 'POST', body: { token, name: form.get('name'), password: form.get('password') } })
      : await apiFetch('/api/v1/password-resets/confirm', { method: 'POST', body: { token, password: form.get('password') } });
    setBusy(false);
    if (!res.ok) {
      setErrors(fieldErrors(res.problem));
      setMessage(res.problem.errors ? null : res.problem.detail ?? res.problem.title);
      return;
    }
    setDone(true);
  }

  if (done) {
    return (
      <p className="mt-4 text-ink-muted" role="status">
        Your password is set. <Link href="/sign-in" className="font-bold text-ink underline underline-offset-4">Sign in</Link>.
      </p>
    );
  }
  return (
    <form onSubmit={onSubmit} className="mt-6 flex flex-col gap-4" noValidate>
      {mode === 'invitation' ? <Field id="name" name="name" label="Your name" autoComplete="name" error={errors.name} required /> : null}
      <Field id="password" name="password" type="password" label="New password" autoComplete="new-password" hint="At least 10 characters; a few words you can remember work well." error={errors.password} required />
      <Field id="repeat" name="repeat" type="password" label="New password again" autoComplete="new-password" error={errors.repeat} required />
      {message ? <p className="text-sm text-hazard" role="alert">{message}</p> : null}
      <Button type="submit" disabled={busy}>{busy ? 'Saving…' : 'Set password'}</Button>
    </form>
  );
}
