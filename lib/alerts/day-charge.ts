import { energyJoules, isSunBelow, modelBank, nextRechargeAt, nextSunsetAt, nightWindows, type VoltageSample } from '../energy';
import type { NodeModelSpec } from '../status/node-spec';

/**
 * The latest complete day (sun above the recharge elevation, between two nights): was it clear,
 * and did the bank gain energy? Clear sky is read from the panel volts when the node reports
 * them (panel at ≥ 80 % of its highest reading of the last two days for most of the day); a
 * node without panel volts falls back to the sun being well up (≥ 10°) for most of the day,
 * which cannot tell a cloudy day from a clear one.
 */
export interface DayCharge {
  startAt: Date;
  endAt: Date;
  clearSky: boolean;
  skyEvidence: 'panel_volts' | 'sun_elevation';
  gainJoules: number;
  gained: boolean;
  nearFull: boolean;
}

const LOOKBACK_MS = 48 * 3_600_000;
const MIN_POINTS = 6;
const SUNLIT_PANEL_FRACTION = 0.8;
const MIN_PANEL_PEAK_VOLTS = 1;
const MOST_OF_DAY = 0.5;
const WELL_UP_DEG = 10;
/** A gain below this share of the bank's full usable energy is "no gain" (noise, a brief sun). */
const GAIN_FRACTION = 0.02;
const NEAR_FULL_FRACTION = 0.95;

export function assessLatestDay({ spec, samples, now }: { spec: NodeModelSpec; samples: VoltageSample[]; now: Date }): DayCharge | null {
  const nights = nightWindows({ site: spec.site, from: new Date(now.getTime() - LOOKBACK_MS), to: now });
  // A day lies between the end of one night and the start of the next (the latter begun by now).
  for (let i = nights.length - 2; i >= 0; i--) {
    const startAt = nights[i].end;
    const endAt = nights[i + 1].start;
    if (endAt.getTime() <= startAt.getTime()) continue;
    const day = samples.filter((s) => ms(s.t) >= startAt.getTime() && ms(s.t) <= endAt.getTime()).sort((a, b) => ms(a.t) - ms(b.t));
    if (day.length < MIN_POINTS) return null;
    return { startAt, endAt, ...judgeDay({ spec, day, allSamples: samples }) };
  }
  return null;
}

function judgeDay({ spec, day, allSamples }: { spec: NodeModelSpec; day: VoltageSample[]; allSamples: VoltageSample[] }) {
  const bank = modelBank({ bank: spec.bank });
  const panel = allSamples.map((s) => s.panelVolts).filter((v): v is number => typeof v === 'number' && Number.isFinite(v));
  const panelPeakVolts = panel.length ? Math.max(...panel) : 0;
  let clearSky: boolean;
  let skyEvidence: DayCharge['skyEvidence'];
  if (panelPeakVolts >= MIN_PANEL_PEAK_VOLTS) {
    skyEvidence = 'panel_volts';
    const sunlit = day.filter((s) => (s.panelVolts ?? 0) >= SUNLIT_PANEL_FRACTION * panelPeakVolts).length;
    clearSky = sunlit / day.length >= MOST_OF_DAY;
  } else {
    skyEvidence = 'sun_elevation';
    const wellUp = { ...spec.site, rechargeElevationDeg: WELL_UP_DEG };
    const up = day.filter((s) => !isSunBelow({ site: wellUp, at: new Date(ms(s.t)) })).length;
    clearSky = up / day.length >= MOST_OF_DAY;
  }
  const startJoules = energyJoules({ farads: bank.farads, volts: day[0].volts });
  const peakJoules = Math.max(...day.map((s) => energyJoules({ farads: bank.farads, volts: s.volts })));
  const fullUsableJoules = 0.5 * bank.farads * (bank.maxVolts ** 2 - spec.converter.cutoffVolts ** 2);
  const gainJoules = peakJoules - startJoules;
  return {
    clearSky,
    skyEvidence,
    gainJoules,
    gained: gainJoules >= GAIN_FRACTION * fullUsableJoules,
    nearFull: day[0].volts >= NEAR_FULL_FRACTION * bank.maxVolts,
  };
}

function ms(t: Date | number): number {
  return t instanceof Date ? t.getTime() : t;
}

/**
 * The first whole day after the last reading — from the first recharge after it (the sun up
 * through the site's recharge elevation) to the sunset that follows — once that day has ended
 * by `now`; else null. A node gone dark in the night is expected back during that day, when the
 * panel lifts the bank to the converter's start voltage; a day that went by without a report
 * means it is not refilling. A reading in daylight starts the count at the next morning. Null
 * too where the sun does not rise within the search limit (polar night).
 */
export interface MissedDay {
  startAt: Date;
  endAt: Date;
}

export function missedDay({ site, lastReadingAt, now }: { site: NodeModelSpec['site']; lastReadingAt: Date | null; now: Date }): MissedDay | null {
  if (!lastReadingAt) return null;
  const dusk = isSunBelow({ site, at: lastReadingAt }) ? lastReadingAt : nextSunsetAt({ site, at: lastReadingAt });
  if (!dusk || dusk >= now) return null;
  const startAt = nextRechargeAt({ site, at: dusk });
  if (!startAt || startAt >= now) return null;
  const endAt = nextSunsetAt({ site, at: startAt });
  return endAt && endAt <= now ? { startAt, endAt } : null;
}
