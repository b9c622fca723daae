/**
 * Per-node token bucket, per app instance: a steady allowance with room for a backlog burst.
 * A node that reports every few minutes never comes near it; one retrying a day of backlog
 * in batches of 1000 can send 60 posts at once and then two a second.
 */
const CAPACITY = 60;
const REFILL_PER_SECOND = 2;
const buckets = new Map<number, { tokens: number; at: number }>();

export function takeToken(nodeId: number, now = Date.now()): { ok: true } | { ok: false; retryAfterSeconds: number } {
  const b = buckets.get(nodeId) ?? { tokens: CAPACITY, at: now };
  b.tokens = Math.min(CAPACITY, b.tokens + ((now - b.at) / 1000) * REFILL_PER_SECOND);
  b.at = now;
  buckets.set(nodeId, b);
  if (b.tokens >= 1) {
    b.tokens -= 1;
    return { ok: true };
  }
  return { ok: false, retryAfterSeconds: Math.ceil((1 - b.tokens) / REFILL_PER_SECOND) };
}

export const RATE_LIMIT = { capacity: CAPACITY, refillPerSecond: REFILL_PER_SECOND };
