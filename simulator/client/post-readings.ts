import type { SimReading } from '../physics/types';
import { parseRetryAfterSeconds } from './backoff';

// One POST /api/v1/readings through the public contract (DESIGN.md §5), its reply sorted into
// what the sender must do next. Nothing here retries or keeps state.

export type FetchLike = (url: string, init: RequestInit) => Promise<Response>;

export interface WireReading { t: string; v: number; seq: number; vp: number; temp: number; rssi: number }

export type PostOutcome =
  | { kind: 'acked'; accepted: number; duplicates: number; state: string | null; nextReportSeconds: number | null; countsKnown: boolean }
  /** 5xx, network error, timeout or an unexpected status: keep the readings, try again later. */
  | { kind: 'retry'; reason: string; retryAfterSeconds: number | null }
  /** 429: the readings are fine, the node is posting too fast. */
  | { kind: 'slow-down'; retryAfterSeconds: number | null }
  /** Any other 4xx: these readings (or the items named by the pointers) will never succeed. */
  | { kind: 'rejected'; status: number; title: string; detail: string; badIndexes: number[] | null }
  /** The simulator itself is stopping. */
  | { kind: 'aborted' };

export function toWireReading(r: SimReading): WireReading {
  return { t: r.t.toISOString(), v: r.v, seq: r.seq, vp: r.vp, temp: r.temp, rssi: r.rssi };
}

export function buildReadingsUrl(baseUrl: string): string {
  return `${baseUrl.replace(/\/+$/, '')}/api/v1/readings`;
}

export async function postReadings({ url, token, readings, fetchImpl = fetch, timeoutMs, stopSignal }: {
  url: string; token: string; readings: WireReading[]; fetchImpl?: FetchLike; timeoutMs: number; stopSignal?: AbortSignal;
}): Promise<PostOutcome> {
  const timeout = AbortSignal.timeout(timeoutMs);
  const signal = stopSignal ? AbortSignal.any([stopSignal, timeout]) : timeout;
  let res: Response;
  try {
    res = await fetchImpl(url, {
      method: 'POST',
      headers: { 'content-type': 'application/json', authorization: `Bearer ${token}`, accept: 'application/json' },
      body: JSON.stringify({ readings }),
      // Only the URL we were given: a redirect elsewhere is treated as a failure, not followed.
      redirect: 'manual',
      signal,
    });
  } catch (e) {
    if (stopSignal?.aborted) return { kind: 'aborted' };
    return { kind: 'retry', reason: timeout.aborted ? 'timeout' : 'network', retryAfterSeconds: null };
  }
  const retryAfterSeconds = parseRetryAfterSeconds({ header: res.headers.get('retry-after') });
  const body = await readJson(res, stopSignal);
  if (body === ABORTED) return { kind: 'aborted' };
  if (res.status >= 200 && res.status < 300) return readAck(body, readings.length);
  if (res.status === 429) return { kind: 'slow-down', retryAfterSeconds };
  if (res.status >= 400 && res.status < 500) {
    const problem = (body ?? {}) as { title?: unknown; detail?: unknown; errors?: unknown };
    return {
      kind: 'rejected', status: res.status, title: String(problem.title ?? res.statusText), detail: String(problem.detail ?? ''),
      badIndexes: res.status === 422 ? readBadIndexes(problem.errors) : null,
    };
  }
  return { kind: 'retry', reason: String(res.status), retryAfterSeconds };
}

const ABORTED = Symbol('aborted');

async function readJson(res: Response, stopSignal?: AbortSignal): Promise<unknown> {
  try {
    return JSON.parse(await res.text());
  } catch {
    return stopSignal?.aborted ? ABORTED : null;
  }
}

/** A 2xx means committed (DESIGN.md §5), even if its body cannot be read. */
function readAck(body: unknown, sentCount: number): PostOutcome {
  const b = (body ?? {}) as { accepted?: unknown; duplicates?: unknown; state?: unknown; next_report_s?: unknown };
  const countsKnown = Number.isInteger(b.accepted) && Number.isInteger(b.duplicates);
  const next = Number(b.next_report_s);
  return {
    kind: 'acked',
    accepted: countsKnown ? Number(b.accepted) : sentCount,
    duplicates: countsKnown ? Number(b.duplicates) : 0,
    state: typeof b.state === 'string' ? b.state : null,
    nextReportSeconds: Number.isFinite(next) && next > 0 ? next : null,
    countsKnown,
  };
}

/** Item indexes named by 422 pointers such as /readings/3/v; null when none can be read. */
function readBadIndexes(errors: unknown): number[] | null {
  if (!Array.isArray(errors)) return null;
  const indexes = new Set<number>();
  for (const e of errors) {
    const m = /^\/readings\/(\d+)(\/|$)/.exec(String((e as { pointer?: unknown })?.pointer ?? ''));
    if (!m) return null; // a problem with the whole post, not with one item
    indexes.add(Number(m[1]));
  }
  return indexes.size ? [...indexes].sort((a, b) => a - b) : null;
}
