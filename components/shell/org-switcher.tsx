'use client';

import { useState } from 'react';
// The guard's own type (a type import: nothing of the server-only module reaches the browser).
import type { OrgChoice } from '@/lib/auth/guard';
import { apiFetch } from '@/lib/client/api';

export type { OrgChoice };

/**
 * The organization the app is showing. With one membership it is just the name; with several,
 * a list to change it. A change opens that organization's fleet as a fresh page load, so no
 * screen or cached answer of the other organization stays on view.
 */
export function OrgSwitcher({ current, organizations }: { current: OrgChoice; organizations: OrgChoice[] }) {
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  if (organizations.length < 2) return <p className="font-bold" data-testid="org-name">{current.name}</p>;

  async function choose(id: number) {
    if (id === current.id) return;
    setBusy(true);
    setError(null);
    const res = await apiFetch('/api/v1/org/current', { method: 'PUT', body: { org_id: id } });
    if (!res.ok) {
      setBusy(false);
      setError(res.problem.detail ?? res.problem.title);
      return;
    }
    window.location.assign('/fleet');
  }

  return (
    <div>
      <label htmlFor="org-switch" className="sr-only">Organization shown</label>
      <select
        id="org-switch"
        data-testid="org-switch"
        value={current.id}
        disabled={busy}
        onChange={(e) => void choose(Number(e.target.value))}
        className="-ml-1 rounded-md border border-dusk-700 bg-dusk-900 px-1 py-0.5 font-bold text-ink"
      >
        {organizations.map((o) => (
          <option key={o.id} value={o.id}>{o.name} ({o.role})</option>
        ))}
      </select>
      {error ? <p role="alert" className="text-xs text-hazard">{error}</p> : null}
    </div>
  );
}
