import { formatAmps, formatJoules, formatVolts, formatWattHours, formatWatts } from '@/lib/format/units';
import type { BankFigures, LoadFigures } from './compute-node';

/** A small read-out of computed figures, announced politely as they change. */
function Figure({ label, value, testId }: { label: string; value: string; testId: string }) {
  return (
    <div className="flex items-baseline justify-between gap-3 border-t border-dusk-700 py-1.5 first:border-t-0">
      <dt className="min-w-0 text-sm text-ink-muted">{label}</dt>
      <dd className="figures whitespace-nowrap text-right text-ink" data-testid={testId}>{value}</dd>
    </div>
  );
}

export function BankFiguresPanel({ figures, notes = [], heading = 'Computed as you type' }: { figures: BankFigures | null; notes?: string[]; heading?: string }) {
  return (
    <section aria-label="Bank, computed" aria-live="polite" className="rounded-lg border border-ember/40 bg-dusk-950 p-3" data-testid="bank-figures">
      <h3 className="text-xs font-bold uppercase tracking-wider text-ember">{heading}</h3>
      {figures ? (
        <dl className="mt-2">
          <Figure label="Bank capacitance" value={`${formatFarads(figures.farads)}`} testId="computed-farads" />
          <Figure label="Bank maximum" value={formatVolts(figures.maxVolts, 2)} testId="computed-max-volts" />
          <Figure label="Bank ESR" value={formatOhms(figures.esrOhms)} testId="computed-esr" />
          <Figure label="Energy at full" value={`${formatJoules(figures.fullJoules)} · ${formatWattHours(figures.fullJoules)}`} testId="computed-energy" />
          <Figure label="Bank leakage" value={formatAmps(figures.leakageAmps)} testId="computed-leakage" />
        </dl>
      ) : <p className="mt-2 text-sm text-ink-muted">Complete the bank inputs to see its figures.</p>}
      <SpecNotes notes={notes} testId="bank-notes" />
    </section>
  );
}

export function LoadFiguresPanel({ figures, notes = [], heading = 'Computed as you type' }: { figures: LoadFigures | null; notes?: string[]; heading?: string }) {
  return (
    <section aria-label="Load, computed" aria-live="polite" className="rounded-lg border border-ember/40 bg-dusk-950 p-3" data-testid="load-figures">
      <h3 className="text-xs font-bold uppercase tracking-wider text-ember">{heading}</h3>
      {figures ? (
        <dl className="mt-2">
          <Figure label="Burst floor" value={figures.burstReachable ? formatVolts(figures.burstFloorVolts) : 'not reachable'} testId="computed-burst-floor" />
          <Figure label="Usable at full (above cutoff)" value={`${formatJoules(figures.usableAtFullJoules)} · ${formatWattHours(figures.usableAtFullJoules)}`} testId="computed-usable" />
          <Figure label="Reserve at full (above burst floor)" value={`${formatJoules(figures.reserveAtFullJoules)} · ${formatWattHours(figures.reserveAtFullJoules)}`} testId="computed-reserve" />
          <Figure label="Average load (output side)" value={formatWatts(figures.averageOutputWatts)} testId="computed-load-watts" />
        </dl>
      ) : <p className="mt-2 text-sm text-ink-muted">The burst floor and reserve appear once the bank, converter and load inputs are valid.</p>}
      {figures && !figures.burstReachable ? (
        <p className="mt-2 text-sm text-hazard" role="status">Even a full bank cannot finish one burst: the terminal voltage falls below the cutoff or the input current exceeds the limit.</p>
      ) : null}
      <SpecNotes notes={notes} testId="converter-notes" />
    </section>
  );
}

/** Values the server accepts but worth a second look, under the figures they concern. */
export function SpecNotes({ notes, testId }: { notes: string[]; testId: string }) {
  if (!notes.length) return null;
  return (
    <ul className="mt-2 space-y-1 border-t border-dusk-700 pt-2 text-sm text-hazard" data-testid={testId}>
      {notes.map((n) => <li key={n}>{n}</li>)}
    </ul>
  );
}

function formatFarads(f: number): string {
  return f >= 1 ? `${f.toFixed(f >= 100 ? 0 : 2)} F` : `${(f * 1000).toFixed(1)} mF`;
}

function formatOhms(ohms: number): string {
  return ohms >= 1 ? `${ohms.toFixed(2)} Ω` : `${(ohms * 1000).toFixed(1)} mΩ`;
}
