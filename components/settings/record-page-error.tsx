'use client';

/** The error state of a record page: plain words, and a way to try again. */
export function RecordPageError({ reset }: { error: Error; reset: () => void }) {
  return (
    <div role="alert" className="max-w-xl rounded-xl border border-hazard bg-dusk-900 p-4">
      <p className="font-bold text-hazard">This page could not be loaded.</p>
      <p className="mt-1 text-sm text-ink-muted">Nothing was changed. The server may be restarting; try again in a moment.</p>
      <button type="button" onClick={reset} className="mt-3 rounded-md border border-dusk-600 px-4 py-2 text-sm font-bold hover:bg-dusk-800">Try again</button>
    </div>
  );
}
