import fc from 'fast-check';
import mysql from 'mysql2';
import { describe, expect, it } from 'vitest';
import { rollupDeltaSql, rollupDeltaStatementFor } from '@/lib/db/queries/rollups';

// The rollup deltas written out directly (the ingest hot path) must be exactly what mysql2's own
// escaping (the reference library) makes of the placeholder statement the careful path sends,
// with times written as UTC.
const reading = fc.record({
  t: fc.integer({ min: Date.UTC(2025, 0, 1), max: Date.UTC(2027, 11, 31) }).map((ms) => new Date(ms)),
  v: fc.double({ min: -1, max: 100, noNaN: true }),
  vp: fc.option(fc.double({ min: -1, max: 100, noNaN: true })),
});
const post = fc.record({ nodeId: fc.integer({ min: 1, max: 2 ** 31 - 1 }), readings: fc.array(reading, { minLength: 1, maxLength: 30 }) });

describe('rollupDeltaSql', () => {
  it('equals mysql2.format of the placeholder statement, for one post or several', () => {
    fc.assert(fc.property(fc.array(post, { minLength: 1, maxLength: 6 }), (posts) => {
      const statement = rollupDeltaStatementFor(posts)!;
      expect(rollupDeltaSql(posts)).toBe(mysql.format(statement.sql, statement.bindings, false, 'Z'));
    }), { numRuns: 300 });
  });

  it('writes nothing for posts without readings', () => {
    expect(rollupDeltaSql([{ nodeId: 1, readings: [] }])).toBeNull();
  });
});
