'use client';

import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { ROLE_SUMMARY } from '@/lib/auth/role-words';
import { ROLES } from '@/lib/auth/roles';
import { apiFetch, fieldErrors } from '@/lib/client/api';

export function InviteForm() {
  const router = useRouter();
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const [sent, setSent] = useState<{ email: string; link: string } | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const formElement = event.currentTarget; // React clears currentTarget once the handler awaits
    const form = new FormData(formElement);
    setBusy(true);
    setProblem(null);
    const res = await apiFetch<{ link: string }>('/api/v1/team/invitations', { method: 'POST', body: { email: form.get('email'), role: form.get('role') } });
    setBusy(false);
    if (!res.ok) {
      setErrors(fieldErrors(res.problem));
      setProblem(res.problem.errors ? null : res.problem.detail ?? res.problem.title);
      return;
    }
    setErrors({});
    // Emptied so that a second click cannot send the same invitation again.
    formElement.reset();
    setSent({ email: String(form.get('email') ?? '').trim().toLowerCase(), link: res.data.link });
    router.refresh();
  }

  return (
    <form onSubmit={onSubmit} className="flex flex-col gap-3 rounded-xl border border-dusk-700 bg-dusk-900 p-4" data-testid="invite-form" noValidate>
      <h2 className="font-bold">Invite someone</h2>
      <Field id="invite-email" name="email" type="email" label="E-mail" error={errors.email} required />
      <div className="flex flex-col gap-1.5">
        <label htmlFor="invite-role" className="text-sm font-bold">Role</label>
        <select id="invite-role" name="role" defaultValue="viewer" aria-invalid={errors.role ? true : undefined} aria-describedby={errors.role ? 'invite-role-error' : undefined}
          className="w-full min-w-0 rounded-md border border-dusk-600 bg-dusk-950 px-3 py-2">
          {ROLES.map((r) => <option key={r} value={r}>{r} — {ROLE_SUMMARY[r]}</option>)}
        </select>
        {errors.role ? <p id="invite-role-error" className="text-sm text-hazard" role="alert">{errors.role}</p> : null}
      </div>
      {problem ? <p className="text-sm text-hazard" role="alert" data-testid="invite-error">{problem}</p> : null}
      {sent ? (
        <>
          <p className="break-words text-sm text-ink-muted" role="status">Invitation sent to {sent.email} by e-mail. The link below works once, for 7 days.</p>
          <code className="break-all rounded bg-dusk-950 p-2 text-xs" data-testid="invite-link">{sent.link}</code>
        </>
      ) : null}
      <Button type="submit" disabled={busy}>{busy ? 'Sending…' : 'Send invitation'}</Button>
    </form>
  );
}
