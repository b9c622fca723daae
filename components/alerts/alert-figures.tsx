import { KIND_INFO } from '@/lib/alerts/kinds';
import { ReserveValue } from '@/components/fleet/fleet-values';
import { Term } from '@/components/ui/term';
import { formatJoules, formatMargin, formatVolts, formatWatts } from '@/lib/format/units';
import type { AlertWire } from './alert-wire';
import { SiteTime } from './site-time';

/** The figures an alert was written with (its last pass), and what to do about it. */
export function AlertFigures({ alert }: { alert: AlertWire }) {
  const d = alert.detail ?? {};
  const tz = alert.time_zone;
  const modelWatts = d.modelled_watts ?? d.load_watts ?? null;
  const ratio = d.draw_ratio ?? (d.measured_watts != null && modelWatts ? d.measured_watts / modelWatts : null);
  const short = d.margin != null && d.margin < 1;
  const todo = KIND_INFO[alert.kind]?.todo ?? [];
  return (
    <div className="mt-3 grid gap-3 lg:grid-cols-[3fr_2fr] lg:gap-6">
      <div className="min-w-0">
        <p className="text-xs text-ink-faint">Figures as of <SiteTime at={d.evaluated_at} timeZone={tz} /></p>
        <dl className="mt-2 grid grid-cols-2 gap-x-3 gap-y-2 text-[13px] sm:grid-cols-3 sm:gap-x-4 sm:text-sm">
          <Term term="Night margin">
            <span className={`figures ${short ? 'font-bold text-hazard' : ''}`}>{formatMargin(d.margin)}</span>
            {short ? <span className="block text-xs text-ink-muted">below 1: not enough</span> : null}
          </Term>
          <Term term="Projected brownout"><SiteTime at={d.brownout_at} timeZone={tz} empty="none projected" /></Term>
          <Term term="Recharge"><SiteTime at={d.recharge_at} timeZone={tz} /></Term>
          <Term term="Draw: measured / model">
            <span className="figures">{formatWatts(d.measured_watts)} <span className="text-ink-muted">/ {formatWatts(modelWatts)}</span></span>
            <span className="block text-xs text-ink-muted">{ratio != null && Number.isFinite(ratio) ? `${ratio.toFixed(2)}× the model` : 'not measured'}</span>
          </Term>
          <Term term="Bank">
            <span className="figures">{formatVolts(d.volts)}</span>
            {alert.kind === 'over_voltage' && d.max_volts ? <span className="block text-xs text-ink-muted">of {formatVolts(d.max_volts, 2)} max</span> : null}
          </Term>
          <KindItem alert={alert} />
        </dl>
      </div>
      {/* Beside the figures on a wide screen; folded away on a phone, where cards must stay short. */}
      <div className="hidden rounded-lg border border-dusk-700 bg-dusk-950/60 px-3 py-2 lg:block">
        <p className="text-sm font-bold">What to do</p>
        <TodoList steps={todo} />
      </div>
      <details className="rounded-lg border border-dusk-700 bg-dusk-950/60 px-3 py-2 lg:hidden">
        <summary className="cursor-pointer py-1 text-sm font-bold">What to do <span className="font-normal text-ink-muted">({todo.length} {todo.length === 1 ? 'step' : 'steps'})</span></summary>
        <TodoList steps={todo} />
      </details>
    </div>
  );
}

function TodoList({ steps }: { steps: string[] }) {
  return (
    <ul className="mt-2 list-disc space-y-1 pl-5 text-sm text-ink-muted">
      {steps.map((step) => <li key={step}>{step}</li>)}
    </ul>
  );
}

/** The one figure that matters most for this kind beyond the common ones. */
function KindItem({ alert }: { alert: AlertWire }) {
  const d = alert.detail ?? {};
  if (alert.kind === 'not_charging') {
    return (
      <Term term="Gained that day">
        <span className="figures">{formatJoules(d.day_gain_joules)}</span>
        <span className="block text-xs text-ink-muted">{d.day_clear_sky ? 'under a clear sky' : 'sky not clear'}</span>
      </Term>
    );
  }
  if (alert.kind === 'node_dark' || alert.kind === 'dark_through_day' || alert.kind === 'node_silent') {
    return <Term term="Last reading"><SiteTime at={d.last_reading_at} timeZone={alert.time_zone} empty="never" /></Term>;
  }
  return (
    <Term term="Reserve"><ReserveValue joules={d.reserve_joules ?? null} /></Term>
  );
}
