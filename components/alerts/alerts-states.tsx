import type { AlertStatus } from '@/lib/alerts/kinds';

/** Loading, empty and error states of the alert list. */
export function AlertsLoading() {
  return (
    <div aria-busy="true" data-testid="alerts-loading">
      <p className="text-sm text-ink-muted" role="status">Loading alerts…</p>
      <div className="mt-3 flex flex-col gap-3" aria-hidden="true">
        {[0, 1].map((i) => <div key={i} className="h-40 animate-pulse rounded-xl bg-dusk-900" />)}
      </div>
    </div>
  );
}

const EMPTY: Record<AlertStatus, { title: string; line: string }> = {
  open: { title: 'No open alerts.', line: 'When a node is projected short, goes dark or silent, draws too much, stops charging or runs over-voltage, it shows up here.' },
  acknowledged: { title: 'Nothing acknowledged and still unresolved.', line: 'An acknowledged alert stays here until its condition clears.' },
  resolved: { title: 'No resolved alerts.', line: 'An alert resolves by itself after two passes with its condition clear.' },
};

export function AlertsEmpty({ status, filtered, clear }: { status: AlertStatus; filtered: boolean; clear: () => void }) {
  return (
    <div className="rounded-xl border border-dashed border-dusk-600 p-6 text-center" data-testid="alerts-empty">
      <p className="font-bold">{filtered ? 'No alert matches these filters.' : EMPTY[status].title}</p>
      <p className="mt-1 text-sm text-ink-muted">{filtered ? `Nothing ${status} for this site, kind, state or node.` : EMPTY[status].line}</p>
      {filtered ? <button type="button" className="mt-3 rounded-md border border-dusk-600 px-3 py-1.5 text-sm font-bold hover:bg-dusk-800" onClick={clear}>Clear the filters</button> : null}
    </div>
  );
}

export function AlertsError({ message, retry }: { message: string; retry: () => void }) {
  return (
    <div className="rounded-xl border border-hazard/60 p-6" role="alert" data-testid="alerts-error">
      <p className="font-bold text-hazard">The alerts could not be loaded.</p>
      <p className="mt-1 text-sm text-ink-muted">{message}</p>
      <button type="button" className="mt-3 rounded-md border border-dusk-600 px-3 py-1.5 text-sm font-bold hover:bg-dusk-800" onClick={retry}>Try again</button>
    </div>
  );
}
