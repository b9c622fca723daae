import { ALERT_KINDS, type AlertKind } from '@/lib/alerts/kinds';

/**
 * The subscription form's rows: always one for every site (site null), then optional rows for
 * single sites, each of which takes the place of the every-site row for its site (the rule of
 * lib/alerts/recipients.ts). Pure, so the page and the form agree on it.
 */
export type Delivery = 'immediate' | 'digest';

export interface SubscriptionWire {
  site_id: number | null;
  kinds: AlertKind[];
  delivery: Delivery;
}

/** GET and PUT /api/v1/subscriptions answer this; `defaults` is what applies while there are no rows. */
export interface SubscriptionsView {
  subscriptions: SubscriptionWire[];
  defaults: SubscriptionWire[];
}

export interface FormRow {
  siteId: number | null;
  kinds: AlertKind[];
  delivery: Delivery;
}

export function rowsFromView(view: SubscriptionsView): { rows: FormRow[]; usingDefault: boolean } {
  const usingDefault = view.subscriptions.length === 0 && view.defaults.length > 0;
  const every = view.subscriptions.find((s) => s.site_id === null)
    ?? (view.subscriptions.length === 0 ? view.defaults.find((s) => s.site_id === null) : undefined);
  const rows: FormRow[] = [
    { siteId: null, kinds: every ? [...every.kinds] : [], delivery: every?.delivery ?? 'immediate' },
    ...view.subscriptions.filter((s) => s.site_id !== null).map((s) => ({ siteId: s.site_id, kinds: [...s.kinds], delivery: s.delivery })),
  ];
  return { rows, usingDefault };
}

/** The PUT body: every row, kinds in their canonical order. */
export function bodyFromRows(rows: FormRow[]): { subscriptions: SubscriptionWire[] } {
  return { subscriptions: rows.map((r) => ({ site_id: r.siteId, kinds: ALERT_KINDS.filter((k) => r.kinds.includes(k)), delivery: r.delivery })) };
}

export function toggleKind(row: FormRow, kind: AlertKind, on: boolean): FormRow {
  return { ...row, kinds: on ? [...new Set([...row.kinds, kind])] : row.kinds.filter((k) => k !== kind) };
}
