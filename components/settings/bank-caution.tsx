import { formatAmps } from '@/lib/format/units';

/**
 * DESIGN.md §3 cautions, where a person can be hurt. The figure is V_max / ESR_bank; the
 * advice is common practice for charged capacitor banks and defers to codes and ratings.
 */
export function BankCaution({ shortCircuitAmps }: { shortCircuitAmps: number | null }) {
  const amps = shortCircuitAmps == null ? null : Number.isFinite(shortCircuitAmps) ? formatAmps(shortCircuitAmps) : 'unlimited (ESR 0 Ω)';
  return (
    <aside role="note" aria-label="Caution: stored energy" className="rounded-lg border-2 border-hazard bg-dusk-950 p-3 text-sm" data-testid="bank-caution">
      <p className="flex items-center gap-2 font-bold text-hazard">
        <svg width="18" height="18" viewBox="0 0 18 18" aria-hidden="true"><path d="M9 1.5 L17 16 H1 Z" fill="none" stroke="currentColor" strokeWidth="1.6" /><path d="M9 6.5 V11 M9 12.8 V13.6" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" /></svg>
        Caution: short-circuit current at full charge
      </p>
      <p className="figures mt-1 text-xl text-ink" data-testid="computed-short-circuit">{amps ?? '—'}</p>
      <ul className="mt-2 list-disc space-y-1 pl-5 text-ink-muted">
        <li>A charged bank can push hundreds of amps into a short: insulate the terminals, fuse the output, and discharge the bank before working on it.</li>
        <li>Never charge a cell above its rated voltage; series strings need balancing so no cell is pushed past it.</li>
        <li>A charger that draws more than a computer port can supply needs its own supply, not a laptop&apos;s port.</li>
        <li>Outdoor mains chargers and enclosures follow your local electrical codes and licensed practice; the cell maker&apos;s ratings come first.</li>
      </ul>
    </aside>
  );
}
