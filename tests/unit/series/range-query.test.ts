import { describe, expect, it } from 'vitest';
import { rangeQuery, resolveRange } from '@/lib/series/range-query';

describe('range query', () => {
  it('reads Unix seconds, Unix milliseconds and RFC 3339 as the same instant', () => {
    const s = rangeQuery.parse({ from: '1796000000', to: '1796000000000' });
    expect(s.from).toBe(1_796_000_000);
    expect(s.to).toBe(1_796_000_000);
    expect(rangeQuery.parse({ from: new Date(1_796_000_000_000).toISOString() }).from).toBe(1_796_000_000);
  });

  it('refuses what is not an instant, unknown parameters and too many buckets', () => {
    expect(rangeQuery.safeParse({ from: 'yesterday' }).success).toBe(false);
    expect(rangeQuery.safeParse({ since: '1' }).success).toBe(false);
    expect(rangeQuery.safeParse({ buckets: '5000' }).success).toBe(false);
  });

  it('defaults to the last span up to now, and wants from before to', () => {
    expect(resolveRange({ query: {}, nowSeconds: 1000, defaultSeconds: 100 })).toEqual({ ok: true, range: { fromSeconds: 900, toSeconds: 1000, buckets: 1000 } });
    expect(resolveRange({ query: { from: 10, to: 5 }, nowSeconds: 1000, defaultSeconds: 100 }).ok).toBe(false);
  });
});
