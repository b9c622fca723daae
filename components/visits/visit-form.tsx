'use client';

import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { fieldErrors, type Problem } from '@/lib/client/api';

/** Adds a visit: date, what was done, an optional photo (JPEG or PNG, up to 5 MB). */
export function VisitForm({ nodeId, today }: { nodeId: number; today: string }) {
  const router = useRouter();
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ text: string; bad: boolean } | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = event.currentTarget;
    const data = new FormData(form);
    const photo = data.get('photo');
    if (photo instanceof File && photo.size === 0) data.delete('photo');
    setBusy(true);
    try {
      const res = await fetch(`/api/v1/nodes/${nodeId}/visits`, { method: 'POST', body: data, credentials: 'same-origin' });
      if (res.ok) {
        setErrors({});
        setMessage({ text: 'Visit recorded.', bad: false });
        form.reset();
        router.refresh();
      } else {
        const problem = ((await res.json().catch(() => null)) ?? { title: res.statusText, status: res.status }) as Problem;
        setErrors(fieldErrors(problem));
        setMessage(problem.errors ? null : { text: problem.detail ?? problem.title, bad: true });
      }
    } catch {
      setMessage({ text: 'The server could not be reached. Check the connection and try again.', bad: true });
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3 rounded-xl border border-dusk-700 bg-dusk-900 p-4" data-testid="visit-form">
      <h2 className="font-bold">Record a visit</h2>
      <Field id="visit-date" name="visited_on" type="date" label="Date" defaultValue={today} max={today} error={errors.visited_on} />
      <div className="flex flex-col gap-1.5">
        <label htmlFor="visit-work" className="text-sm font-bold">Work done</label>
        <textarea id="visit-work" name="work_done" rows={4} aria-invalid={errors.work_done ? true : undefined} aria-describedby={errors.work_done ? 'visit-work-error' : undefined}
          className="rounded-md border border-dusk-600 bg-dusk-950 px-3 py-2 text-ink focus:border-tide focus:outline-none" />
        {errors.work_done ? <p id="visit-work-error" role="alert" className="text-sm text-hazard">{errors.work_done}</p> : null}
      </div>
      <div className="flex flex-col gap-1.5">
        <label htmlFor="visit-photo" className="text-sm font-bold">Photo (optional)</label>
        <input id="visit-photo" name="photo" type="file" accept="image/jpeg,image/png" aria-describedby="visit-photo-hint"
          className="text-sm file:mr-3 file:rounded-md file:border file:border-dusk-600 file:bg-dusk-800 file:px-3 file:py-1.5 file:text-ink" />
        <p id="visit-photo-hint" className="text-xs text-ink-faint">JPEG or PNG, up to 5 MB.</p>
        {errors.photo ? <p role="alert" className="text-sm text-hazard" data-testid="visit-photo-error">{errors.photo}</p> : null}
      </div>
      {message ? <p role={message.bad ? 'alert' : 'status'} className={`text-sm ${message.bad ? 'text-hazard' : 'text-tide'}`}>{message.text}</p> : null}
      <div><Button type="submit" disabled={busy} data-testid="visit-submit">{busy ? 'Saving…' : 'Save visit'}</Button></div>
    </form>
  );
}
