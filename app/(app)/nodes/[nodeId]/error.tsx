'use client';

import Link from 'next/link';

/** Something failed while reading the node: say so plainly and offer another try. */
export default function NodeError({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div role="alert" className="max-w-lg rounded-lg border border-hazard/50 bg-dusk-900 p-5">
      <h1 className="text-lg font-bold">This node could not be shown</h1>
      <p className="mt-2 text-sm text-ink-muted">The server could not read it just now. Nothing was changed.</p>
      <div className="mt-4 flex gap-3">
        <button type="button" onClick={reset} className="rounded-md bg-ember px-4 py-2 text-sm font-bold text-dusk-950">Try again</button>
        <Link href="/fleet" className="rounded-md border border-dusk-600 px-4 py-2 text-sm">Back to tonight</Link>
      </div>
    </div>
  );
}
