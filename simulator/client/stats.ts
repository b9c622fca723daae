// Counters of one sender, and their sum over a fleet. Readings, not posts, unless named so.

export interface SenderStats {
  /** Readings the physics handed to the queue. */
  emitted: number;
  /** Readings put into posts, retries included (so sent ≥ acked). */
  sent: number;
  /** Readings in posts the server answered 2xx (stored now or before). */
  acked: number;
  accepted: number;
  duplicates: number;
  /** Readings given up after a 4xx other than 429 (they would never succeed). */
  dropped: number;
  /** Readings waiting, in flight included. */
  queued: number;
  posts: number;
  /** 2xx replies whose accepted + duplicates differed from what was sent. */
  mismatches: number;
  /** Failed posts by status, or `network` / `timeout`. */
  errors: Record<string, number>;
}

export function createStats(): SenderStats {
  return { emitted: 0, sent: 0, acked: 0, accepted: 0, duplicates: 0, dropped: 0, queued: 0, posts: 0, mismatches: 0, errors: {} };
}

export function addStats({ into, from }: { into: SenderStats; from: SenderStats }): SenderStats {
  for (const key of ['emitted', 'sent', 'acked', 'accepted', 'duplicates', 'dropped', 'queued', 'posts', 'mismatches'] as const) {
    into[key] += from[key];
  }
  for (const [reason, n] of Object.entries(from.errors)) into.errors[reason] = (into.errors[reason] ?? 0) + n;
  return into;
}

export function sumStats(list: SenderStats[]): SenderStats {
  return list.reduce((into, from) => addStats({ into, from }), createStats());
}

/** One line for a log: "sent 120 acked 118 queued 2 dropped 0 errors 503×3 network×1". */
export function formatStats(s: SenderStats): string {
  const errors = Object.entries(s.errors).map(([k, n]) => `${k}×${n}`).join(' ') || 'none';
  return `emitted ${s.emitted} sent ${s.sent} acked ${s.acked} (new ${s.accepted}, dup ${s.duplicates}) queued ${s.queued} dropped ${s.dropped} · errors ${errors}`;
}
