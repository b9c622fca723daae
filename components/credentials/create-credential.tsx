'use client';

import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { apiFetch, fieldErrors } from '@/lib/client/api';
import { pointersFromZod } from '@/lib/errors';
import { createCredentialBody, CREDENTIAL_LABEL_MAX } from '@/lib/schemas/credential';
import { TokenOnce } from './token-once';

/** Creates a credential; the token lives only in this component's state, never in the page. */
export function CreateCredential({ nodeId }: { nodeId: number }) {
  const router = useRouter();
  const [made, setMade] = useState<{ token: string; label: string } | null>(null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = event.currentTarget;
    // The server's own schema first: a blank label is shown by the field and never sent.
    const local = createCredentialBody.safeParse({ label: String(new FormData(form).get('label') ?? '') });
    if (!local.success) {
      setErrors(fieldErrors({ title: '', status: 422, errors: pointersFromZod(local.error) }));
      setMessage(null);
      return;
    }
    setBusy(true);
    const res = await apiFetch<{ id: number; token: string; label: string }>(`/api/v1/nodes/${nodeId}/credentials`, { method: 'POST', body: local.data });
    setBusy(false);
    if (!res.ok) {
      setErrors(fieldErrors(res.problem));
      setMessage(res.problem.errors ? null : res.problem.detail ?? res.problem.title);
      return;
    }
    setErrors({});
    setMessage(null);
    setMade({ token: res.data.token, label: res.data.label });
    form.reset();
    router.refresh(); // the list gains its row; this state (the token) survives the refresh
  }

  return (
    <div className="flex flex-col gap-4">
      {made ? <TokenOnce token={made.token} label={made.label} onDone={() => setMade(null)} /> : null}
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3 rounded-xl border border-dusk-700 bg-dusk-900 p-4" data-testid="credential-form">
        <h2 className="font-bold">New credential</h2>
        <p className="text-sm text-ink-muted">Several live credentials let you rotate: create the new one, load it into the device, then revoke the old.</p>
        <Field id="credential-label" name="label" label="Label" hint="Required. Where it goes, e.g. logger board rev B" error={errors.label} autoComplete="off" required maxLength={CREDENTIAL_LABEL_MAX} />
        {message ? <p role="alert" className="text-sm text-hazard">{message}</p> : null}
        <div><Button type="submit" disabled={busy} data-testid="credential-create">{busy ? 'Creating…' : 'Create credential'}</Button></div>
      </form>
    </div>
  );
}
