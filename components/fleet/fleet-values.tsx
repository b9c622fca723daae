import { DRAW_ANOMALY_RATIO, overVoltageFraction } from '@/lib/alerts/kinds';
import { drawScaleFrom } from '@/lib/energy/evaluate';
import type { FleetNodeWire } from '@/lib/db/queries/fleet';
import { formatNearNow } from '@/lib/format/time';
import { formatAge, formatJoules, formatMargin, formatPercent, formatVolts, formatWatts, formatWattHours } from '@/lib/format/units';
import { formatUntilOrAgo, secondsBetween } from './duration';

/** One node's figures as the table and the cards show them; times in the node's site zone. */
/** Bank volts; over 98 % of the rated maximum it turns into a caution with the real figure. */
export function BankValue({ volts, maxVolts }: { volts: number | null; maxVolts: number }) {
  const over = overVoltageFraction({ volts, maxVolts });
  if (over === null) return <span className="figures">{formatVolts(volts)}</span>;
  return (
    <span className="figures font-bold text-hazard" data-testid="over-voltage">
      {formatVolts(volts)}
      <span className="block text-xs font-normal">{Math.round(over * 100)} % of rated {formatVolts(maxVolts, 2)}</span>
    </span>
  );
}

/** A quiet node's margin and times were projected from its last reading: not shown as current. */
export function isQuiet(state: FleetNodeWire['state']): boolean {
  return state === 'dark' || state === 'silent';
}

export function QuietValue() {
  return <span className="text-xs text-ink-muted" title="Projected from its last reading, which is too old to go by">quiet</span>;
}

export function SocValue({ soc }: { soc: number | null }) {
  return (
    <span className="inline-flex flex-col gap-1">
      <span className="figures">{formatPercent(soc)}</span>
      {soc != null ? (
        <span className="inline-block h-1.5 w-14 overflow-hidden rounded-full bg-dusk-700" aria-hidden="true">
          <span className="block h-full bg-ember" style={{ width: `${Math.round(soc * 100)}%` }} />
        </span>
      ) : null}
    </span>
  );
}

export function ReserveValue({ joules }: { joules: number | null }) {
  return (
    <span className="figures">
      {formatJoules(joules)}
      {joules != null ? <span className="block text-xs text-ink-muted">{formatWattHours(joules)}</span> : null}
    </span>
  );
}

export function MarginValue({ margin, node }: { margin: number | null; node?: FleetNodeWire }) {
  const measured = node ? drawScaleFrom({ measuredWatts: node.measured_watts, modelledWatts: node.modelled_watts }) > 1 : false;
  return (
    <span className={`figures ${margin != null && margin < 1 ? 'font-bold text-hazard' : ''}`}>
      {formatMargin(margin)}
      {measured ? <span className="block text-xs font-normal text-ink-muted" title="Projected with the draw measured last night, far above what its settings predict">measured draw</span> : null}
    </span>
  );
}

export function LocalTime({ at, timeZone, now, empty = '—' }: { at: string | null; timeZone: string; now: string; empty?: string }) {
  if (!at) return <span className="text-ink-muted">{empty}</span>;
  const seconds = secondsBetween(now, at)!;
  return (
    <span className="figures">
      <time dateTime={at} suppressHydrationWarning>{formatNearNow(new Date(at), timeZone, Date.parse(now))}</time>
      <span className="block text-xs text-ink-muted">{formatUntilOrAgo(seconds)}</span>
    </span>
  );
}

export function AgeValue({ at, now }: { at: string | null; now: string }) {
  return <span className="figures">{formatAge(at, new Date(now))}</span>;
}

/** Measured vs modelled bank-side draw; well above the model hints at a leak or a node stuck awake. */
export function DrawValue({ node }: { node: FleetNodeWire }) {
  const ratio = node.draw_ratio;
  const high = ratio != null && ratio > DRAW_ANOMALY_RATIO;
  return (
    <span className="figures">
      {formatWatts(node.measured_watts)} <span className="text-ink-muted">/ {formatWatts(node.modelled_watts ?? node.load_watts)}</span>
      {ratio != null ? (
        <span className={`block text-xs ${high ? 'font-bold text-hazard' : 'text-ink-muted'}`}>
          {ratio.toFixed(2)}× model{high ? ' — high' : ''}
        </span>
      ) : (
        <span className="block text-xs text-ink-muted">not measured</span>
      )}
    </span>
  );
}
