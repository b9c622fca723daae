'use client';

import { StateGlyph } from '@/components/state-glyph';
import { DRAW_ANOMALY_RATIO, KIND_INFO, overVoltageFraction, overVoltageWords } from '@/lib/alerts/kinds';
import { stateOfCharge } from '@/lib/energy';
import { formatNearNow } from '@/lib/format/time';
import { formatAge, formatJoules, formatMargin, formatPercent, formatVolts, formatWattHours, formatWatts } from '@/lib/format/units';
import type { StatusReply } from '@/lib/series/wire';
import { BankGauge } from './bank-gauge';
import { FigureTile } from './figure-tile';
import { tonightSentence } from './tonight-line';
import { useNodeStatus, useNow } from './use-node-data';

/** The node's figures now: first painted by the server, then refreshed by polling /status. */
export function NodeOverview({ nodeId, initial }: { nodeId: number; initial: StatusReply }) {
  const { data, isError, dataUpdatedAt } = useNodeStatus({ nodeId, initial });
  const s = data ?? initial;
  const now = useNow({ startMs: initial.evaluated_at * 1000 });
  const tz = s.node.time_zone;
  const at = (seconds: number | null, fallback = '—') => (seconds === null ? fallback : formatNearNow(new Date(seconds * 1000), tz, s.evaluated_at * 1000));
  const sentence = tonightSentence({ s });
  const floorSoc = stateOfCharge({ volts: s.bank.burst_floor_volts, cutoffVolts: s.bank.cutoff_volts, maxVolts: s.bank.max_volts });
  const marginTone = s.margin === null ? 'ink' : s.margin < 1 ? 'hazard' : s.margin < 1.5 ? 'ink' : 'ember';
  const ratio = s.measured?.ratio ?? null;
  // A quiet node's recharge and brownout are projected from its last reading, which may be long past.
  const quiet = s.state === 'dark' || s.state === 'silent';
  const over = overVoltageFraction({ volts: s.volts, maxVolts: s.bank.max_volts });
  const rechargePassed = s.recharge_at !== null && s.recharge_at <= s.evaluated_at;

  return (
    <section aria-labelledby="tonight-heading" className="mt-5" data-testid="node-overview">
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
        <h2 id="tonight-heading" className="sr-only">Tonight</h2>
        <span className="rounded-full border border-dusk-700 bg-dusk-900 px-3 py-1" data-testid="node-state">
          <StateGlyph state={s.state} size={20} />
        </span>
        <p className={`max-w-3xl text-base ${sentence.tone === 'hazard' ? 'text-hazard' : sentence.tone === 'ember' ? 'text-ink' : 'text-ink-muted'}`} data-testid="tonight-sentence">
          {sentence.text}
        </p>
      </div>
      {over !== null && s.volts !== null ? (
        <div role="alert" className="mt-3 max-w-3xl rounded-lg border border-hazard bg-dusk-900 px-4 py-3 text-sm" data-testid="over-voltage-caution">
          <p className="font-bold text-hazard">Over-voltage: the bank reads {overVoltageWords({ volts: s.volts, maxVolts: s.bank.max_volts })}.</p>
          <p className="mt-1 text-ink-muted">
            The reserve and the margin count no charge above the rating. If the reading is real, {KIND_INFO.over_voltage.todo.join(' ').replace(/^Check/, 'check')} If it is not, check the bank settings and the calibration.
          </p>
        </div>
      ) : null}
      {isError ? <p role="status" className="mt-2 text-xs text-hazard">Live refresh failed; showing figures from {formatAge(new Date(dataUpdatedAt), new Date(now))}.</p> : null}

      <div className="mt-4 max-w-xl">
        <BankGauge soc={s.soc} floorSoc={floorSoc} />
      </div>

      <dl className="mt-4 grid grid-cols-2 gap-2 sm:grid-cols-3 lg:grid-cols-4" data-testid="node-figures">
        <FigureTile label="Bank, calibrated" value={formatVolts(s.volts)} note={`${over !== null ? 'over the rated' : 'full'} ${formatVolts(s.bank.max_volts, 2)} · floor ${formatVolts(s.bank.burst_floor_volts, 2)}`} tone={over !== null ? 'hazard' : 'ink'} testId="figure-volts" />
        <FigureTile label="State of charge" value={formatPercent(s.soc)} note="of the energy above cutoff" tone="ember" testId="figure-soc" />
        <FigureTile label="Reserve" value={formatJoules(s.reserve_joules)} note={s.reserve_joules === null ? 'no reading yet' : `${formatWattHours(s.reserve_joules)} above the burst floor`} testId="figure-reserve" />
        <FigureTile label="Night margin" value={formatMargin(s.margin)}
          note={quiet ? 'at the last reading' : s.draw_scale > 1 ? `with the draw measured last night (${s.draw_scale.toFixed(2)}× the model)` : 'reserve ÷ draw to recharge'}
          tone={quiet ? 'ink' : marginTone} testId="figure-margin" />
        <FigureTile label="Recharge" value={at(s.recharge_at)} note={rechargePassed ? 'passed since the last reading' : quiet ? 'as seen from the last reading' : "sun up through the site's elevation"} tone={rechargePassed ? 'ink' : 'tide'} testId="figure-recharge" />
        <FigureTile label="Projected brownout" value={s.volts === null ? '—' : at(s.brownout_at, 'none')} note={s.volts === null ? 'no reading yet' : quiet ? 'as seen from the last reading' : s.brownout_at === null ? 'before the recharge' : 'at the burst floor'} tone={s.brownout_at === null ? 'ink' : 'hazard'} testId="figure-brownout" />
        <FigureTile label="Last reading" value={formatAge(s.last_reading_at === null ? null : new Date(s.last_reading_at * 1000), new Date(now))} note={at(s.last_reading_at, 'never')} testId="figure-age" />
        <FigureTile
          label="Draw, measured / model"
          value={<>{formatWatts(s.measured?.watts)} <span className="text-ink-faint">/</span> {formatWatts(s.measured?.modelled_watts ?? s.load_watts)}</>}
          note={ratio === null ? 'no night measured yet' : `${ratio.toFixed(2)}× the model over the latest night`}
          tone={ratio !== null && ratio > DRAW_ANOMALY_RATIO ? 'hazard' : 'ink'}
          testId="figure-draw"
        />
      </dl>
    </section>
  );
}
