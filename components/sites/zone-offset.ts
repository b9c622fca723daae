import { isKnownTimeZone } from '@/lib/schemas/site';

/** A zone's offset from UTC and the zone list, for the site form's time-zone field (pure, no I/O). */
const formatters = new Map<string, Intl.DateTimeFormat>();

function wallClock(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    // h23: some engines write midnight as 24 with hour12 off.
    f = new Intl.DateTimeFormat('en-US', { timeZone, hourCycle: 'h23', year: 'numeric', month: 'numeric', day: 'numeric', hour: 'numeric', minute: 'numeric', second: 'numeric' });
    formatters.set(timeZone, f);
  }
  return f;
}

/** Minutes the zone's clock is ahead of UTC at `at` (west of Greenwich negative); null for an unknown zone. */
export function utcOffsetMinutes(timeZone: string, at: Date): number | null {
  let parts: Intl.DateTimeFormatPart[];
  try {
    parts = wallClock(timeZone).formatToParts(at);
  } catch {
    return null; // RangeError: not a zone this engine knows
  }
  const p = Object.fromEntries(parts.map((x) => [x.type, Number(x.value)]));
  const wallMs = Date.UTC(p.year, p.month - 1, p.day, p.hour, p.minute, p.second);
  return Math.round((wallMs - Math.floor(at.getTime() / 1000) * 1000) / 60_000);
}

/** "UTC−08:00", "UTC+05:30", "UTC+00:00" (a true minus sign, as the site screens write negatives). */
export function formatUtcOffset(minutes: number): string {
  const abs = Math.abs(minutes);
  const hh = String(Math.floor(abs / 60)).padStart(2, '0');
  const mm = String(abs % 60).padStart(2, '0');
  return `UTC${minutes < 0 ? '−' : '+'}${hh}:${mm}`;
}

/** What the form says beside the field: "UTC−08:00 now", or why there is no offset to show. */
export function describeZoneNow(timeZone: string, at: Date): { text: string; known: boolean } {
  const name = timeZone.trim();
  if (!name) return { text: 'Choose a time zone.', known: false };
  const minutes = isKnownTimeZone(name) ? utcOffsetMinutes(name, at) : null;
  if (minutes === null) return { text: 'Not a known time zone: pick one from the list.', known: false };
  return { text: `${formatUtcOffset(minutes)} now`, known: true };
}

/** A new site's zone: the browser's own when it is a known IANA zone, else UTC. */
export function defaultSiteZone(browserZone: string | undefined): string {
  return browserZone && isKnownTimeZone(browserZone) ? browserZone : 'UTC';
}

/** The engine's IANA zones, sorted (so regions sit together), with UTC always among them. */
export function zoneChoices(supported: readonly string[]): string[] {
  const list = [...new Set(supported)].sort();
  return list.includes('UTC') ? list : ['UTC', ...list];
}
