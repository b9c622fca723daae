import * as SunCalc from 'suncalc';
import type { SiteSpec } from './types';

// Sun events from suncalc's Meeus-based position, without touching suncalc's global list of
// custom times (addTime mutates shared state). getPosition returns the *apparent* altitude
// (refraction added, Meeus 16.4, with refraction held at its horizon value below 0°), while
// rise/set elevations such as −0.833° are *true* altitudes. So the target is mapped to
// apparent altitude with the same refraction formula; apparent altitude rises monotonically
// with true altitude, so the crossing instants are the same.

const RAD = Math.PI / 180;
const DAY_SECONDS = 86_400;
export const SEARCH_LIMIT_SECONDS = 7 * DAY_SECONDS;
/** Upper bound on how fast the sun's altitude can change: ~361° of hour angle a day, plus slack. */
const MAX_RATE_DEG_PER_SECOND = 363 / DAY_SECONDS;
const MIN_STEP_SECONDS = 60;
const RESOLUTION_MS = 1000;

export type SunDirection = 'rise' | 'set';

export function apparentFromTrueDeg(trueDeg: number): number {
  const h = Math.max(trueDeg, 0) * RAD;
  const refractionRad = 0.0002967 / Math.tan(h + 0.00312536 / (h + 0.08901179));
  return trueDeg + refractionRad / RAD;
}

function apparentAltitudeDeg(site: SiteSpec, ms: number): number {
  return SunCalc.getPosition(new Date(ms), site.lat, site.lon).altitude;
}

export function isSunBelow({ site, at }: { site: SiteSpec; at: Date }): boolean {
  return apparentAltitudeDeg(site, at.getTime()) < apparentFromTrueDeg(site.rechargeElevationDeg);
}

/**
 * First instant strictly after `after` at which the sun rises (or sets) through `elevationDeg`,
 * to the second, or null if none within `limitSeconds`. Steps are as long as the sun's distance
 * from the target allows at its fastest possible rate, so no crossing is skipped (except one
 * grazing the target for under a minute), then bisection narrows the crossing to a second.
 */
export function findSunCrossing({
  site,
  after,
  direction,
  elevationDeg = site.rechargeElevationDeg,
  limitSeconds = SEARCH_LIMIT_SECONDS,
}: {
  site: SiteSpec;
  after: Date;
  direction: SunDirection;
  elevationDeg?: number;
  limitSeconds?: number;
}): Date | null {
  const target = apparentFromTrueDeg(elevationDeg);
  const above = (altitude: number) => altitude >= target;
  const endMs = after.getTime() + limitSeconds * 1000;
  let prevMs = after.getTime();
  let prevAlt = apparentAltitudeDeg(site, prevMs);
  while (prevMs < endMs) {
    const stepSeconds = Math.max(MIN_STEP_SECONDS, Math.abs(prevAlt - target) / MAX_RATE_DEG_PER_SECOND);
    const nextMs = Math.min(endMs, prevMs + stepSeconds * 1000);
    const nextAlt = apparentAltitudeDeg(site, nextMs);
    const wanted = direction === 'rise' ? !above(prevAlt) && above(nextAlt) : above(prevAlt) && !above(nextAlt);
    if (wanted) return new Date(bisectCrossing({ site, target, lowMs: prevMs, highMs: nextMs, direction }));
    prevMs = nextMs;
    prevAlt = nextAlt;
  }
  return null;
}

/** Next recharge: the sun rising through the site's recharge elevation; null within 7 days (polar night). */
export function nextRechargeAt({ site, at }: { site: SiteSpec; at: Date }): Date | null {
  return findSunCrossing({ site, after: at, direction: 'rise' });
}

export function nextSunsetAt({ site, at }: { site: SiteSpec; at: Date }): Date | null {
  return findSunCrossing({ site, after: at, direction: 'set' });
}

/** Spans with the sun below the recharge elevation between two instants, for chart bands. */
export function nightWindows({ site, from, to }: { site: SiteSpec; from: Date; to: Date }): { start: Date; end: Date }[] {
  const windows: { start: Date; end: Date }[] = [];
  let cursor = from;
  if (isSunBelow({ site, at: from })) {
    const end = nextRechargeAt({ site, at: from });
    windows.push({ start: from, end: end && end < to ? end : to });
    if (!end || end >= to) return windows;
    cursor = end;
  }
  while (cursor < to) {
    const start = nextSunsetAt({ site, at: cursor });
    if (!start || start >= to) break;
    const end = nextRechargeAt({ site, at: start });
    windows.push({ start, end: end && end < to ? end : to });
    if (!end) break;
    cursor = end;
  }
  return windows;
}

function bisectCrossing({
  site,
  target,
  lowMs,
  highMs,
  direction,
}: {
  site: SiteSpec;
  target: number;
  lowMs: number;
  highMs: number;
  direction: SunDirection;
}): number {
  // Invariant: the state at lowMs is "before" the event, at highMs "after" it.
  const after = (ms: number) => (apparentAltitudeDeg(site, ms) >= target) === (direction === 'rise');
  while (highMs - lowMs > RESOLUTION_MS) {
    const mid = (lowMs + highMs) / 2;
    if (after(mid)) highMs = mid;
    else lowMs = mid;
  }
  return Math.round(highMs / 1000) * 1000;
}

/**
 * The stretch a bank must carry on its own from `at` until the next recharge. At night it
 * starts now. While the sun is above the site's recharge elevation the panel gives net charge,
 * so the bank only rises until dusk: the stretch starts at the next sunset, with the bank taken
 * as it is now (the safe side: what it gains by dusk is not counted). A day with no sunset
 * within the search (polar day) leaves nothing to carry. A panel that gives nothing by day is
 * not this function's to see: the day-charge alert (lib/alerts/day-charge.ts) watches for it.
 */
export interface DischargeWindow {
  /** When the bank starts carrying the load alone: `at` at night, the next sunset by day, null in polar day. */
  startAt: Date | null;
  /** The next sun rising through the recharge elevation after that start; null within 7 days (polar night). */
  rechargeAt: Date | null;
  /** The sun is above the recharge elevation at `at`. */
  chargingNow: boolean;
  /** Seconds from `at` to `startAt` (0 at night), and of discharge from `startAt` to recharge (7 days at most). */
  delaySeconds: number;
  seconds: number;
}

export function dischargeWindow({ site, at }: { site: SiteSpec; at: Date }): DischargeWindow {
  if (isSunBelow({ site, at })) {
    const rechargeAt = nextRechargeAt({ site, at });
    return { startAt: at, rechargeAt, chargingNow: false, delaySeconds: 0, seconds: rechargeAt ? (rechargeAt.getTime() - at.getTime()) / 1000 : SEARCH_LIMIT_SECONDS };
  }
  const startAt = nextSunsetAt({ site, at });
  if (!startAt) return { startAt: null, rechargeAt: null, chargingNow: true, delaySeconds: 0, seconds: 0 };
  const rechargeAt = nextRechargeAt({ site, at: startAt });
  return {
    startAt, rechargeAt, chargingNow: true,
    delaySeconds: (startAt.getTime() - at.getTime()) / 1000,
    seconds: rechargeAt ? (rechargeAt.getTime() - startAt.getTime()) / 1000 : SEARCH_LIMIT_SECONDS,
  };
}
