import type { ReactNode } from 'react';

/** One figure of the node: a small label, the number with its unit, and a quiet line under it. */
export function FigureTile({ label, value, note, tone = 'ink', testId }: { label: string; value: ReactNode; note?: ReactNode; tone?: 'ink' | 'ember' | 'hazard' | 'tide'; testId?: string }) {
  const color = { ink: 'text-ink', ember: 'text-ember', hazard: 'text-hazard', tide: 'text-tide' }[tone];
  return (
    <div className="rounded-lg border border-dusk-800 bg-dusk-900/70 px-3 py-2.5" data-testid={testId}>
      <dt className="text-[11px] uppercase tracking-[0.14em] text-ink-faint">{label}</dt>
      <dd className={`figures mt-0.5 text-lg leading-tight ${color}`}>{value}</dd>
      {note ? <dd className="mt-0.5 text-xs text-ink-muted">{note}</dd> : null}
    </div>
  );
}
