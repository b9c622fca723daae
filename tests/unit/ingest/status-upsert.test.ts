import fc from 'fast-check';
import mysql from 'mysql2';
import { describe, expect, it } from 'vitest';
import { statusUpsertRows, statusUpsertSql } from '@/lib/ingest/status-upsert';

// The status upsert written out directly (the ingest hot path) must be exactly what mysql2's own
// escaping (the reference library) makes of the placeholder statement, with times as UTC.
const time = fc.integer({ min: Date.UTC(2025, 0, 1), max: Date.UTC(2027, 11, 31) }).map((ms) => new Date(ms));
const num = fc.option(fc.double({ min: -1e6, max: 1e6, noNaN: true }));
const status = fc.record({
  state: fc.constantFrom('steady', 'thin', 'short', 'dark', 'silent', 'new') as fc.Arbitrary<'steady'>,
  last_reading_at: fc.option(time), volts: num, panel_volts: num, energy_joules: num, soc: num, burst_floor_volts: num,
  reserve_joules: num, margin: num, load_watts: num, recharge_at: fc.option(time), brownout_at: fc.option(time),
  next_report_s: fc.option(fc.integer({ min: 1, max: 86_400 })), evaluated_at: time,
});
const row = fc.record({ nodeId: fc.integer({ min: 1, max: 2 ** 31 - 1 }), orgId: fc.integer({ min: 1, max: 1000 }), status });

describe('statusUpsertSql', () => {
  it('equals mysql2.format of the placeholder statement, for one node or several', () => {
    fc.assert(fc.property(fc.array(row, { minLength: 1, maxLength: 5 }), (rows) => {
      const statement = statusUpsertRows(rows);
      expect(statusUpsertSql(rows)).toBe(mysql.format(statement.sql, statement.bindings as never[], false, 'Z'));
    }), { numRuns: 300 });
  });

  it('writes the rows in node order', () => {
    const base = { state: 'steady', last_reading_at: null, volts: 4.5, panel_volts: null, energy_joules: null, soc: null, burst_floor_volts: null,
      reserve_joules: null, margin: null, load_watts: null, recharge_at: null, brownout_at: null, next_report_s: 600, evaluated_at: new Date(Date.UTC(2026, 11, 1)) } as const;
    const sql = statusUpsertSql([{ nodeId: 9, orgId: 1, status: base }, { nodeId: 2, orgId: 1, status: base }]);
    expect(sql.indexOf('(2, 1,')).toBeLessThan(sql.indexOf('(9, 1,'));
  });
});
