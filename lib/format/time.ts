import { TZDate } from '@date-fns/tz';
import { format } from 'date-fns';

/** Times are shown in the site's own zone, with the zone's abbreviation. */
export function formatInTimeZone(at: Date, timeZone: string, pattern = 'EEE HH:mm'): string {
  return format(new TZDate(at.getTime(), timeZone), pattern) + ' ' + zoneAbbreviation(at, timeZone);
}

function zoneAbbreviation(at: Date, timeZone: string): string {
  const part = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' }).formatToParts(at).find((p) => p.type === 'timeZoneName');
  return part?.value ?? timeZone;
}
