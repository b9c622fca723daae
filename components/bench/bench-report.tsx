import type { BenchRunWire } from '@/lib/schemas/bench-runs';
import { formatFarads, formatMilliohms, formatRatioPercent, formatRatioTimes } from './bench-format';
import { CellFlags } from './cell-flags';

/** The report of one upload: the cell against its nominal rating. */
export function BenchReport({ run }: { run: BenchRunWire }) {
  return (
    <section className="rounded-xl border border-dusk-700 bg-dusk-900 p-4" aria-live="polite" data-testid="bench-report">
      <h2 className="font-bold">Cell {run.cell_label} <span className="font-normal text-ink-muted">in batch {run.batch_label}</span></h2>
      <dl className="mt-3 grid grid-cols-2 gap-x-4 gap-y-3 text-sm">
        <div>
          <dt className="text-xs text-ink-muted">Capacitance</dt>
          <dd className="figures text-lg" data-testid="report-capacitance">{formatFarads(run.capacitance_farads)}</dd>
          <dd className="text-xs text-ink-muted">{formatRatioPercent(run.capacitance_ratio)} of {formatFarads(run.nominal_farads)} rated</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-muted">ESR</dt>
          <dd className="figures text-lg" data-testid="report-esr">{formatMilliohms(run.esr_ohms)}</dd>
          <dd className="text-xs text-ink-muted">{formatRatioTimes(run.esr_ratio)} the {formatMilliohms(run.nominal_esr_ohms)} rated</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-muted">t1 at {(0.8 * run.rated_volts).toFixed(3)} V · t2 at {(0.4 * run.rated_volts).toFixed(3)} V</dt>
          <dd className="figures">{run.t1_seconds.toFixed(1)} s · {run.t2_seconds.toFixed(1)} s</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-muted">Verdict</dt>
          <dd><CellFlags run={run} /></dd>
        </div>
      </dl>
    </section>
  );
}
