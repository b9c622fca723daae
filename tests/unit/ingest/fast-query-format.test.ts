import fc from 'fast-check';
import mysql from 'mysql2';
import { describe, expect, it } from 'vitest';
import { fastQueryFormat } from '@/lib/db/fast-pool';

// The ingest pool skips mysql2's placeholder scan for statements sent without values; what
// reaches MariaDB must be exactly what mysql2's own format (the reference library) would send.
const sqlish = fc.string({ unit: fc.constantFrom('?', '??', "'", '"', '\\', '`', ' ', 'a', '1', ';', '\n', '-', '#', '/*', '*/') as fc.Arbitrary<string>, maxLength: 60 });

describe('fastQueryFormat', () => {
  it('sends a statement without values as mysql2 would, placeholders and quotes included', () => {
    fc.assert(fc.property(sqlish, (sql) => {
      expect(fastQueryFormat(sql, undefined, 'Z')).toBe(sql);
      expect(fastQueryFormat(sql, [], 'Z')).toBe(mysql.format(sql, [], false, 'Z'));
    }), { numRuns: 500 });
  });

  it('formats a statement with values exactly as mysql2 does', () => {
    const value = fc.oneof(fc.integer(), fc.double({ noNaN: true, noDefaultInfinity: true }), fc.string(), fc.constant(null),
      fc.integer({ min: 0, max: 4e12 }).map((ms) => new Date(ms)));
    fc.assert(fc.property(sqlish, fc.array(value, { minLength: 1, maxLength: 6 }), (sql, values) => {
      expect(fastQueryFormat(sql, values, 'Z')).toBe(mysql.format(sql, values as never[], false, 'Z'));
    }), { numRuns: 500 });
  });
});
