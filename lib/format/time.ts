import { TZDate } from '@date-fns/tz';
import { format } from 'date-fns';

/**
 * The few ways a time is written on screens and in mail, so the same kind of time reads the same
 * everywhere: `soon` for tonight's and tomorrow's events, `event` for anything within a week or
 * so (alerts, recharge, night start), `record` for when something was done or runs out (imports,
 * credentials, bench runs, invitations), `file` for CSV cells that other programs read.
 */
export const TIME_PATTERNS = {
  soon: 'EEE HH:mm',
  event: 'EEE d MMM HH:mm',
  record: 'd MMM yyyy HH:mm',
  file: 'yyyy-MM-dd HH:mm',
} as const;

/** Times are shown in the site's own zone, with the zone's abbreviation. */
export function formatInTimeZone(at: Date, timeZone: string, pattern: string = TIME_PATTERNS.soon): string {
  return format(new TZDate(at.getTime(), timeZone), pattern) + ' ' + zoneAbbreviation(at, timeZone);
}

function zoneAbbreviation(at: Date, timeZone: string): string {
  const part = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' }).formatToParts(at).find((p) => p.type === 'timeZoneName');
  return part?.value ?? timeZone;
}

const NEAR_SECONDS = 6 * 86_400;

/**
 * A time beside "now": the weekday and time while that names it without doubt (within six
 * days either way), else the full date, so a node quiet for two weeks does not read as
 * "Mon 14:02" of this week.
 */
export function formatNearNow(at: Date, timeZone: string, nowMs: number): string {
  const near = Math.abs(at.getTime() - nowMs) < NEAR_SECONDS * 1000;
  return formatInTimeZone(at, timeZone, near ? TIME_PATTERNS.soon : TIME_PATTERNS.record);
}
