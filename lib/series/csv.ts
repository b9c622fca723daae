import { formatInTimeZone, TIME_PATTERNS } from '../format/time';
import type { NightRowWire } from './wire';

/**
 * CSV for the exports (RFC 4180: comma-separated, CRLF line ends, a header line). Instants in
 * RFC 3339 UTC so a spreadsheet in any zone reads them the same; the night table adds the
 * site's local times beside them.
 */
export const CRLF = '\r\n';

export const READINGS_CSV_HEADER = ['t', 'v_reported', 'v_calibrated', 'vp', 'temp_c', 'rssi_dbm', 'seq'];

export interface ReadingCsvRow {
  t: Date;
  v: number;
  vp: number | null;
  temp_c: number | null;
  rssi_dbm: number | null;
  seq: number | null;
}

function cell(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return '';
  const text = typeof value === 'number' ? (Number.isFinite(value) ? String(value) : '') : value;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvLine(values: (string | number | null | undefined)[]): string {
  return values.map(cell).join(',') + CRLF;
}

// FLOAT columns come back as doubles with float noise (4.9 → 4.900000095367432): six
// significant figures is what a 32-bit float holds.
const fromFloat = (x: number | null) => (x === null ? null : Number(x.toPrecision(6)));

export function readingCsvLine({ row, calibrate }: { row: ReadingCsvRow; calibrate: (volts: number) => number }): string {
  const v = fromFloat(row.v)!;
  return csvLine([new Date(row.t).toISOString(), v, Number(calibrate(v).toFixed(5)), fromFloat(row.vp), fromFloat(row.temp_c), row.rssi_dbm, row.seq]);
}

export const NIGHTS_CSV_HEADER = [
  'dusk_utc', 'dawn_utc', 'dusk_local', 'dawn_local', 'complete', 'readings', 'dusk_volts', 'dawn_volts',
  'dusk_energy_j', 'dawn_energy_j', 'min_volts', 'measured_w', 'modelled_w', 'draw_ratio', 'margin_at_dusk', 'margin_draw_scale', 'projected_brownout_utc', 'quiet_from_utc', 'quiet_volts',
];

export function nightsCsv({ nights, timeZone }: { nights: NightRowWire[]; timeZone: string }): string {
  const iso = (s: number | null) => (s === null ? null : new Date(s * 1000).toISOString());
  const local = (s: number) => formatInTimeZone(new Date(s * 1000), timeZone, TIME_PATTERNS.file);
  const fixed = (x: number | null, digits: number) => (x === null ? null : Number(x.toFixed(digits)));
  let out = csvLine(NIGHTS_CSV_HEADER);
  for (const n of nights) {
    out += csvLine([
      iso(n.dusk_at), iso(n.dawn_at), local(n.dusk_at), local(n.dawn_at), n.complete ? 'yes' : 'no', n.readings,
      fixed(n.dusk_volts, 4), fixed(n.dawn_volts, 4), fixed(n.dusk_energy_joules, 2), fixed(n.dawn_energy_joules, 2), fixed(n.min_volts, 4),
      fixed(n.measured_watts, 7), fixed(n.modelled_watts, 7), fixed(n.draw_ratio, 3), fixed(n.margin_at_dusk, 3), fixed(n.margin_draw_scale, 3), iso(n.projected_brownout_at), iso(n.quiet_from), fixed(n.quiet_volts, 4),
    ]);
  }
  return out;
}
