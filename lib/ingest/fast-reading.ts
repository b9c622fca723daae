import { MAX_AGE_DAYS, MAX_FUTURE_SECONDS } from '../schemas/reading';
import type { NormalizedReading } from './normalize';
import { rfc3339Ms } from './rfc3339';

/**
 * The ingest hot path's check of one reading: the same rules as `readingSchema` plus the
 * time window of `normalizeReading`, written out by hand because a batch of 500 spent most of
 * its validation time inside the schema library. It only ever says "valid, here it is" or
 * "not sure" (null): anything unusual goes to `normalizeReading`, which gives the messages.
 * tests/unit/fast-reading.test.ts checks with generated inputs that the two always agree.
 */
// The Date constructor as it was when this module loaded. The Node server loads the ingest
// route before Next (lib/server/serve.ts), whose server replaces the global Date with a wrapper
// that tracks clock reads for prerendering; that wrapper cost a measurable share of a batch's
// CPU here, one Date per reading, and ingest is never prerendered. The objects are the same.
const NativeDate = Date;

const finiteIn = (x: unknown, lo: number, hi: number): x is number => typeof x === 'number' && Number.isFinite(x) && x >= lo && x <= hi;
const wholeIn = (x: unknown, lo: number, hi: number): x is number => finiteIn(x, lo, hi) && Number.isInteger(x);

export function fastReading(raw: unknown, receivedAt: Date): NormalizedReading | null {
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) return null;
  const proto = Object.getPrototypeOf(raw);
  if (proto !== Object.prototype && proto !== null) return null;
  const r = raw as Record<string, unknown>;
  for (const key in r) {
    switch (key) {
      case 't': case 'v': case 'seq': case 'vp': case 'temp': case 'rssi': break;
      default: return null; // an unknown field: the schema path names it
    }
  }
  if (!finiteIn(r.v, -1, 100)) return null;
  if (r.seq !== undefined && !wholeIn(r.seq, 0, 4_294_967_295)) return null;
  if (r.vp !== undefined && !finiteIn(r.vp, -1, 100)) return null;
  if (r.temp !== undefined && !finiteIn(r.temp, -80, 150)) return null;
  if (r.rssi !== undefined && !wholeIn(r.rssi, -150, 20)) return null;
  let ms: number;
  if (r.t === undefined) ms = receivedAt.getTime();
  else if (typeof r.t === 'number') {
    if (!Number.isFinite(r.t) || r.t < 0) return null;
    ms = Math.round(r.t * 1000);
  } else if (typeof r.t === 'string') ms = rfc3339Ms(r.t);
  else return null;
  if (Number.isNaN(ms) || ms > receivedAt.getTime() + MAX_FUTURE_SECONDS * 1000 || ms < receivedAt.getTime() - MAX_AGE_DAYS * 86_400_000) return null;
  return {
    t: new NativeDate(ms), v: r.v,
    seq: (r.seq as number | undefined) ?? null, vp: (r.vp as number | undefined) ?? null,
    temp: (r.temp as number | undefined) ?? null, rssi: (r.rssi as number | undefined) ?? null,
  };
}
