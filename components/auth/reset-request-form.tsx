'use client';

import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { apiFetch, fieldErrors } from '@/lib/client/api';

export function ResetRequestForm() {
  const [error, setError] = useState<string | undefined>();
  const [sent, setSent] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const email = new FormData(event.currentTarget).get('email');
    const res = await apiFetch('/api/v1/password-resets', { method: 'POST', body: { email } });
    if (!res.ok) setError(fieldErrors(res.problem).email ?? res.problem.detail ?? res.problem.title);
    else setSent(true);
  }

  if (sent) return <p className="mt-4 text-ink-muted" role="status">If that address has an account, a reset link is on its way. It works once, for an hour.</p>;
  return (
    <form onSubmit={onSubmit} className="mt-6 flex flex-col gap-4" noValidate>
      <Field id="email" name="email" type="email" label="E-mail" autoComplete="username" error={error} required />
      <Button type="submit">Send reset link</Button>
    </form>
  );
}
