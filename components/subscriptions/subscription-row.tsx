'use client';

import { ALERT_KINDS } from '@/lib/alerts/kinds';
import { DELIVERY_LABELS, KIND_LABELS } from '@/lib/alerts/labels';
import { toggleKind, type Delivery, type FormRow } from './subscription-model';

/** One row of the form: a site (or every site), the kinds that reach me from it, and how. */
export function SubscriptionRowEditor({ row, index, siteName, onChange, onRemove, errors }: {
  row: FormRow;
  index: number;
  siteName: string;
  onChange: (row: FormRow) => void;
  onRemove?: () => void;
  errors: Record<string, string>;
}) {
  const id = `sub-${row.siteId ?? 'all'}`;
  const error = (field: string) => errors[`subscriptions.${index}.${field}`];
  return (
    <fieldset className="rounded-xl border border-dusk-700 bg-dusk-900 p-4" data-testid={`subscription-${row.siteId ?? 'all'}`}>
      <legend className="px-1 font-bold">{siteName}</legend>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <p className="text-xs text-ink-muted">
          {row.siteId === null ? 'For every site without a row of its own.' : 'Takes the place of the every-site choice for this site.'}
          {row.kinds.length === 0 ? ' Nothing selected: no alert e-mail from here.' : ''}
        </p>
        {onRemove ? (
          <button type="button" onClick={onRemove} className="rounded-md border border-dusk-600 px-2 py-1 text-xs hover:bg-dusk-800" aria-label={`Remove the row for ${siteName}`}>Remove</button>
        ) : null}
      </div>
      {error('site_id') ? <p className="mt-1 text-sm text-hazard" role="alert">{error('site_id')}</p> : null}

      <fieldset className="mt-3">
        <legend className="text-xs font-bold text-ink-muted">Kinds of alert</legend>
        <div className="mt-1 grid gap-x-4 gap-y-1 sm:grid-cols-2">
          {ALERT_KINDS.map((k) => (
            <label key={k} htmlFor={`${id}-${k}`} className="flex cursor-pointer items-start gap-2 rounded-md px-1 py-1 hover:bg-dusk-800">
              <input id={`${id}-${k}`} type="checkbox" className="mt-1 h-4 w-4 shrink-0 accent-ember" checked={row.kinds.includes(k)}
                onChange={(e) => onChange(toggleKind(row, k, e.target.checked))} data-kind={k} />
              <span className="text-sm">
                {KIND_LABELS[k].label}
                <span className="block text-xs text-ink-faint">{KIND_LABELS[k].line}</span>
              </span>
            </label>
          ))}
        </div>
        {error('kinds') ? <p className="mt-1 text-sm text-hazard" role="alert">{error('kinds')}</p> : null}
      </fieldset>

      <fieldset className="mt-3">
        <legend className="text-xs font-bold text-ink-muted">Delivery</legend>
        <div className="mt-1 flex flex-wrap gap-x-6 gap-y-1">
          {(['immediate', 'digest'] as Delivery[]).map((d) => (
            <label key={d} htmlFor={`${id}-${d}`} className="flex cursor-pointer items-start gap-2 py-1">
              <input id={`${id}-${d}`} type="radio" name={`${id}-delivery`} value={d} className="mt-1 h-4 w-4 accent-ember" checked={row.delivery === d}
                onChange={() => onChange({ ...row, delivery: d })} />
              <span className="text-sm">{DELIVERY_LABELS[d].label}<span className="block text-xs text-ink-faint">{DELIVERY_LABELS[d].line}</span></span>
            </label>
          ))}
        </div>
        {error('delivery') ? <p className="mt-1 text-sm text-hazard" role="alert">{error('delivery')}</p> : null}
      </fieldset>
    </fieldset>
  );
}
