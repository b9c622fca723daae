import { drawOverWindow } from '../alerts/night-draw';
import { drawScaleFrom, energyJoules, modelBank, nightMargin, type VoltageSample } from '../energy';
import { QUIET_INTERVALS } from '../status/derive-status';
import type { NodeModelSpec } from '../status/node-spec';
import type { NightRowWire } from './wire';

/**
 * One row per night (sun below the site's recharge elevation): the bank at dusk and at dawn
 * (the first and last reading inside the night), its lowest volts, the draw measured from the
 * slope of ½·C·V² over the night against the modelled draw at the cadence seen (the same fit
 * the draw-anomaly alert uses), and the margin the app gave at dusk for that night's length:
 * projected, as the live status is, with the night before's measured draw when that was far
 * above the model (drawScaleFrom), so a leaky node's row shows the warning it really had.
 * `quiet_from` is where the node fell silent inside the night (a gap of more than three report
 * intervals, up to dawn or to now), so a night the model called safe and the node did not
 * survive reads as such. Samples carry calibrated volts; instants leave as Unix seconds.
 */
export function buildNightRows({
  spec,
  nights,
  samples,
  now,
}: {
  spec: NodeModelSpec;
  nights: { start: Date; end: Date }[];
  samples: VoltageSample[];
  now: Date;
}): NightRowWire[] {
  const farads = modelBank({ bank: spec.bank }).farads;
  const sorted = [...samples].sort((a, b) => ms(a.t) - ms(b.t));
  const insideOf = (night: { start: Date; end: Date }) => sorted.filter((s) => ms(s.t) >= night.start.getTime() && ms(s.t) <= night.end.getTime());
  const draws = nights.map((night) => drawOverWindow({ spec, samples: insideOf(night) }));
  return nights.map((night, i) => {
    const inside = insideOf(night);
    const first = inside[0];
    const last = inside[inside.length - 1];
    const draw = draws[i];
    // Newest first: the night before this one is the next in the list (the oldest has none).
    const before = draws[i + 1];
    const drawScale = drawScaleFrom({ measuredWatts: before?.measuredWatts, modelledWatts: before?.modelledWatts });
    const margin = first ? nightMargin({ ...spec, volts: first.volts, at: new Date(ms(first.t)), rechargeAt: night.end, drawScale }) : null;
    const quietFrom = firstSilence({ times: inside.map((x) => ms(x.t)), until: Math.min(night.end.getTime(), now.getTime()), intervalSeconds: spec.load.intervalSeconds });
    const quietReading = quietFrom === null ? undefined : inside.find((x) => ms(x.t) === quietFrom);
    return {
      dusk_at: night.start.getTime() / 1000,
      dawn_at: night.end.getTime() / 1000,
      complete: night.end.getTime() <= now.getTime(),
      readings: inside.length,
      dusk_reading_at: first ? ms(first.t) / 1000 : null,
      dawn_reading_at: last ? ms(last.t) / 1000 : null,
      dusk_volts: first ? first.volts : null,
      dawn_volts: last ? last.volts : null,
      dusk_energy_joules: first ? energyJoules({ farads, volts: first.volts }) : null,
      dawn_energy_joules: last ? energyJoules({ farads, volts: last.volts }) : null,
      min_volts: inside.length ? inside.reduce((m, s) => Math.min(m, s.volts), Infinity) : null,
      measured_watts: draw?.measuredWatts ?? null,
      modelled_watts: draw?.modelledWatts ?? null,
      draw_ratio: draw && Number.isFinite(draw.ratio) ? draw.ratio : null,
      margin_at_dusk: margin && Number.isFinite(margin.margin) ? margin.margin : null,
      margin_draw_scale: drawScale,
      projected_brownout_at: margin?.brownoutAt ? margin.brownoutAt.getTime() / 1000 : null,
      quiet_from: quietFrom === null ? null : quietFrom / 1000,
      quiet_volts: quietReading ? quietReading.volts : null,
    };
  });
}

/** The last `count` nights that have begun by `now`, newest first; tonight (still dark) included. */
export function lastNights({ windows, now, count }: { windows: { start: Date; end: Date }[]; now: Date; count: number }) {
  return windows.filter((w) => w.start.getTime() <= now.getTime()).slice(-count).reverse();
}

/**
 * The reading after which the node went quiet for more than QUIET_INTERVALS report intervals
 * (its cadence: the configured interval or the median spacing seen, whichever is longer),
 * counting the span from the last reading to `until`; null when it kept reporting.
 */
export function firstSilence({ times, until, intervalSeconds }: { times: number[]; until: number; intervalSeconds: number }): number | null {
  if (times.length === 0) return null;
  const gaps = times.slice(1).map((t, i) => t - times[i]).filter((g) => g > 0).sort((a, b) => a - b);
  const median = gaps.length ? gaps[gaps.length >> 1] : 0;
  const limit = QUIET_INTERVALS * Math.max(intervalSeconds * 1000, median);
  for (let i = 1; i < times.length; i++) if (times[i] - times[i - 1] > limit) return times[i - 1];
  const last = times[times.length - 1];
  return until - last > limit ? last : null;
}

function ms(t: Date | number): number {
  return t instanceof Date ? t.getTime() : t;
}
