import type { ReactNode } from 'react';
import { formatDuration } from '@/components/fleet/duration';
import { formatInTimeZone, TIME_PATTERNS } from '@/lib/format/time';
import { SEARCH_LIMIT_SECONDS } from '@/lib/energy/sun';
import { BankCaution } from '@/components/settings/bank-caution';
import { formatAmps, formatJoules, formatMargin, formatVolts, formatWattHours } from '@/lib/format/units';
import { DischargeChart } from './discharge-chart';
import type { PlannerReply } from './planner-types';

/** The planner's answer: how many cells in parallel, what they hold, the night, the charge times. */
export function PlannerAnswer({ answer, busy, timeZone, cutoffVolts }: { answer: PlannerReply | null; busy: boolean; timeZone: string; cutoffVolts: number }) {
  if (!answer) {
    return (
      <section className="rounded-xl border border-dashed border-dusk-600 p-6 text-sm text-ink-muted" aria-live="polite" data-testid="planner-empty">
        {busy ? <p role="status">Working out the night and the bank…</p> : <p>Fill in the load, converter, cell and site, then plan the bank. The answer and the night&apos;s discharge appear here.</p>}
      </section>
    );
  }
  const b = answer.bank;
  const found = answer.cells_parallel != null;
  // The sun search looks 7 days ahead; a night that long is a polar night the plan cuts short.
  const polar = answer.night_seconds >= SEARCH_LIMIT_SECONDS;
  return (
    <section className="flex flex-col gap-4 rounded-xl border border-dusk-700 bg-dusk-900 p-4" aria-live="polite" data-testid="planner-answer">
      <div>
        <p className="text-sm text-ink-muted">Cells in parallel</p>
        <p className="figures text-4xl font-bold text-ember" data-testid="planner-cells-parallel">{found ? answer.cells_parallel : 'none'}</p>
        <p className="mt-1 text-sm text-ink-muted">
          {found
            ? `${b.cells_series} in series × ${b.cells_parallel} in parallel = ${b.cells_series * b.cells_parallel} cells: ${answer.bank_farads.toPrecision(4)} F, ${formatVolts(answer.bank_max_volts, 2)} at full, ESR ${(answer.bank_esr_ohms * 1000).toPrecision(3)} mΩ.`
            : answer.burst_blocked
              ? 'No number of cells can carry this load: see why below.'
              : `No count up to ${b.cells_parallel} reaches the target margin; the figures below are for ${b.cells_parallel} in parallel. Stretch the report interval, lower the load or pick a larger cell.`}
        </p>
      </div>
      {answer.burst_blocked ? (
        <p role="alert" className="rounded-lg border border-hazard/70 bg-dusk-950 px-3 py-2 text-sm" data-testid="planner-burst-blocked">
          <strong className="text-hazard">The transmit burst cannot complete from any bank of these cells.</strong> Even from a full bank
          ({formatVolts(answer.burst_blocked.full_volts, 2)}) with no ESR, the converter would draw{' '}
          <span className="figures">{formatAmps(answer.burst_blocked.input_amps)}</span> at its input, over its{' '}
          <span className="figures">{formatAmps(answer.burst_blocked.limit_amps)}</span> limit; more cells in parallel do not lower that current.
          Lower the burst current, use a converter with a higher input limit, or raise the bank voltage (more cells in series).
        </p>
      ) : null}
      {polar ? (
        <p role="note" className="rounded-lg border border-hazard/70 bg-dusk-950 px-3 py-2 text-sm" data-testid="planner-polar-night">
          <strong className="text-hazard">Polar night.</strong> Here the sun stays below the recharge elevation for more than 7 days, and this plan
          covers only the first 7 (and the extra days): the cell count above is for that span, not for the winter. No practical bank carries a node through a polar
          winter: plan for it to sleep until the sun returns, or give it another source.
        </p>
      ) : null}
      <dl className="grid grid-cols-2 gap-x-4 gap-y-3 text-sm sm:grid-cols-3">
        <Figure term="Energy at full">{formatJoules(answer.energy_full_joules)}<Sub>{formatWattHours(answer.energy_full_joules)}</Sub></Figure>
        <Figure term="Night length">{polar ? 'over 7 days' : formatDuration(answer.night_seconds)}
          <Sub>{polar ? 'the sun stays below the recharge elevation' : answer.night_start ? <>from <span suppressHydrationWarning>{formatInTimeZone(new Date(answer.night_start), timeZone, TIME_PATTERNS.event)}</span></> : 'no sunset'}</Sub>
        </Figure>
        <Figure term="Carried without sun">{formatDuration(answer.window_seconds)}<Sub>night + extra days</Sub></Figure>
        <Figure term="Draw over that span">{formatJoules(answer.night_draw_joules)}<Sub>{formatWattHours(answer.night_draw_joules)}</Sub></Figure>
        <Figure term="Night margin">{answer.margin == null ? '∞' : formatMargin(answer.margin)}<Sub>reserve at full ÷ draw</Sub></Figure>
        <Figure term="Burst floor">{formatVolts(answer.burst_floor_volts)}</Figure>
        <Figure term="Charge from the panel">{formatDuration(answer.panel_charge_seconds)}<Sub>cutoff → full, sun hours</Sub></Figure>
        <Figure term="Charge at constant current">{formatDuration(answer.cc_charge_seconds)}<Sub>t = C·ΔV/I</Sub></Figure>
      </dl>
      {answer.burst_blocked ? null : <DischargeChart answer={answer} cutoffVolts={cutoffVolts} timeZone={timeZone} />}
      <BankCaution shortCircuitAmps={answer.short_circuit_amps ?? (answer.bank_esr_ohms > 0 ? null : Number.POSITIVE_INFINITY)} />
    </section>
  );
}

function Figure({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div>
      <dt className="text-xs text-ink-muted">{term}</dt>
      <dd className="figures text-base">{children}</dd>
    </div>
  );
}

const Sub = ({ children }: { children: ReactNode }) => <span className="block font-sans text-xs text-ink-muted">{children}</span>;
