/** "45 s", "12 min", "7 h 05 min", "3 d 4 h": durations for people, from seconds. */
export function formatDuration(seconds: number | null | undefined): string {
  if (seconds == null || !Number.isFinite(seconds)) return '—';
  const s = Math.max(0, Math.round(seconds));
  if (s < 90) return `${s} s`;
  const minutes = Math.round(s / 60);
  if (minutes < 60) return `${minutes} min`;
  const hours = Math.floor(minutes / 60);
  if (hours < 48) return `${hours} h ${String(minutes % 60).padStart(2, '0')} min`;
  return `${Math.floor(hours / 24)} d ${hours % 24} h`;
}

/** Seconds from `from` to `to` (RFC 3339), or null. */
export function secondsBetween(from: string, to: string | null): number | null {
  return to ? (Date.parse(to) - Date.parse(from)) / 1000 : null;
}

/** "in 2 h 05 min" ahead, "2 h 14 min ago" once the instant has passed (a projection no reading has renewed). */
export function formatUntilOrAgo(seconds: number | null): string {
  return seconds !== null && seconds < 0 ? `${formatDuration(-seconds)} ago` : `in ${formatDuration(seconds)}`;
}
