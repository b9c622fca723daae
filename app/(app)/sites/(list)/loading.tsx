export default function Loading() {
  return <p className="animate-pulse text-ink-muted" role="status">Loading…</p>;
}
