'use client';

import type { ChartRange } from './use-node-data';

/** Range presets from a day to a year; the pressed one is marked for screen readers too. */
export const RANGE_PRESETS = [
  { key: '1d', label: '1 d', seconds: 86_400 },
  { key: '3d', label: '3 d', seconds: 3 * 86_400 },
  { key: '7d', label: '7 d', seconds: 7 * 86_400 },
  { key: '30d', label: '30 d', seconds: 30 * 86_400 },
  { key: '90d', label: '90 d', seconds: 90 * 86_400 },
  { key: '1y', label: '1 y', seconds: 365 * 86_400 },
] as const;

export function RangePresets({ range, onChange, busy }: { range: ChartRange; onChange: (range: ChartRange) => void; busy: boolean }) {
  return (
    <div role="group" aria-label="Chart range" className="inline-flex flex-wrap gap-1 rounded-lg border border-dusk-800 bg-dusk-900 p-1" aria-busy={busy}>
      {RANGE_PRESETS.map((p) => {
        const pressed = range.kind === 'preset' && range.seconds === p.seconds;
        return (
          <button
            key={p.key}
            type="button"
            aria-pressed={pressed}
            data-testid={`range-${p.key}`}
            onClick={() => onChange({ kind: 'preset', seconds: p.seconds })}
            className={`figures min-w-[3rem] rounded-md px-2.5 py-1.5 text-sm ${pressed ? 'bg-ember text-dusk-950' : 'text-ink-muted hover:bg-dusk-800 hover:text-ink'}`}
          >
            {p.label}
          </button>
        );
      })}
    </div>
  );
}
