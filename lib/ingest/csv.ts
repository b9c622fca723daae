import { CSV_FIELDS } from '../schemas/reading';

/**
 * CSV of the contract: a header line naming the fields (t, v, seq, vp, temp, rssi), then one
 * reading a line. Empty cells mean "absent". Numbers stay numbers; `t` stays text unless it
 * is plain Unix seconds.
 */
export type CsvHeader = { fields: string[] } | { error: string };

export function parseCsvHeader(line: string): CsvHeader {
  const fields = line.replace(/^\uFEFF/, '').split(',').map((f) => f.trim().toLowerCase());
  const unknown = fields.filter((f) => !(CSV_FIELDS as readonly string[]).includes(f));
  if (unknown.length) return { error: `Unknown column(s) ${unknown.join(', ')}; use ${CSV_FIELDS.join(', ')}.` };
  if (new Set(fields).size !== fields.length) return { error: 'A column is named twice.' };
  if (!fields.includes('v')) return { error: 'The header must name the v column (bank volts).' };
  return { fields };
}

export function csvLineToObject(fields: string[], line: string): Record<string, unknown> | { error: string } {
  const cells = line.split(',');
  if (cells.length !== fields.length) return { error: `Expected ${fields.length} cells, found ${cells.length}.` };
  const out: Record<string, unknown> = {};
  fields.forEach((field, i) => {
    const cell = cells[i].trim();
    if (cell === '') return;
    if (field === 't' && !/^-?\d+(\.\d+)?$/.test(cell)) out.t = cell;
    else out[field] = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(cell) ? Number(cell) : cell;
  });
  return out;
}

/**
 * Words for a line that seems to use another separator than the comma (a spreadsheet saved in
 * a locale with a decimal comma writes `t;v` and `4,80`), or null. No cell of the contract can
 * hold a semicolon or a tab, so either one in a line means a different separator.
 * Only the import uses this; the device contract's CSV messages are unchanged.
 */
export function separatorHint(line: string): string | null {
  const name = line.includes(';') ? 'semicolons (;)' : line.includes('\t') && !line.includes(',') ? 'tabs' : null;
  if (!name) return null;
  return `The file seems to use ${name} between columns. Save it with commas between columns and a decimal point in numbers (4.80, not 4,80).`;
}
