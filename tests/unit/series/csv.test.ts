import { describe, expect, it } from 'vitest';
import { csvLine, nightsCsv, NIGHTS_CSV_HEADER, readingCsvLine } from '@/lib/series/csv';
import { csvReadableStream, downloadName } from '@/lib/series/csv-stream';

describe('CSV lines (RFC 4180)', () => {
  it('quotes fields with commas, quotes or line breaks and ends lines with CRLF', () => {
    expect(csvLine(['a', 'b,c', 'say "hi"', null, 1.5])).toBe('a,"b,c","say ""hi""",,1.5\r\n');
  });

  it('writes a reading in UTC with both reported and calibrated volts', () => {
    const line = readingCsvLine({ row: { t: new Date('2026-12-01T10:00:00.250Z'), v: 4.900000095367432, vp: null, temp_c: -2.5, rssi_dbm: -70, seq: 7 }, calibrate: (v) => 1.004 * v - 0.003 });
    // derived here: 1.004·4.9 − 0.003 = 4.9166
    expect(line).toBe('2026-12-01T10:00:00.250Z,4.9,4.9166,,-2.5,-70,7\r\n');
  });

  it('writes one night a line under the header, local times in the site zone', () => {
    const csv = nightsCsv({ timeZone: 'America/Los_Angeles', nights: [{
      dusk_at: Date.parse('2026-12-01T00:30:00Z') / 1000, dawn_at: Date.parse('2026-12-01T16:00:00Z') / 1000, complete: true, readings: 90,
      dusk_reading_at: null, dawn_reading_at: null, dusk_volts: 4.2, dawn_volts: 3.1, dusk_energy_joules: 220.5, dawn_energy_joules: 120.1,
      min_volts: 3.1, measured_watts: 0.0021, modelled_watts: 0.0018, draw_ratio: 1.1667, margin_at_dusk: 2.5, margin_draw_scale: 1, projected_brownout_at: null,
      quiet_from: Date.parse('2026-12-01T11:15:00Z') / 1000, quiet_volts: 0.812,
    }] });
    const [header, row, end] = csv.split('\r\n');
    expect(header.split(',')).toEqual(NIGHTS_CSV_HEADER);
    // 00:30 UTC on 1 December is 16:30 PST on 30 November (UTC−8 in winter: common practice)
    expect(row.split(',').slice(0, 4)).toEqual(['2026-12-01T00:30:00.000Z', '2026-12-01T16:00:00.000Z', '2026-11-30 16:30 PST', '2026-12-01 08:00 PST']);
    expect(row.split(',').slice(-2)).toEqual(['2026-12-01T11:15:00.000Z', '0.812']);
    expect(end).toBe('');
  });
});

describe('csvReadableStream', () => {
  it('sends the header, then every row, and nothing is lost across chunk boundaries', async () => {
    async function* rows() { for (let i = 0; i < 1234; i++) yield i; }
    const stream = csvReadableStream({ header: ['i'], rows: rows(), toLine: (i) => `${i}\r\n` });
    const text = await new Response(stream).text();
    const lines = text.split('\r\n').filter(Boolean);
    expect(lines[0]).toBe('i');
    expect(lines).toHaveLength(1235);
    expect(lines.at(-1)).toBe('1233');
  });

  it('stops the source when the reader cancels', async () => {
    let destroyed = false;
    async function* rows() { for (let i = 0; ; i++) yield i; }
    const source = Object.assign(rows(), { destroy: () => { destroyed = true; } });
    const reader = csvReadableStream({ header: ['i'], rows: source, toLine: (i) => `${i}\r\n` }).getReader();
    await reader.read();
    await reader.read();
    await reader.cancel();
    expect(destroyed).toBe(true);
  });

  it('names downloads safely', () => {
    expect(downloadName({ nodeName: 'NF stage/1 "x"', suffix: 'nights' })).toBe('NF_stage_1_x_-nights.csv');
  });
});
