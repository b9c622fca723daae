'use client';

import { useRef, type KeyboardEvent } from 'react';
import { ALERT_STATUSES, type AlertStatus } from '@/lib/alerts/kinds';
import { STATUS_LABELS } from '@/lib/alerts/labels';
import { StatusMark } from './status-mark';

/** Open / acknowledged / resolved as tabs: arrow keys, Home and End move between them (WAI-ARIA tabs pattern). */
export function StatusTabs({ value, onChange, panelId }: { value: AlertStatus; onChange: (s: AlertStatus) => void; panelId: string }) {
  const refs = useRef<(HTMLButtonElement | null)[]>([]);

  function onKeyDown(event: KeyboardEvent<HTMLButtonElement>, index: number) {
    const last = ALERT_STATUSES.length - 1;
    const next = { ArrowRight: index === last ? 0 : index + 1, ArrowLeft: index === 0 ? last : index - 1, Home: 0, End: last }[event.key];
    if (next === undefined) return;
    event.preventDefault();
    refs.current[next]?.focus();
    onChange(ALERT_STATUSES[next]);
  }

  return (
    <div role="tablist" aria-label="Alert status" className="mt-5 flex gap-0.5 overflow-x-auto border-b border-dusk-700 sm:gap-1">
      {ALERT_STATUSES.map((s, i) => {
        const selected = s === value;
        return (
          <button
            key={s}
            ref={(el) => { refs.current[i] = el; }}
            type="button"
            role="tab"
            id={`alerts-tab-${s}`}
            aria-selected={selected}
            aria-controls={panelId}
            tabIndex={selected ? 0 : -1}
            title={STATUS_LABELS[s].line}
            onClick={() => onChange(s)}
            onKeyDown={(e) => onKeyDown(e, i)}
            className={`-mb-px shrink-0 rounded-t-md border-b-2 px-2 py-2.5 sm:px-3 ${selected ? 'border-ember bg-dusk-900' : 'border-transparent opacity-70 hover:bg-dusk-900 hover:opacity-100'}`}
            data-testid={`alerts-tab-${s}`}
          >
            <StatusMark status={s} />
          </button>
        );
      })}
    </div>
  );
}
