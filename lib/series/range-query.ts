import { z } from 'zod';
import { DEFAULT_BUCKETS, MAX_BUCKETS } from './buckets';

/**
 * ?from=&to= of the node page's API: Unix seconds, Unix milliseconds (a number over 10¹¹ reads
 * as ms) or an RFC 3339 instant. Absent: the last `defaultSeconds` up to now.
 */
const MAX_SPAN_SECONDS = 10 * 366 * 86_400;
const MS_THRESHOLD = 1e11; // 1e11 s is the year 5138; 1e11 ms is 1973

const RFC_3339 = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})$/i;

const instant = z.union([z.string(), z.number()]).transform((value, ctx) => {
  const text = String(value).trim();
  const numeric = /^\d+(\.\d+)?$/.test(text) ? Number(text) : null;
  const ms = numeric !== null ? (numeric > MS_THRESHOLD ? numeric : numeric * 1000) : RFC_3339.test(text) ? Date.parse(text) : NaN;
  if (!Number.isFinite(ms)) {
    ctx.addIssue({ code: 'custom', message: 'Use Unix seconds, Unix milliseconds or an RFC 3339 time.' });
    return z.NEVER;
  }
  return ms / 1000;
});

export const rangeQuery = z.object({
  from: instant.optional(),
  to: instant.optional(),
  buckets: z.coerce.number().int('Use a whole number of buckets.').min(10, 'Ask for 10 buckets or more.').max(MAX_BUCKETS, `At most ${MAX_BUCKETS} buckets.`).optional(),
  format: z.enum(['json', 'csv'], { message: 'Choose json or csv.' }).optional(),
  count: z.coerce.number().int().min(1, 'At least one night.').max(60, 'At most 60 nights.').optional(),
}).strict();

export interface ResolvedRange {
  fromSeconds: number;
  toSeconds: number;
  buckets: number;
}

/** Fills the defaults and checks the order; problems come back with a pointer into the query. */
export function resolveRange({ query, nowSeconds, defaultSeconds }: { query: z.infer<typeof rangeQuery>; nowSeconds: number; defaultSeconds: number }):
  { ok: true; range: ResolvedRange } | { ok: false; pointer: string; detail: string } {
  const toSeconds = query.to ?? nowSeconds;
  const fromSeconds = query.from ?? toSeconds - defaultSeconds;
  if (fromSeconds >= toSeconds) return { ok: false, pointer: '/query/from', detail: 'from must be before to.' };
  if (toSeconds - fromSeconds > MAX_SPAN_SECONDS) return { ok: false, pointer: '/query/to', detail: 'The range is at most ten years.' };
  return { ok: true, range: { fromSeconds, toSeconds, buckets: query.buckets ?? DEFAULT_BUCKETS } };
}
