// When to try again. Retry-After (RFC 9110 §10.2.3) is either delay-seconds or an HTTP-date.

/** Seconds to wait from a Retry-After header, or null when it is absent or unreadable. */
export function parseRetryAfterSeconds({ header, nowMs = Date.now() }: { header: string | null; nowMs?: number }): number | null {
  if (header === null) return null;
  const text = header.trim();
  if (/^\d+$/.test(text)) return Number(text);
  const at = Date.parse(text);
  if (Number.isNaN(at)) return null;
  return Math.max(0, Math.ceil((at - nowMs) / 1000));
}

/**
 * Exponential backoff with jitter: base·2^(failures−1), capped, then scaled into [½, 1] so a
 * fleet that failed together does not come back together (common practice).
 */
export function computeBackoffMs({ failures, baseMs, maxMs, random = Math.random }: {
  failures: number; baseMs: number; maxMs: number; random?: () => number;
}): number {
  const exponential = Math.min(maxMs, baseMs * 2 ** Math.max(0, failures - 1));
  return Math.round(exponential * (0.5 + random() * 0.5));
}

/** The server's Retry-After, stretched by up to a fifth so that retries spread out. */
export function computeRetryAfterMs({ seconds, random = Math.random }: { seconds: number; random?: () => number }): number {
  return Math.round(seconds * 1000 * (1 + random() * 0.2));
}
