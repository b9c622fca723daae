'use client';

/** A page that failed to load: say so plainly, change nothing, offer a retry. */
export function RouteError({ title, what, reset }: { title: string; what: string; reset: () => void }) {
  return (
    <section role="alert">
      <h1 className="text-2xl font-bold">{title}</h1>
      <p className="mt-4 text-hazard">{what} could not be loaded. Nothing was changed.</p>
      <button type="button" onClick={reset} className="mt-3 rounded-md border border-dusk-600 px-4 py-2 text-sm font-bold hover:bg-dusk-800">Try again</button>
    </section>
  );
}
