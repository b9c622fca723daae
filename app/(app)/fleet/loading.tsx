export default function FleetLoading() {
  return (
    <section aria-busy="true">
      <h1 className="text-2xl font-bold">Who makes it through tonight?</h1>
      <p className="mt-4 text-ink-muted" role="status">Loading the fleet…</p>
      <div className="mt-4 grid grid-cols-3 gap-2 sm:grid-cols-6" aria-hidden="true">
        {Array.from({ length: 6 }, (_, i) => <div key={i} className="h-16 animate-pulse rounded-lg bg-dusk-900" />)}
      </div>
    </section>
  );
}
