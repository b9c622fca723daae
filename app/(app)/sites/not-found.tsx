import Link from 'next/link';

/** A missing site and another organization's site look the same: not here. */
export default function SiteNotFound() {
  return (
    <div className="max-w-lg rounded-lg border border-dusk-700 bg-dusk-900 p-5" data-testid="site-not-found">
      <h1 className="text-lg font-bold">No such site</h1>
      <p className="mt-2 text-sm text-ink-muted">It does not exist in this organization, or it was deleted.</p>
      <Link href="/sites" className="mt-4 inline-block rounded-md border border-dusk-600 px-4 py-2 text-sm">Back to sites</Link>
    </div>
  );
}
