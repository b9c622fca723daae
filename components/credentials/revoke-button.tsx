'use client';

import { useRouter } from 'next/navigation';
import { useDangerAction } from '@/components/ui/use-danger-action';

/** Revoke with an inline confirmation (keyboard-reachable, unlike a browser dialog in a test). */
export function RevokeButton({ nodeId, credentialId, label }: { nodeId: number; credentialId: number; label: string }) {
  const router = useRouter();
  const { asking, setAsking, busy, error, run } = useDangerAction(`/api/v1/nodes/${nodeId}/credentials/${credentialId}`);
  const revoke = () => run(() => { setAsking(false); router.refresh(); });

  if (!asking) {
    return <button type="button" onClick={() => setAsking(true)} className="mt-2 rounded-md border border-hazard px-3 py-1.5 text-sm text-hazard hover:bg-dusk-800" data-testid="credential-revoke">Revoke…</button>;
  }
  return (
    <div role="group" aria-label={`Confirm revoking ${label || `credential ${credentialId}`}`} className="mt-2 rounded-md border border-hazard p-2 text-sm">
      <p>Revoke this credential? A device using it is refused from its next post. This cannot be undone.</p>
      <div className="mt-2 flex gap-2">
        <button type="button" onClick={revoke} disabled={busy} className="rounded-md bg-hazard px-3 py-1.5 font-bold text-dusk-950 disabled:opacity-60" data-testid="credential-revoke-confirm" autoFocus>{busy ? 'Revoking…' : 'Revoke now'}</button>
        <button type="button" onClick={() => setAsking(false)} className="rounded-md border border-dusk-600 px-3 py-1.5 hover:bg-dusk-800">Keep it</button>
      </div>
      {error ? <p role="alert" className="mt-1 text-hazard">{error}</p> : null}
    </div>
  );
}
