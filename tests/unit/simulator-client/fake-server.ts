import type { FetchLike } from '../../../simulator/client/post-readings';
import type { SimReading } from '../../../simulator/physics/types';

// A stand-in for POST /api/v1/readings that keeps what it stored, so a test can check that
// nothing was lost or stored twice. `script` decides each answer in turn.

export type Answer =
  | { status: 200; nextReportSeconds?: number }
  | { status: number; retryAfter?: string; body?: unknown; storeFirst?: boolean }
  | 'network'
  | 'hang';

export interface FakeServer {
  fetch: FetchLike;
  stored: Map<number, { v: number; seq: number }>;
  posts: { at: number; count: number; status: number | string }[];
  /** Duplicates reported in 200 replies. */
  duplicates: number;
  requests: { url: string; init: RequestInit }[];
}

export function createFakeServer(script: (postIndex: number) => Answer): FakeServer {
  const server: FakeServer = { stored: new Map(), posts: [], duplicates: 0, requests: [], fetch: null as unknown as FetchLike };
  const store = (items: { t: string; v: number; seq: number }[]) => {
    let accepted = 0;
    for (const r of items) {
      const ms = Date.parse(r.t);
      if (server.stored.has(ms)) continue;
      server.stored.set(ms, { v: r.v, seq: r.seq });
      accepted += 1;
    }
    return accepted;
  };
  server.fetch = async (url, init) => {
    server.requests.push({ url, init });
    const items = (JSON.parse(String(init.body)) as { readings: { t: string; v: number; seq: number }[] }).readings;
    const answer = script(server.posts.length);
    const status = typeof answer === 'string' ? answer : answer.status;
    server.posts.push({ at: Date.now(), count: items.length, status });
    if (answer === 'network') throw new TypeError('fetch failed');
    if (answer === 'hang') {
      return new Promise<Response>((_, reject) => {
        init.signal?.addEventListener('abort', () => reject(new DOMException('aborted', 'AbortError')));
      });
    }
    if (answer.status === 200) {
      const accepted = store(items);
      server.duplicates += items.length - accepted; // as reported to the client
      const reply = { accepted, duplicates: items.length - accepted, state: 'steady', next_report_s: (answer as { nextReportSeconds?: number }).nextReportSeconds ?? 600 };
      return Response.json(reply);
    }
    const a = answer as { status: number; retryAfter?: string; body?: unknown; storeFirst?: boolean };
    // storeFirst: the commit happened but the answer was lost (the "uncertain" case).
    if (a.storeFirst) store(items);
    const headers: Record<string, string> = { 'content-type': 'application/problem+json' };
    if (a.retryAfter !== undefined) headers['retry-after'] = a.retryAfter;
    return new Response(JSON.stringify(a.body ?? { type: 'about:blank', title: 'Failed', status: a.status }), { status: a.status, headers });
  };
  return server;
}

/** Readings one minute apart, as the physics would hand them over. */
export function makeReadings({ count, fromMs = Date.UTC(2026, 11, 1, 20), startSeq = 1 }: { count: number; fromMs?: number; startSeq?: number }): SimReading[] {
  return Array.from({ length: count }, (_, i) => ({
    t: new Date(fromMs + i * 60_000), v: 4.5 - i * 1e-4, vp: 0, temp: -1.5, rssi: -70, seq: startSeq + i,
  }));
}

export async function waitUntil(check: () => boolean, timeoutMs = 5000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (!check()) {
    if (Date.now() > until) throw new Error('condition not reached in time');
    await new Promise((r) => setTimeout(r, 5));
  }
}
