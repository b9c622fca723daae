import { findSunCrossing, isSunBelow, SEARCH_LIMIT_SECONDS } from './sun';
import type { SiteSpec } from './types';

const DAY_MS = 86_400_000;

export interface Night {
  /** When the sun sets through the recharge elevation (local noon on a day without daylight). */
  start: Date | null;
  /** Seconds until it rises through it again; capped at 7 days, as the margin window is. */
  seconds: number;
}

/** Local solar noon (to within the equation of time) of the UTC calendar day holding `date`. */
function localNoonMs({ site, date }: { site: SiteSpec; date: Date }): number {
  const dayStart = Date.UTC(date.getUTCFullYear(), date.getUTCMonth(), date.getUTCDate());
  return dayStart + DAY_MS / 2 - (site.lon / 360) * DAY_MS;
}

/**
 * The night that begins on the evening of `date` at the site. A day with no sunset within
 * 7 days (polar day) has a night of 0 s; a day already dark at noon (polar night) counts the
 * whole 7-day window, the longest the margin ever looks ahead.
 */
export function nightAfter({ site, date }: { site: SiteSpec; date: Date }): Night {
  const noon = new Date(localNoonMs({ site, date }));
  if (isSunBelow({ site, at: noon })) return { start: noon, seconds: SEARCH_LIMIT_SECONDS };
  const start = findSunCrossing({ site, after: noon, direction: 'set' });
  if (!start) return { start: null, seconds: 0 };
  const end = findSunCrossing({ site, after: start, direction: 'rise' });
  const seconds = end ? (end.getTime() - start.getTime()) / 1000 : SEARCH_LIMIT_SECONDS;
  return { start, seconds };
}

/** The longest night of a calendar year at the site: every day searched, so either hemisphere works. */
export function longestNight({ site, year }: { site: SiteSpec; year: number }): Night {
  let best: Night = { start: null, seconds: -1 };
  const days = (Date.UTC(year + 1, 0, 1) - Date.UTC(year, 0, 1)) / DAY_MS;
  for (let d = 0; d < days; d++) {
    const night = nightAfter({ site, date: new Date(Date.UTC(year, 0, 1) + d * DAY_MS) });
    if (night.seconds > best.seconds) best = night;
  }
  return best;
}
