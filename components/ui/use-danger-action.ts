'use client';

import { useState } from 'react';
import { apiFetch } from '@/lib/client/api';

/**
 * The state of a destructive action behind an inline confirmation (retire a node, revoke a
 * credential, cancel an invitation): asking, busy while the DELETE is out, and the server's
 * words if it refuses. `run` sends the DELETE and calls `after` only when it succeeded.
 */
export function useDangerAction(url: string) {
  const [asking, setAsking] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function run(after: () => void) {
    setBusy(true);
    const res = await apiFetch(url, { method: 'DELETE' });
    setBusy(false);
    if (!res.ok) return setError(res.problem.detail ?? res.problem.title);
    after();
  }
  return { asking, setAsking, busy, error, setError, run };
}
