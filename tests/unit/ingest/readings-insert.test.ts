import fc from 'fast-check';
import mysql from 'mysql2';
import { describe, expect, it } from 'vitest';
import { readingsInsert } from '@/lib/ingest/store-fast';

// The hand-written INSERT must be exactly what mysql2's own escaping (the reference library)
// makes of the same rows, with times written as UTC.
const reading = fc.record({
  t: fc.integer({ min: Date.UTC(2025, 0, 1), max: Date.UTC(2027, 11, 31) }).map((ms) => new Date(ms)),
  v: fc.double({ min: -1, max: 100, noNaN: true }),
  vp: fc.option(fc.double({ min: -1, max: 100, noNaN: true })),
  temp: fc.option(fc.double({ min: -80, max: 150, noNaN: true })),
  rssi: fc.option(fc.integer({ min: -150, max: 20 })),
  seq: fc.option(fc.integer({ min: 0, max: 4_294_967_295 })),
});

describe('readingsInsert', () => {
  it('equals mysql2.format of the same rows and columns', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 2 ** 31 - 1 }), fc.array(reading, { minLength: 1, maxLength: 40 }), (nodeId, readings) => {
      const optional = [['vp', 'vp'], ['temp', 'temp_c'], ['rssi', 'rssi_dbm'], ['seq', 'seq']] as const;
      const present = optional.filter(([k]) => readings.some((r) => r[k] !== null));
      const rows = readings.map((r) => [nodeId, r.t, r.v, ...present.map(([k]) => r[k])]);
      const expected = mysql.format(`INSERT INTO readings (node_id, t, v${present.map(([, c]) => `, ${c}`).join('')}) VALUES ?`, [rows], false, 'Z');
      expect(readingsInsert(nodeId, readings)).toBe(expected);
    }), { numRuns: 500 });
  });

  it('leaves out optional columns no reading carries', () => {
    const sql = readingsInsert(3, [{ t: new Date(Date.UTC(2026, 11, 1, 21, 30)), v: 4.5, vp: null, temp: null, rssi: null, seq: null }]);
    expect(sql).toBe("INSERT INTO readings (node_id, t, v) VALUES (3, '2026-12-01 21:30:00.000', 4.5)");
  });

  it('refuses a value that is not a finite number', () => {
    expect(() => readingsInsert(3, [{ t: new Date(), v: Number.NaN, vp: null, temp: null, rssi: null, seq: null }])).toThrow(TypeError);
  });
});
