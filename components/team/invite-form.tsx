'use client';

import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { apiFetch, fieldErrors } from '@/lib/client/api';

export function InviteForm() {
  const router = useRouter();
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [link, setLink] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setBusy(true);
    const res = await apiFetch<{ link: string }>('/api/v1/team/invitations', { method: 'POST', body: { email: form.get('email'), role: form.get('role') } });
    setBusy(false);
    if (!res.ok) {
      setErrors(fieldErrors(res.problem));
      setMessage(res.problem.errors ? null : res.problem.detail ?? res.problem.title);
      return;
    }
    setErrors({});
    setMessage('Invitation sent by e-mail. The link below works once, for 7 days.');
    setLink(res.data.link);
    router.refresh();
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-3 rounded-xl border border-dusk-700 bg-dusk-900 p-4" data-testid="invite-form" noValidate>
      <h2 className="font-bold">Invite someone</h2>
      <Field id="invite-email" name="email" type="email" label="E-mail" error={errors.email} required />
      <div className="flex flex-col gap-1.5">
        <label htmlFor="invite-role" className="text-sm font-bold">Role</label>
        <select id="invite-role" name="role" defaultValue="viewer" className="w-full min-w-0 rounded-md border border-dusk-600 bg-dusk-950 px-3 py-2">
          <option value="viewer">viewer — reads everything, changes nothing</option>
          <option value="deployer">deployer — sites, nodes, credentials, imports, bench</option>
          <option value="owner">owner — everything, members included</option>
        </select>
        {errors.role ? <p className="text-sm text-hazard">{errors.role}</p> : null}
      </div>
      {message ? <p className="text-sm text-ink-muted" role="status">{message}</p> : null}
      {link ? <code className="break-all rounded bg-dusk-950 p-2 text-xs" data-testid="invite-link">{link}</code> : null}
      <Button type="submit" disabled={busy}>{busy ? 'Sending…' : 'Send invitation'}</Button>
    </form>
  );
}
