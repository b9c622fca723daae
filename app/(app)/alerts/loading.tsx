export default function AlertsLoadingPage() {
  return (
    <section aria-busy="true">
      <h1 className="text-2xl font-bold">Alerts</h1>
      <p className="mt-4 text-ink-muted" role="status">Loading the alerts…</p>
      <div className="mt-4 flex flex-col gap-3" aria-hidden="true">
        {[0, 1, 2].map((i) => <div key={i} className="h-40 animate-pulse rounded-xl bg-dusk-900" />)}
      </div>
    </section>
  );
}
