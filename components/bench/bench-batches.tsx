import type { BenchBatchWire } from '@/lib/schemas/bench-runs';
import { formatInTimeZone, TIME_PATTERNS } from '@/lib/format/time';
import { formatFarads, formatMilliohms, formatRatioPercent, formatRatioTimes } from './bench-format';
import { CellFlags } from './cell-flags';

/** One table per batch: each cell against its nominal rating, weak cells flagged in words. */
export function BenchBatches({ batches }: { batches: BenchBatchWire[] }) {
  if (batches.length === 0) {
    return <p className="rounded-xl border border-dashed border-dusk-600 p-6 text-center text-sm text-ink-muted" data-testid="bench-empty">No cells measured yet.</p>;
  }
  return (
    <div className="flex flex-col gap-6" data-testid="bench-batches">
      {batches.map((batch) => (
        <section key={batch.batch_label} className="rounded-xl border border-dusk-700 bg-dusk-900 p-4" data-testid="bench-batch">
          <h3 className="font-bold">Batch {batch.batch_label}</h3>
          <p className="text-sm text-ink-muted">
            {batch.cells.length} cell{batch.cells.length === 1 ? '' : 's'}, <span className={batch.flagged ? 'font-bold text-hazard' : ''}>{batch.flagged} flagged</span>;
            mean capacitance {formatRatioPercent(batch.mean_capacitance_ratio)} of rated, mean ESR {formatRatioTimes(batch.mean_esr_ratio)} rated.
          </p>
          <ul className="mt-3 flex flex-col gap-2 md:hidden" aria-label={`Cells of batch ${batch.batch_label}`}>
            {batch.cells.map((c) => <CellCard key={c.id} cell={c} />)}
          </ul>
          <div className="mt-3 hidden overflow-x-auto md:block">
            <table className="w-full min-w-[640px] text-left text-sm">
              <thead className="text-xs text-ink-muted">
                <tr>
                  <th scope="col" className="py-2 pr-3">Cell</th>
                  <th scope="col" className="py-2 pr-3 text-right">Capacitance<span className="block font-normal">measured / rated</span></th>
                  <th scope="col" className="py-2 pr-3 text-right">ESR<span className="block font-normal">measured / rated</span></th>
                  <th scope="col" className="py-2 pr-3">Flags</th>
                  <th scope="col" className="py-2">Measured<span className="block font-normal">when (UTC), by whom</span></th>
                </tr>
              </thead>
              <tbody>
                {batch.cells.map((c) => (
                  <tr key={c.id} className="border-t border-dusk-800 align-top" data-testid="bench-cell" data-flagged={c.low_capacitance || c.high_esr ? 'yes' : 'no'}>
                    <td className="py-2 pr-3 font-bold">{c.cell_label}</td>
                    <td className="figures py-2 pr-3 text-right">
                      {formatFarads(c.capacitance_farads)} <span className="text-ink-muted">/ {formatFarads(c.nominal_farads)}</span>
                      <span className={`block text-xs ${c.low_capacitance ? 'font-bold text-hazard' : 'text-ink-muted'}`}>{formatRatioPercent(c.capacitance_ratio)}</span>
                    </td>
                    <td className="figures py-2 pr-3 text-right">
                      {formatMilliohms(c.esr_ohms)} <span className="text-ink-muted">/ {formatMilliohms(c.nominal_esr_ohms)}</span>
                      <span className={`block text-xs ${c.high_esr ? 'font-bold text-hazard' : 'text-ink-muted'}`}>{formatRatioTimes(c.esr_ratio)}</span>
                    </td>
                    <td className="py-2 pr-3"><CellFlags run={c} /></td>
                    <td className="py-2 text-xs text-ink-muted">
                      <span className="figures" suppressHydrationWarning>{formatInTimeZone(new Date(c.created_at), 'UTC', TIME_PATTERNS.record)}</span>
                      {c.uploaded_by ? <span className="block">{c.uploaded_by}</span> : null}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </section>
      ))}
    </div>
  );
}

/** Phone: one small card per cell instead of the table. */
function CellCard({ cell: c }: { cell: BenchBatchWire['cells'][number] }) {
  return (
    <li className="rounded-lg border border-dusk-700 p-3 text-sm" data-testid="bench-cell-card" data-flagged={c.low_capacitance || c.high_esr ? 'yes' : 'no'}>
      <div className="flex items-start justify-between gap-2">
        <span className="font-bold">{c.cell_label}</span>
        <CellFlags run={c} />
      </div>
      <dl className="mt-2 grid grid-cols-2 gap-2">
        <div>
          <dt className="text-xs text-ink-muted">Capacitance / rated</dt>
          <dd className="figures">{formatFarads(c.capacitance_farads)} / {formatFarads(c.nominal_farads)}</dd>
          <dd className={`text-xs ${c.low_capacitance ? 'font-bold text-hazard' : 'text-ink-muted'}`}>{formatRatioPercent(c.capacitance_ratio)}</dd>
        </div>
        <div>
          <dt className="text-xs text-ink-muted">ESR / rated</dt>
          <dd className="figures">{formatMilliohms(c.esr_ohms)} / {formatMilliohms(c.nominal_esr_ohms)}</dd>
          <dd className={`text-xs ${c.high_esr ? 'font-bold text-hazard' : 'text-ink-muted'}`}>{formatRatioTimes(c.esr_ratio)}</dd>
        </div>
      </dl>
    </li>
  );
}
