'use client';

import { useRouter } from 'next/navigation';
import { ConfirmDanger } from '@/components/ui/confirm-danger';
import { useDangerAction } from '@/components/ui/use-danger-action';

/**
 * Retire (delete) a node with an inline confirmation: it leaves the fleet, its device
 * credentials are revoked at once and its name is freed for a replacement.
 */
export function RetireNode({ nodeId, name }: { nodeId: number; name: string }) {
  const router = useRouter();
  const { asking, setAsking, busy, error, setError, run } = useDangerAction(`/api/v1/nodes/${nodeId}`);
  const retire = () => run(() => { router.push('/fleet'); router.refresh(); });
  return (
    <div className="mt-8 max-w-2xl rounded-xl border border-dusk-700 p-4" data-testid="node-retire-panel">
      <h2 className="text-sm font-bold">Retire this node</h2>
      <p className="mt-1 text-sm text-ink-muted">
        For a node taken out of the field. It leaves the fleet and the alerts, and its device credentials stop working at once.
      </p>
      {asking ? (
        <div className="mt-3">
          <ConfirmDanger label={`Confirm retiring ${name}`} question={`Retire “${name}”? The device can no longer post readings, and this cannot be undone from the screens.`}
            confirm="Retire now" onConfirm={retire} onCancel={() => { setAsking(false); setError(null); }} busy={busy} testId="node-retire-confirm" />
        </div>
      ) : (
        <button type="button" onClick={() => setAsking(true)} className="mt-3 rounded-md border border-hazard px-3 py-1.5 text-sm text-hazard hover:bg-dusk-800" data-testid="node-retire">Retire node…</button>
      )}
      {error ? <p role="alert" className="mt-2 text-sm text-hazard" data-testid="node-retire-error">{error}</p> : null}
    </div>
  );
}
