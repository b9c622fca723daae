import { formatInTimeZone, TIME_PATTERNS } from '@/lib/format/time';

/** A moment in the site's own zone, with the zone's abbreviation ("Tue 3 Dec 16:42 PST"). */
export function SiteTime({ at, timeZone, empty = '—' }: { at: string | null | undefined; timeZone: string; empty?: string }) {
  if (!at || !Number.isFinite(Date.parse(at))) return <span className="text-ink-muted">{empty}</span>;
  return (
    <time dateTime={new Date(at).toISOString()} className="figures" suppressHydrationWarning>
      {formatInTimeZone(new Date(at), timeZone, TIME_PATTERNS.event)}
    </time>
  );
}
