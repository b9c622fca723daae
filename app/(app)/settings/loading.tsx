export default function Loading() {
  return (
    <section aria-busy="true">
      <h1 className="text-2xl font-bold">Organization settings</h1>
      <p className="mt-4 text-ink-muted" role="status">Loading…</p>
    </section>
  );
}
