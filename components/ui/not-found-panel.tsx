import Link from 'next/link';

/** A missing record and another organization's record look the same: not here. */
export function NotFoundPanel({ what, back, testId }: { what: string; back: { href: string; label: string }; testId: string }) {
  return (
    <div className="max-w-lg rounded-lg border border-dusk-700 bg-dusk-900 p-5" data-testid={testId}>
      <h1 className="text-lg font-bold">No such {what}</h1>
      <p className="mt-2 text-sm text-ink-muted">It does not exist in this organization, or it was deleted.</p>
      <Link href={back.href} className="mt-4 inline-block rounded-md border border-dusk-600 px-4 py-2 text-sm">{back.label}</Link>
    </div>
  );
}
