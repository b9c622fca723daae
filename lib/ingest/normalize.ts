import type { InvalidParam } from '../errors';
import { MAX_AGE_DAYS, MAX_FUTURE_SECONDS, readingSchema } from '../schemas/reading';
import { rfc3339Ms } from './rfc3339';

/** A validated reading, time resolved to a millisecond instant. */
export interface NormalizedReading {
  t: Date;
  v: number;
  seq: number | null;
  vp: number | null;
  temp: number | null;
  rssi: number | null;
}

function parseTime(t: string | number | undefined, receivedAt: Date): Date {
  if (t === undefined) return receivedAt;
  if (typeof t === 'number') return new Date(Math.round(t * 1000));
  return new Date(rfc3339Ms(t)); // NaN (an invalid Date) when it is not a real time
}

/** Validates one raw item; problems carry pointers under `pointer` (e.g. /readings/3). */
export function normalizeReading(raw: unknown, pointer: string, receivedAt: Date): { reading?: NormalizedReading; problems: InvalidParam[] } {
  const parsed = readingSchema.safeParse(raw);
  if (!parsed.success) {
    return { problems: parsed.error.issues.map((i) => ({ pointer: pointer + (i.path.length ? '/' + i.path.join('/') : ''), detail: i.message })) };
  }
  const r = parsed.data;
  const t = parseTime(r.t, receivedAt);
  if (Number.isNaN(t.getTime())) return { problems: [{ pointer: `${pointer}/t`, detail: 'Not a real date and time.' }] };
  if (t.getTime() > receivedAt.getTime() + MAX_FUTURE_SECONDS * 1000) {
    return { problems: [{ pointer: `${pointer}/t`, detail: 'More than 5 minutes ahead of the server clock: check the node clock.' }] };
  }
  if (t.getTime() < receivedAt.getTime() - MAX_AGE_DAYS * 86_400_000) {
    return { problems: [{ pointer: `${pointer}/t`, detail: `Older than ${MAX_AGE_DAYS} days.` }] };
  }
  return { reading: { t, v: r.v, seq: r.seq ?? null, vp: r.vp ?? null, temp: r.temp ?? null, rssi: r.rssi ?? null }, problems: [] };
}

/** No two readings share a time (a backlog usually comes in time order, checked first). */
export function distinctTimes(readings: NormalizedReading[]): boolean {
  let ascending = true;
  for (let i = 1; i < readings.length && ascending; i++) ascending = readings[i].t.getTime() > readings[i - 1].t.getTime();
  return ascending || new Set(readings.map((r) => r.t.getTime())).size === readings.length;
}
