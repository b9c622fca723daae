import { StateGlyph } from '@/components/state-glyph';
import { overVoltageWords } from '@/lib/alerts/kinds';
import { NODE_STATE_INFO, NODE_STATES, type NodeState } from '@/lib/config/node-states';
import type { FleetView } from '@/lib/db/queries/fleet';
import { formatNearNow } from '@/lib/format/time';
import { formatUntilOrAgo, secondsBetween } from './duration';

/**
 * The answer first: how many nodes in each state (each a toggle of the state filter) and
 * the earliest projected brownout, in its site's zone.
 */
export function FleetSummary({ view, state, onState }: { view: FleetView; state: NodeState | null; onState: (s: NodeState | null) => void }) {
  const earliest = view.earliest_brownout;
  return (
    <div className="mt-4 flex flex-col gap-4">
      <ul className="grid grid-cols-3 gap-2 sm:grid-cols-6" aria-label="Nodes per state" data-testid="state-counts">
        {NODE_STATES.map((s) => {
          const pressed = state === s;
          return (
            <li key={s}>
              <button
                type="button"
                onClick={() => onState(pressed ? null : s)}
                aria-pressed={pressed}
                title={NODE_STATE_INFO[s].meaning}
                data-testid={`count-${s}`}
                className={`flex w-full flex-col items-start gap-1 rounded-lg border px-3 py-2 text-left hover:bg-dusk-800 ${
                  pressed ? 'border-tide bg-dusk-800' : 'border-dusk-700 bg-dusk-900'
                } ${view.counts[s] === 0 ? 'opacity-70' : ''}`}
              >
                <StateGlyph state={s} size={18} />
                <span className="figures text-2xl leading-none">{view.counts[s]}</span>
              </button>
            </li>
          );
        })}
      </ul>
      {view.over_voltage.map((o) => (
        <p key={`ov-${o.node_id}`} role="alert" className="rounded-lg border-2 border-hazard bg-dusk-900 px-4 py-3" data-testid="fleet-over-voltage">
          <span className="font-bold text-hazard">Over-voltage: </span>
          <a href={`/nodes/${o.node_id}`} className="font-bold underline-offset-2 hover:underline">{o.name}</a>
          <span className="text-ink-muted"> reads {overVoltageWords({ volts: o.volts, maxVolts: o.max_volts })}. Check the charger; cells held above their rating age fast and can vent.</span>
        </p>
      ))}
      {view.overdue_brownouts.map((o) => (
        <p key={`od-${o.node_id}`} className="rounded-lg border border-hazard/60 bg-dusk-900 px-4 py-3" data-testid="overdue-brownout">
          <a href={`/nodes/${o.node_id}`} className="font-bold text-hazard underline-offset-2 hover:underline">{o.name}</a>
          <span className="text-ink-muted"> was projected to brown out at </span>
          <time dateTime={o.at} className="figures font-bold" suppressHydrationWarning>{formatNearNow(new Date(o.at), o.time_zone, Date.parse(view.generated_at))}</time>
          <span className="text-ink-muted"> ({formatUntilOrAgo(secondsBetween(view.generated_at, o.at))}){o.last_reading_at ? <>; no report since <time dateTime={o.last_reading_at} className="figures" suppressHydrationWarning>{formatNearNow(new Date(o.last_reading_at), o.time_zone, Date.parse(view.generated_at))}</time></> : null}.</span>
        </p>
      ))}
      {earliest ? (
        <p className="rounded-lg border border-hazard/60 bg-dusk-900 px-4 py-3" data-testid="earliest-brownout">
          <span className="text-ink-muted">{view.overdue_brownouts.length ? 'Next projected brownout: ' : 'Earliest projected brownout: '}</span>
          <a href={`/nodes/${earliest.node_id}`} className="font-bold text-hazard underline-offset-2 hover:underline">{earliest.name}</a>
          <span className="text-ink-muted"> at </span>
          <time dateTime={earliest.at} className="figures font-bold" suppressHydrationWarning>{formatNearNow(new Date(earliest.at), earliest.time_zone, Date.parse(view.generated_at))}</time>
          <span className="text-ink-muted"> ({formatUntilOrAgo(secondsBetween(view.generated_at, earliest.at))})</span>
        </p>
      ) : (
        <p className="rounded-lg border border-dusk-700 bg-dusk-900 px-4 py-3 text-ink-muted" data-testid="earliest-brownout">
          No node is projected to brown out before its next recharge.
        </p>
      )}
    </div>
  );
}
