import { pointersFromZod, problems } from '../errors';
import { rangeQuery, resolveRange, type ResolvedRange } from './range-query';

/** The query string of a node page route → a checked range, or a 422 naming the bad parameter. */
export function parseRangeQuery({ request, defaultSeconds, now = new Date() }: { request: Request; defaultSeconds: number; now?: Date }): ResolvedRange & { format: 'json' | 'csv'; count?: number } {
  const parsed = rangeQuery.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!parsed.success) throw problems.invalid(pointersFromZod(parsed.error, '/query'), 'Some parameters are not valid.');
  const resolved = resolveRange({ query: parsed.data, nowSeconds: now.getTime() / 1000, defaultSeconds });
  if (!resolved.ok) throw problems.invalid([{ pointer: resolved.pointer, detail: resolved.detail }], 'Some parameters are not valid.');
  return { ...resolved.range, format: parsed.data.format ?? 'json', count: parsed.data.count };
}
