'use client';

import type { EfficiencyState } from './node-fields';

const input = 'w-full rounded-md border border-dusk-600 bg-dusk-950 px-3 py-2 text-ink focus:border-tide focus:outline-none';

/** Converter efficiency: one number, or a small table over input volts (linear between points). */
export function EfficiencyInput({ value, onChange, errors }: { value: EfficiencyState; onChange: (v: EfficiencyState) => void; errors: Record<string, string> }) {
  const setRow = (i: number, key: 'volts' | 'eta', text: string) => onChange({ ...value, rows: value.rows.map((r, j) => (j === i ? { ...r, [key]: text } : r)) });
  const whole = errors['converter.efficiency'];
  return (
    <fieldset className="flex flex-col gap-2 sm:col-span-2">
      <legend className="text-sm font-bold">Efficiency</legend>
      <div className="flex flex-wrap gap-4 text-sm">
        {(['constant', 'table'] as const).map((mode) => (
          <label key={mode} className="flex items-center gap-2">
            <input type="radio" name="efficiency-mode" value={mode} checked={value.mode === mode} onChange={() => onChange(switchMode(value, mode))} />
            {mode === 'constant' ? 'One number' : 'A table over input volts'}
          </label>
        ))}
      </div>
      {value.mode === 'constant' ? (
        <div className="flex flex-col gap-1.5">
          <label htmlFor="node-efficiency" className="text-sm text-ink-muted">Efficiency (%)</label>
          <input id="node-efficiency" inputMode="decimal" className={input} value={value.constant} onChange={(e) => onChange({ ...value, constant: e.target.value })}
            aria-invalid={whole ? true : undefined} aria-describedby={whole ? 'node-efficiency-error' : undefined} />
        </div>
      ) : (
        <table className="text-sm">
          <thead><tr className="text-left text-xs text-ink-faint"><th className="font-normal">Input (V)</th><th className="font-normal">Efficiency (%)</th><th><span className="sr-only">Remove</span></th></tr></thead>
          <tbody>
            {value.rows.map((r, i) => (
              <tr key={i}>
                <td className="pr-2 pt-1 align-top">
                  <input aria-label={`Point ${i + 1} input volts (V)`} inputMode="decimal" className={input} value={r.volts} onChange={(e) => setRow(i, 'volts', e.target.value)} />
                  {errors[`converter.efficiency.${i}.0`] ? <p className="text-sm text-hazard" role="alert">{errors[`converter.efficiency.${i}.0`]}</p> : null}
                </td>
                <td className="pr-2 pt-1 align-top">
                  <input aria-label={`Point ${i + 1} efficiency (%)`} inputMode="decimal" className={input} value={r.eta} onChange={(e) => setRow(i, 'eta', e.target.value)} />
                  {errors[`converter.efficiency.${i}.1`] ? <p className="text-sm text-hazard" role="alert">{errors[`converter.efficiency.${i}.1`]}</p> : null}
                </td>
                <td className="pt-1 align-top">
                  <button type="button" className="rounded-md border border-dusk-600 px-2 py-2 text-xs hover:bg-dusk-800 disabled:opacity-50" disabled={value.rows.length <= 1}
                    onClick={() => onChange({ ...value, rows: value.rows.filter((_, j) => j !== i) })} aria-label={`Remove point ${i + 1}`}>Remove</button>
                </td>
              </tr>
            ))}
          </tbody>
          <tfoot><tr><td colSpan={3} className="pt-2">
            <button type="button" className="rounded-md border border-dusk-600 px-3 py-1.5 text-xs hover:bg-dusk-800" disabled={value.rows.length >= 64}
              onClick={() => onChange({ ...value, rows: [...value.rows, { volts: '', eta: '' }] })}>Add a point</button>
          </td></tr></tfoot>
        </table>
      )}
      {whole ? <p id="node-efficiency-error" className="text-sm text-hazard" role="alert">{whole}</p> : null}
    </fieldset>
  );
}

/** Switching to the table starts it from the one number (a flat point), never from nothing. */
function switchMode(value: EfficiencyState, mode: EfficiencyState['mode']): EfficiencyState {
  const empty = value.rows.every((r) => r.volts.trim() === '' && r.eta.trim() === '');
  if (mode === 'table' && empty) return { ...value, mode, rows: [{ volts: '1', eta: value.constant }] };
  return { ...value, mode };
}
