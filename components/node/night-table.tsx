'use client';

import { formatJoules, formatMargin, formatVolts, formatWatts } from '@/lib/format/units';
import type { NightRowWire } from '@/lib/series/wire';
import { NEAR_FLOOR_FRACTION } from '@/lib/status/derive-status';
import { formatLocal } from './local-time';
import { useNightTable } from './use-node-data';

/** The last fourteen nights, newest first: a table on wide screens, one card per night on a phone. */
export function NightTable({ nodeId, timeZone }: { nodeId: number; timeZone: string }) {
  const { data, isPending, isError, error, refetch } = useNightTable({ nodeId });
  const zone = data?.time_zone ?? timeZone;
  const t = (s: number | null) => (s === null ? '—' : formatLocal(s, zone, 'HH:mm'));
  const day = (s: number) => formatLocal(s, zone, 'EEE d MMM');
  const floor = data?.burst_floor_volts ?? 0;
  // "Near the floor" as the dark state reads it: within a tenth of the span from floor to full.
  const nearFloorVolts = floor + NEAR_FLOOR_FRACTION * Math.max(0, (data?.max_volts ?? floor) - floor);
  const lowTone = (n: NightRowWire) => (n.min_volts !== null && n.min_volts <= floor * 1.02 ? 'text-hazard' : '');

  return (
    <section aria-labelledby="nights-heading" data-testid="night-table">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="nights-heading" className="text-lg font-bold">Night by night</h2>
        <a href={`/api/v1/nodes/${nodeId}/nights?format=csv`} download className="text-sm text-tide underline-offset-2 hover:underline" data-testid="nights-csv">
          Download CSV
        </a>
      </div>
      <p className="text-xs text-ink-muted">Dusk and dawn are the sun crossing the site&apos;s recharge elevation; times in {zone}.</p>

      {isPending ? <div className="mt-3 h-40 animate-pulse rounded-lg bg-dusk-900" aria-label="Loading the nights" /> : null}
      {isError ? (
        <div role="alert" className="mt-3 text-sm text-hazard">
          The nights could not be loaded: {error.message} <button type="button" className="underline" onClick={() => refetch()}>Try again</button>
        </div>
      ) : null}
      {data && data.nights.length === 0 ? <p className="mt-3 text-ink-muted">No nights yet.</p> : null}
      {data && data.nights.length > 0 ? (
        <>
          <div className="mt-3 hidden overflow-x-auto md:block">
            <table className="w-full text-left text-sm">
              <caption className="sr-only">Each night: dusk and dawn, stored energy at both, lowest volts, measured and modelled draw, margin at dusk, and whether the node reported through it</caption>
              <thead className="text-[11px] uppercase tracking-wider text-ink-faint">
                <tr>
                  <th scope="col" className="py-2 pr-3">Night of</th>
                  <th scope="col" className="pr-3">Dusk → dawn</th>
                  <th scope="col" className="pr-3 text-right">Energy at dusk</th>
                  <th scope="col" className="pr-3 text-right">Energy at dawn</th>
                  <th scope="col" className="pr-3 text-right">Lowest</th>
                  <th scope="col" className="pr-3 text-right">Draw measured / model</th>
                  <th scope="col" className="pr-3 text-right">Margin at dusk</th>
                  <th scope="col">Outcome</th>
                </tr>
              </thead>
              <tbody>
                {data.nights.map((n) => (
                  <tr key={n.dusk_at} className="border-t border-dusk-800" data-testid="night-row">
                    <th scope="row" className="py-2 pr-3 font-bold">{day(n.dusk_at)}{n.complete ? '' : <span className="ml-2 text-xs font-normal text-tide">tonight</span>}</th>
                    <td className="figures whitespace-nowrap pr-3">{t(n.dusk_at)} → {t(n.dawn_at)}</td>
                    <td className="figures whitespace-nowrap pr-3 text-right">{formatJoules(n.dusk_energy_joules)}</td>
                    <td className="figures whitespace-nowrap pr-3 text-right"><DawnEnergy n={n} /></td>
                    <td className={`figures whitespace-nowrap pr-3 text-right ${lowTone(n)}`}>{formatVolts(n.min_volts)}</td>
                    <td className="figures whitespace-nowrap pr-3 text-right"><Draw n={n} /></td>
                    <td className={`figures pr-3 text-right ${marginTone(n.margin_at_dusk)}`}><DuskMargin n={n} /></td>
                    <td className="text-sm"><Outcome n={n} t={t} nearFloorVolts={nearFloorVolts} /></td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <ul className="mt-3 grid gap-2 md:hidden" aria-label="Nights">
            {data.nights.map((n) => (
              <li key={n.dusk_at} className="rounded-lg border border-dusk-800 bg-dusk-900/70 p-3" data-testid="night-card">
                <div className="flex items-baseline justify-between">
                  <p className="font-bold">{day(n.dusk_at)}{n.complete ? '' : <span className="ml-2 text-xs font-normal text-tide">tonight</span>}</p>
                  <p className="figures text-sm text-ink-muted">{t(n.dusk_at)} → {t(n.dawn_at)}</p>
                </div>
                <dl className="figures mt-2 grid grid-cols-2 gap-x-3 gap-y-1 text-sm">
                  <dt className="font-sans text-ink-faint">Energy dusk</dt><dd className="text-right">{formatJoules(n.dusk_energy_joules)}</dd>
                  <dt className="font-sans text-ink-faint">{n.complete ? 'Energy dawn' : 'Energy now'}</dt><dd className="text-right"><DawnEnergy n={n} /></dd>
                  <dt className="font-sans text-ink-faint">Lowest</dt><dd className={`text-right ${lowTone(n)}`}>{formatVolts(n.min_volts)}</dd>
                  <dt className="font-sans text-ink-faint">Draw meas. / model</dt><dd className="text-right"><Draw n={n} /></dd>
                  <dt className="font-sans text-ink-faint">Margin at dusk</dt><dd className={`text-right ${marginTone(n.margin_at_dusk)}`}><DuskMargin n={n} /></dd>
                  <dt className="font-sans text-ink-faint">Outcome</dt><dd className="text-right font-sans"><Outcome n={n} t={t} nearFloorVolts={nearFloorVolts} /></dd>
                </dl>
              </li>
            ))}
          </ul>
        </>
      ) : null}
    </section>
  );
}

/** The margin the app gave at dusk; marked when it was projected with the night before's measured draw. */
function DuskMargin({ n }: { n: NightRowWire }) {
  if (n.margin_at_dusk === null || !(n.margin_draw_scale > 1)) return <>{formatMargin(n.margin_at_dusk)}</>;
  return (
    <>
      {formatMargin(n.margin_at_dusk)}
      <span className="block text-xs font-normal text-ink-muted" title={`Projected with the night before's measured draw, ${n.margin_draw_scale.toFixed(2)} × what the settings predict`} data-testid="dusk-margin-measured">
        at {n.margin_draw_scale.toFixed(2)} × draw
      </span>
    </>
  );
}

/** Before dawn the last reading is not the dawn's: it is said as "so far". */
function DawnEnergy({ n }: { n: NightRowWire }) {
  if (n.complete || n.dawn_energy_joules === null) return <>{formatJoules(n.dawn_energy_joules)}</>;
  return <>{formatJoules(n.dawn_energy_joules)} <span className="block text-xs text-ink-faint">so far</span></>;
}

/**
 * What happened, beside what the model said at dusk: a night the node did not report through
 * says so, as a brownout when its last reading was near the burst floor (as the dark state
 * reads it), else as a silence (link or firmware).
 */
function Outcome({ n, t, nearFloorVolts }: { n: NightRowWire; t: (s: number | null) => string; nearFloorVolts: number }) {
  if (n.readings === 0) return <span className="text-ink-faint">no readings</span>;
  if (n.quiet_from !== null) {
    // Judged at the last reading before the silence: the bank may have recovered by dawn.
    const nearFloor = n.quiet_volts !== null && n.quiet_volts <= nearFloorVolts;
    return (
      <span className="font-bold text-hazard" data-testid="night-quiet">
        {nearFloor ? `browned out after ${t(n.quiet_from)}` : `quiet from ${t(n.quiet_from)}`}
      </span>
    );
  }
  return <span className="text-ink-muted">{n.complete ? 'reported all night' : 'reporting'}</span>;
}

function Draw({ n }: { n: NightRowWire }) {
  if (n.measured_watts === null) return <span className="text-ink-faint">too few readings</span>;
  return <>{formatWatts(n.measured_watts)} <span className="text-ink-faint">/</span> {formatWatts(n.modelled_watts)}</>;
}

function marginTone(m: number | null): string {
  return m === null ? 'text-ink-faint' : m < 1 ? 'text-hazard' : m < 1.5 ? 'text-ink' : 'text-ember';
}
