'use client';

import { useId, useState } from 'react';

/**
 * Readings as CSV for a chosen range: two dates in the site's calendar become a plain link to
 * the export route, which streams the file (the browser downloads it; nothing is held here).
 */
function localDay(ms: number, timeZone: string): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(new Date(ms));
}

/** Midnight of a calendar day in the site's zone, as Unix seconds (offset read from Intl at that day). */
function zoneMidnightSeconds(day: string, timeZone: string): number {
  const utcGuess = Date.parse(`${day}T00:00:00Z`);
  const parts = new Intl.DateTimeFormat('en-US', { timeZone, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit' }).formatToParts(new Date(utcGuess));
  const get = (type: string) => Number(parts.find((p) => p.type === type)?.value);
  const shownAsUtc = Date.UTC(get('year'), get('month') - 1, get('day'), get('hour'), get('minute'));
  return (utcGuess - (shownAsUtc - utcGuess)) / 1000;
}

export function ExportPanel({ nodeId, timeZone, nowMs }: { nodeId: number; timeZone: string; nowMs: number }) {
  const id = useId();
  const [from, setFrom] = useState(() => localDay(nowMs - 7 * 86_400_000, timeZone));
  const [to, setTo] = useState(() => localDay(nowMs, timeZone));
  const valid = /^\d{4}-\d{2}-\d{2}$/.test(from) && /^\d{4}-\d{2}-\d{2}$/.test(to) && from <= to;
  // "to" is inclusive for a person: the export runs to the end of that day.
  const href = valid ? `/api/v1/nodes/${nodeId}/export?from=${zoneMidnightSeconds(from, timeZone)}&to=${zoneMidnightSeconds(to, timeZone) + 86_400}` : undefined;
  return (
    <section aria-labelledby={`${id}-h`} className="rounded-lg border border-dusk-800 bg-dusk-900/60 p-4" data-testid="export-panel">
      <h2 id={`${id}-h`} className="text-base font-bold">Export readings</h2>
      <p className="mt-1 text-xs text-ink-muted">CSV, one line per reading: UTC time, reported and calibrated volts, panel volts, temperature, signal.</p>
      <div className="mt-3 grid gap-2 sm:grid-cols-2 lg:grid-cols-1">
        <label className="text-xs text-ink-muted" htmlFor={`${id}-from`}>From (site day)
          <input id={`${id}-from`} type="date" value={from} max={to} onChange={(e) => setFrom(e.target.value)} className="figures mt-1 block w-full rounded-md border border-dusk-600 bg-dusk-950 px-2 py-1.5 text-sm text-ink" />
        </label>
        <label className="text-xs text-ink-muted" htmlFor={`${id}-to`}>To, inclusive
          <input id={`${id}-to`} type="date" value={to} min={from} onChange={(e) => setTo(e.target.value)} className="figures mt-1 block w-full rounded-md border border-dusk-600 bg-dusk-950 px-2 py-1.5 text-sm text-ink" />
        </label>
      </div>
      {valid ? (
        <a href={href} download className="mt-3 inline-block rounded-md bg-ember px-4 py-2 text-sm font-bold text-dusk-950 hover:opacity-90" data-testid="export-link">Download CSV</a>
      ) : (
        <p role="alert" className="mt-3 text-sm text-hazard">Choose a start day on or before the end day.</p>
      )}
    </section>
  );
}
