import { existsSync, readFileSync, renameSync, writeFileSync } from 'node:fs';

// How far each node's readings got out (acknowledged or refused for good), kept between runs
// so that a second `npm run demo` does not send the same stretch again with other timings.
// Tied to the seed's `now`: a fresh seed makes an old file meaningless.

export interface Progress { fleetNow: string; nodes: Record<string, string> }

export function readProgress({ file, fleetNow }: { file: string; fleetNow: string }): Record<string, Date> {
  if (!existsSync(file)) return {};
  try {
    const p = JSON.parse(readFileSync(file, 'utf8')) as Progress;
    if (p.fleetNow !== fleetNow) return {};
    return Object.fromEntries(Object.entries(p.nodes ?? {}).map(([id, iso]) => [id, new Date(iso)]));
  } catch {
    return {}; // unreadable: resend; the server counts repeats as duplicates
  }
}

export function writeProgress({ file, fleetNow, nodes }: { file: string; fleetNow: string; nodes: Record<string, Date | null> }): void {
  const entries = Object.entries(nodes).filter((e): e is [string, Date] => e[1] !== null);
  const body: Progress = { fleetNow, nodes: Object.fromEntries(entries.map(([id, at]) => [id, at.toISOString()])) };
  // Write then rename, so a stop half-way through never leaves a torn file.
  writeFileSync(`${file}.tmp`, JSON.stringify(body, null, 2));
  renameSync(`${file}.tmp`, file);
}
