import { z } from 'zod';

/**
 * A site as the API and the site form send it. Shared by both, so the message a field shows
 * is the one the server would give.
 */
let zones: Set<string> | undefined;

// The IANA list of this engine. 'UTC' is valid everywhere but some engines leave it out of
// the list; a zone renamed upstream (Europe/Kiev → Europe/Kyiv) resolves to its old name in an
// older ICU, so a correctly spelled name that resolves to a listed zone is accepted too.
export function isKnownTimeZone(name: string): boolean {
  zones ??= new Set(Intl.supportedValuesOf('timeZone'));
  if (zones.has(name) || name === 'UTC' || name === 'Etc/UTC') return true;
  if (!/^[A-Z][A-Za-z_+-]*(\/[A-Z0-9][A-Za-z0-9_+-]*)+$/.test(name)) return false;
  try {
    return zones.has(new Intl.DateTimeFormat('en', { timeZone: name }).resolvedOptions().timeZone);
  } catch {
    return false;
  }
}

const degrees = z.number({ message: 'Enter a number (°).' }).finite('Enter a number (°).');

export const siteBody = z.object({
  name: z.string().trim().min(1, 'Give the site a name.').max(200).regex(/^[^\r\n\t]*$/, 'Use one line.'),
  lat: degrees.min(-90, 'Latitude is between −90° and 90°.').max(90, 'Latitude is between −90° and 90°.'),
  lon: degrees.min(-180, 'Longitude is between −180° and 180°.').max(180, 'Longitude is between −180° and 180°.'),
  time_zone: z.string().trim().min(1, { message: 'Choose a time zone.', abort: true }).max(64, { abort: true }).refine(isKnownTimeZone, 'Not a known time zone: use an IANA name such as Europe/Berlin.'),
  // The same range as the model's site input (lib/schemas/model.ts), in plainer words.
  recharge_elevation_deg: degrees.min(-18, 'Use −18° (astronomical dusk) to 60°.').max(60, 'Use −18° (astronomical dusk) to 60°.'),
  notes: z.string().max(4000).default(''),
}).strict();

export type SiteBody = z.infer<typeof siteBody>;

export interface SiteWire extends SiteBody {
  id: number;
  live_nodes: number;
}
