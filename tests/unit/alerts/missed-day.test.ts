import { describe, expect, it } from 'vitest';
import { missedDay } from '@/lib/alerts/day-charge';
import type { SiteSpec } from '@/lib/energy';

// REFERENCES.md, US Naval Observatory data: Istanbul 41.01384 N 28.94966 E on 2026-06-21,
// sunrise 02:32, sunset 17:40 UTC; allow ±2 min. Recharge elevation −0.833° is the sunrise of
// the tables (common practice).
const istanbul: SiteSpec = { lat: 41.01384, lon: 28.94966, rechargeElevationDeg: -0.833 };
const at = (iso: string) => new Date(iso);
const minutesFrom = (d: Date, iso: string) => Math.abs(d.getTime() - Date.parse(iso)) / 60_000;

describe('the whole day a dark node missed', () => {
  const wentDark = at('2026-06-20T23:30:00Z'); // last report in the night before 21 June

  it('is the day from the next sunrise to its sunset, once that sunset has passed (USNO times)', () => {
    const day = missedDay({ site: istanbul, lastReadingAt: wentDark, now: at('2026-06-21T18:00:00Z') })!;
    expect(minutesFrom(day.startAt, '2026-06-21T02:32:00Z')).toBeLessThanOrEqual(2); // USNO sunrise
    expect(minutesFrom(day.endAt, '2026-06-21T17:40:00Z')).toBeLessThanOrEqual(2); // USNO sunset
  });

  it('is nothing yet during that day: the sun may still bring it back', () => {
    expect(missedDay({ site: istanbul, lastReadingAt: wentDark, now: at('2026-06-21T12:00:00Z') })).toBeNull();
    expect(missedDay({ site: istanbul, lastReadingAt: wentDark, now: at('2026-06-21T17:30:00Z') })).toBeNull();
  });

  it('does not count the rest of a day the node was still reporting in: it waits for the next whole day', () => {
    const lastAtNoon = at('2026-06-21T10:00:00Z');
    expect(missedDay({ site: istanbul, lastReadingAt: lastAtNoon, now: at('2026-06-21T20:00:00Z') })).toBeNull();
    const day = missedDay({ site: istanbul, lastReadingAt: lastAtNoon, now: at('2026-06-22T18:00:00Z') })!;
    // sunrise and sunset move by under a minute a day at the solstice (derived from the USNO pair)
    expect(minutesFrom(day.startAt, '2026-06-22T02:32:00Z')).toBeLessThanOrEqual(3);
    expect(minutesFrom(day.endAt, '2026-06-22T17:40:00Z')).toBeLessThanOrEqual(3);
  });

  it('is nothing for a node that never reported', () => {
    expect(missedDay({ site: istanbul, lastReadingAt: null, now: at('2026-06-22T18:00:00Z') })).toBeNull();
  });
});
