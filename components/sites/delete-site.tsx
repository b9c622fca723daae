'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { ConfirmDanger } from '@/components/ui/confirm-danger';
import { apiFetch } from '@/lib/client/api';

/** Delete with an inline confirmation; the server refuses (409) while nodes stand on the site. */
export function DeleteSite({ siteId, name }: { siteId: number; name: string }) {
  const router = useRouter();
  const [asking, setAsking] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function remove() {
    const res = await apiFetch(`/api/v1/sites/${siteId}`, { method: 'DELETE' });
    if (!res.ok) return setError(res.problem.detail ?? res.problem.title);
    router.push('/sites');
    router.refresh();
  }
  return (
    <div className="max-w-2xl rounded-xl border border-dusk-700 p-4">
      {asking ? (
        <ConfirmDanger label={`Confirm deleting ${name}`} question={`Delete the site “${name}”? This cannot be undone.`} confirm="Delete now"
          onConfirm={remove} onCancel={() => { setAsking(false); setError(null); }} testId="site-delete-confirm" />
      ) : (
        <button type="button" onClick={() => setAsking(true)} className="rounded-md border border-hazard px-3 py-1.5 text-sm text-hazard hover:bg-dusk-800" data-testid="site-delete">Delete site…</button>
      )}
      {error ? <p role="alert" className="mt-2 text-sm text-hazard" data-testid="site-delete-error">{error}</p> : null}
    </div>
  );
}
