import type { BenchRunWire } from '@/lib/schemas/bench-runs';

/** Weak-cell flags in words (never colour alone). */
export function CellFlags({ run }: { run: Pick<BenchRunWire, 'low_capacitance' | 'high_esr'> }) {
  if (!run.low_capacitance && !run.high_esr) return <span className="text-sm text-ink-muted" data-testid="cell-ok">within rating</span>;
  return (
    <span className="flex flex-wrap gap-1" data-testid="cell-flagged">
      {run.low_capacitance ? <Flag>low capacitance</Flag> : null}
      {run.high_esr ? <Flag>high ESR</Flag> : null}
    </span>
  );
}

function Flag({ children }: { children: string }) {
  return <span className="rounded border border-hazard px-1.5 py-0.5 text-xs font-bold text-hazard">⚠ {children}</span>;
}
