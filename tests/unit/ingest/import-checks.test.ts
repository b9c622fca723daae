import { describe, expect, it } from 'vitest';
import { csvLineToObject, parseCsvHeader, separatorHint } from '@/lib/ingest/csv';
import { bankVoltsProblem, IMPORT_OVER_RATING_FRACTION } from '@/lib/ingest/import-bank-check';
import { importReason, importStatus, importWord, type ImportOutcomeInput } from '@/lib/ingest/import-outcome';
import { createCredentialBody } from '@/lib/schemas/credential';

// Two 2.7 V cells in series: a 5.40 V bank (DESIGN.md §3, V_max = ns·Vr; derived here).
const bank = { cells_series: 2, cell_rated_volts: 2.7, cal_gain: 1, cal_offset_volts: 0 };

describe('bank volts of an imported line', () => {
  it('accepts volts up to the rating plus the tolerance, refuses above it with both figures in V', () => {
    expect(IMPORT_OVER_RATING_FRACTION).toBe(0.1); // common practice: see the module's comment
    expect(bankVoltsProblem({ bank, reportedVolts: 5.4 })).toBeNull();
    expect(bankVoltsProblem({ bank, reportedVolts: 5.94 })).toBeNull(); // 110 % of 5.40 V
    const words = bankVoltsProblem({ bank, reportedVolts: 6.5 });
    expect(words).toContain('6.50 V');
    expect(words).toContain('5.40 V');
    expect(words).toContain('2 × 2.70 V');
    expect(bankVoltsProblem({ bank, reportedVolts: 4800 })).toContain('millivolts');
  });

  it('refuses negative volts and accepts 0 V (a drained bank)', () => {
    expect(bankVoltsProblem({ bank, reportedVolts: 0 })).toBeNull();
    expect(bankVoltsProblem({ bank, reportedVolts: -0.2 })).toContain('-0.20 V is below 0 V');
  });

  it('judges the calibrated figure and says both', () => {
    const gained = { ...bank, cal_gain: 1.2 };
    // 5.00 V reported × 1.2 = 6.00 V true, over 5.94 V (derived here).
    const words = bankVoltsProblem({ bank: gained, reportedVolts: 5 });
    expect(words).toContain('5.00 V (6.00 V after this node');
    expect(bankVoltsProblem({ bank: { ...bank, cal_offset_volts: 0.05 }, reportedVolts: -0.02 })).toBeNull();
  });
});

describe('separator hint', () => {
  it('names semicolons and tabs, and stays quiet for the contract CSV', () => {
    expect(separatorHint('t;v;vp')).toContain('semicolons');
    expect(separatorHint('t;v;vp')).toContain('decimal point');
    expect(separatorHint('2026-12-01T21:30:00Z;4,80')).toContain('semicolons');
    expect(separatorHint('t\tv')).toContain('tabs');
    expect(separatorHint('t,v,vp')).toBeNull();
    expect(separatorHint('2026-12-01T21:30:00Z,4.80')).toBeNull();
  });

  it('leaves the device contract’s CSV parsing as it was', () => {
    expect(parseCsvHeader('t;v')).toEqual({ error: 'Unknown column(s) t;v; use t, v, seq, vp, temp, rssi.' });
    expect(csvLineToObject(['t', 'v'], '1764624600,4.8')).toEqual({ t: 1764624600, v: 4.8 });
  });
});

describe('import outcome words', () => {
  const base: ImportOutcomeInput = { status: 'done', lines: 3, accepted: 0, duplicates: 0, rejected: 3, rejections: [{ line: 2, reason: 'v: 9.00 V is more than 10 % above …' }] };

  it('an import that stored nothing is failed, "nothing imported", with the first reason', () => {
    expect(importStatus(base)).toBe('failed');
    expect(importWord(base)).toBe('nothing imported');
    expect(importReason(base)).toBe('None of the 3 lines could be stored. Line 2: v: 9.00 V is more than 10 % above …');
  });

  it('a file-level reason wins; a header-only file says so', () => {
    expect(importReason({ ...base, status: 'failed', lines: 0, rejected: 1, rejections: [{ line: 1, reason: 'The file seems to use semicolons' }] })).toBe('The file seems to use semicolons');
    expect(importReason({ ...base, status: 'failed', lines: 0, rejected: 0, rejections: [] })).toBe('The file has a header line but no readings.');
  });

  it('all duplicates is done but "nothing new"; a plain success has no reason', () => {
    const again = { ...base, accepted: 0, duplicates: 3, rejected: 0, rejections: [] };
    expect(importStatus(again)).toBe('done');
    expect(importWord(again)).toBe('nothing new');
    expect(importReason(again)).toContain('already stored');
    const good = { ...base, accepted: 2, rejected: 1 };
    expect(importWord(good)).toBe('done');
    expect(importReason(good)).toBeNull();
    expect(importWord({ ...base, status: 'failed', accepted: 5 })).toBe('failed');
    expect(importWord({ ...base, status: 'running' })).toBe('running');
  });
});

describe('credential label', () => {
  it('is required once trimmed, one line, at most the column width', () => {
    expect(createCredentialBody.safeParse({ label: '' }).success).toBe(false);
    expect(createCredentialBody.safeParse({ label: '   ' }).success).toBe(false);
    expect(createCredentialBody.safeParse({}).success).toBe(false);
    expect(createCredentialBody.safeParse({ label: 'a\nb' }).success).toBe(false);
    expect(createCredentialBody.safeParse({ label: 'x'.repeat(121) }).success).toBe(false);
    expect(createCredentialBody.parse({ label: '  logger rev B ' })).toEqual({ label: 'logger rev B' });
  });
});
