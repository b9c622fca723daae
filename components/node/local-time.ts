import { TZDate } from '@date-fns/tz';
import { format } from 'date-fns';

/** Unix seconds → the site's wall clock, without the zone's abbreviation (for a column already headed by the zone). */
export function formatLocal(seconds: number, timeZone: string, pattern: string): string {
  return format(new TZDate(seconds * 1000, timeZone), pattern);
}
