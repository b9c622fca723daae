'use client';

import { useState } from 'react';
import { kindLabel } from '@/lib/alerts/labels';
import type { AlertWire } from './alert-wire';
import { AcknowledgeError, useAcknowledge } from './use-alerts';

/**
 * Shown to deployers and owners only (the server refuses viewers anyway). Acknowledging stops
 * reminders; the list refreshes, so the alert moves from "open" to "acknowledged".
 */
export function AcknowledgeButton({ alert, onDone }: { alert: AlertWire; onDone: (message: string) => void }) {
  const ack = useAcknowledge();
  const [error, setError] = useState<string | null>(null);
  const what = `${kindLabel(alert.kind)} on ${alert.node_name}`;

  function onClick() {
    setError(null);
    ack.mutate(alert, {
      onSuccess: () => onDone(`Acknowledged: ${what}. It is listed under “acknowledged” now; reminders stop.`),
      onError: (e) => {
        // 409: it resolved by itself in the meantime; the refreshed list shows it resolved.
        if (e instanceof AcknowledgeError && e.problem.status === 409) onDone(`${what} had already resolved; nothing to acknowledge.`);
        else setError(e.message);
      },
    });
  }

  return (
    <div className="flex flex-col items-end gap-1">
      <button
        type="button"
        onClick={onClick}
        disabled={ack.isPending}
        aria-label={`Acknowledge ${what}`}
        className="rounded-md border border-ember px-3 py-1.5 text-sm font-bold text-ember hover:bg-dusk-800 disabled:cursor-wait disabled:opacity-60"
        data-testid="acknowledge"
      >
        {ack.isPending ? 'Acknowledging…' : 'Acknowledge'}
      </button>
      {error ? <p className="max-w-56 text-right text-xs text-hazard" role="alert">{error}</p> : null}
    </div>
  );
}
