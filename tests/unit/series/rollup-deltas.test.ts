import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { deltaRows, ROLLUP_BUCKETS_SECONDS } from '@/lib/db/queries/rollups';

// The hot path's bucket fold against the plain definition of a rollup bucket: every reading
// whose time falls in [start, start + size) counted, min, max, sum, the value of the latest one
// and the highest panel volts. Readings come in time order, shuffled, or with repeats of one
// bucket far apart, as a backlog can arrive.
const reading = (base: number) => fc.record({
  t: fc.integer({ min: base, max: base + 3 * 86_400_000 }).map((ms) => new Date(ms)),
  v: fc.double({ min: -1, max: 100, noNaN: true }),
  vp: fc.option(fc.double({ min: -1, max: 100, noNaN: true })),
});
const post = fc.record({ nodeId: fc.integer({ min: 1, max: 4 }), readings: fc.array(reading(Date.UTC(2026, 10, 30)), { minLength: 1, maxLength: 60 }) })
  .chain((p) => fc.boolean().map((sorted) => (sorted ? { ...p, readings: [...p.readings].sort((a, b) => a.t.getTime() - b.t.getTime()) } : p)));

function plainRows(posts: { nodeId: number; readings: { t: Date; v: number; vp: number | null }[] }[]) {
  const all = posts.flatMap((p) => p.readings.map((r) => ({ node: p.nodeId, ...r })));
  const keys = new Set<string>();
  for (const r of all) for (const size of ROLLUP_BUCKETS_SECONDS) keys.add(`${r.node}/${size}/${Math.floor(r.t.getTime() / 1000 / size) * size}`);
  return [...keys].map((key) => key.split('/').map(Number)).sort((a, b) => a[0] - b[0] || ROLLUP_BUCKETS_SECONDS.indexOf(a[1] as 300) - ROLLUP_BUCKETS_SECONDS.indexOf(b[1] as 300) || a[2] - b[2])
    .map(([node, bucket, start]) => {
      const inside = all.filter((r) => r.node === node && r.t.getTime() >= start * 1000 && r.t.getTime() < (start + bucket) * 1000);
      const latest = inside.reduce((a, b) => (b.t.getTime() > a.t.getTime() ? b : a));
      const vps = inside.flatMap((r) => (r.vp === null ? [] : [r.vp]));
      return {
        node, bucket, start, n: inside.length, min: Math.min(...inside.map((r) => r.v)), max: Math.max(...inside.map((r) => r.v)),
        last: latest.v, tLast: latest.t.getTime(), vpMax: vps.length ? Math.max(...vps) : null,
      };
    });
}

describe('deltaRows', () => {
  it('folds readings into the buckets the plain definition gives', () => {
    fc.assert(fc.property(fc.array(post, { minLength: 1, maxLength: 5 }), (posts) => {
      const rows = deltaRows(posts);
      const plain = plainRows(posts);
      expect(rows.map(({ sum: _sum, ...rest }) => rest)).toEqual(plain);
      // Sums in another order differ in the last bits only.
      rows.forEach((row, i) => {
        const inside = posts.flatMap((p) => (p.nodeId === row.node ? p.readings : [])).filter((r) => Math.floor(r.t.getTime() / 1000 / row.bucket) * row.bucket === row.start);
        expect(row.sum).toBeCloseTo(inside.reduce((a, r) => a + r.v, 0), 6);
        expect(row.n).toBe(plain[i].n);
      });
    }), { numRuns: 300 });
  });
});
