'use client';

import Link from 'next/link';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { apiFetch } from '@/lib/client/api';

/** An invitation for an account that exists already: one click adds the membership; the password stays as it is. */
export function JoinExistingForm({ token, orgName }: { token: string; orgName: string }) {
  const [message, setMessage] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const [busy, setBusy] = useState(false);

  async function join() {
    setBusy(true);
    const res = await apiFetch('/api/v1/invitations/accept', { method: 'POST', body: { token } });
    setBusy(false);
    if (!res.ok) {
      setMessage(res.problem.detail ?? res.problem.title);
      return;
    }
    setDone(true);
  }

  if (done) {
    return (
      <p className="mt-4 text-ink-muted" role="status" data-testid="joined">
        You are now a member of {orgName}. <Link href="/sign-in" className="font-bold text-ink underline underline-offset-4">Sign in</Link> with
        your usual password and choose {orgName} from the organization list at the top of the page.
      </p>
    );
  }
  return (
    <div className="mt-6 flex flex-col gap-4">
      {message ? <p className="text-sm text-hazard" role="alert">{message}</p> : null}
      <Button type="button" onClick={() => void join()} disabled={busy} data-testid="join-existing">{busy ? 'Joining…' : `Join ${orgName}`}</Button>
    </div>
  );
}
