import { describe, expect, it } from 'vitest';
import { bankNotes, converterNotes } from '@/components/settings/compute-node';
import { bodyFromForm, formFromBody, NEW_NODE } from '@/components/settings/node-fields';
import { inFieldUnits } from '@/lib/client/api';
import { pointersFromZod } from '@/lib/errors';
import { bankSchema, loadSchema, siteModelSchema } from '@/lib/schemas/model';

// Our own wording rules for form errors (no outside source).
const detailsOf = (result: { success: boolean; error?: unknown }) =>
  result.success ? [] : pointersFromZod(result.error as Parameters<typeof pointersFromZod>[0]).map((p) => `${p.pointer} ${p.detail}`);

describe('field errors in plain words', () => {
  it('a range check without its own message reads as words, not as the validator’s default', () => {
    const load = { sleep_amps: 0, awake_seconds: 1, awake_amps: 0.01, burst_seconds: 0, burst_amps: 0, interval_seconds: 0, max_interval_seconds: 600 };
    expect(detailsOf(loadSchema.safeParse(load))).toEqual(['/interval_seconds At least 1 s.']);
    const bank = { cells_series: 2, cells_parallel: 1, cell_farads: 1, cell_rated_volts: 11, cell_esr_ohms: 0.1, cell_leakage_amps: 0 };
    expect(detailsOf(bankSchema.safeParse(bank))).toEqual(['/cell_rated_volts Must be at most 10 V.']);
    // a limit written without its own words still reads as words
    expect(detailsOf(bankSchema.safeParse({ ...bank, cell_rated_volts: 2.7, cells_series: 0 }))).toEqual(['/cells_series At least 1 cell.']);
  });

  it('a number out of range is not called “not a number”; a missing one is', () => {
    expect(detailsOf(siteModelSchema.safeParse({ lat: 95, lon: 0 }))).toEqual(['/lat Latitude is between −90° and 90°.']);
    expect(detailsOf(siteModelSchema.safeParse({ lat: 'north', lon: 0 }))).toEqual(['/lat Enter a number (°).']);
  });

  it('a bound sent as a fraction is said in the field’s own unit', () => {
    expect(inFieldUnits('Must be at most 1.', { scale: 0.01, unit: '%' })).toBe('Must be at most 100 %.');
    expect(inFieldUnits('Must be above 0.', { scale: 0.01, unit: '%' })).toBe('Must be above 0 %.');
    expect(inFieldUnits('Must be at most 10.', { scale: 1e-6, unit: 'µA' })).toBe('Must be at most 10000000 µA.');
    expect(inFieldUnits('Enter a number (0..1).', { scale: 0.01, unit: '%' })).toBe('Enter a number (%).');
    expect(inFieldUnits('Whole cells only.', { scale: 0.01, unit: '%' })).toBe('Whole cells only.');
    // a limit without a unit gets the field's; one in SI is rescaled to the field's unit
    expect(inFieldUnits('Must be at most 90.', { scale: 1, unit: '°' })).toBe('Must be at most 90°.');
    expect(inFieldUnits('Must be at most 10 A.', { scale: 1e-3, unit: 'mA' })).toBe('Must be at most 10000 mA.');
    expect(inFieldUnits('Must be above 0 A.', { scale: 1e-3, unit: 'mA' })).toBe('Must be above 0 mA.');
    expect(inFieldUnits('Must not be negative.', { scale: 1e-6, unit: 'µA' })).toBe('Must not be negative.');
    expect(inFieldUnits('Must be at most 100 ×.', { scale: 1, unit: '×' })).toBe('Must be at most 100 ×.');
  });
});

describe('bank notes beside the node form', () => {
  const bank = { cells_series: 2, cells_parallel: 1, cell_farads: 25, cell_rated_volts: 2.7, cell_esr_ohms: 0.03, cell_leakage_amps: 12e-6 };
  it('a usual double-layer cell gets none (common practice, from memory: 2.3–3.0 V a cell)', () => {
    expect(bankNotes(bank)).toEqual([]);
  });
  it('a module voltage typed as a cell rating, a lithium-ion capacitor, and an ESR of 0 Ω are pointed out', () => {
    expect(bankNotes({ ...bank, cell_rated_volts: 9 })).toEqual([expect.stringMatching(/more than one supercapacitor cell/)]);
    expect(bankNotes({ ...bank, cell_rated_volts: 3.8 })).toEqual([expect.stringMatching(/lithium-ion capacitor/)]);
    expect(bankNotes({ ...bank, cell_esr_ohms: 0 })).toEqual([expect.stringMatching(/ESR of 0 Ω/)]);
    expect(bankNotes({ ...bank, cell_rated_volts: 'x' })).toEqual([]);
  });
});

describe('converter notes beside the node form and the planner', () => {
  const converter = { start_volts: 0.9, cutoff_volts: 0.5, output_volts: 3.3, efficiency: 0.85, input_limit_amps: 1.5 };
  it('outputs inside the usual 1.8–4 V of low-voltage boost parts get none (common practice, DESIGN.md §1)', () => {
    for (const output_volts of [1.8, 3.3, 4]) expect(converterNotes({ ...converter, output_volts })).toEqual([]);
  });
  it('an output below or above that range is pointed out with its value', () => {
    expect(converterNotes({ ...converter, output_volts: 1.2 })).toEqual([expect.stringMatching(/output of 1\.2 V is outside the usual 1\.8–4 V/)]);
    expect(converterNotes({ ...converter, output_volts: 5 })).toEqual([expect.stringMatching(/output of 5 V/)]);
    expect(converterNotes({ ...converter, output_volts: -1 })).toEqual([]);
  });
});

describe('node form units', () => {
  it('currents in µA and mA, ESR in mΩ and efficiency in % go out as SI and come back unchanged', () => {
    const body = { ...NEW_NODE, name: 'n', site_id: 1, converter: { ...NEW_NODE.converter, efficiency: [[1, 0.7], [3, 0.88]] as [number, number][] } };
    const form = formFromBody(body);
    expect(form.values['load.sleep_amps']).toBe('20'); // 0.00002 A = 20 µA
    expect(form.values['load.burst_amps']).toBe('120'); // 0.12 A = 120 mA
    expect(form.values['bank.cell_esr_ohms']).toBe('15'); // 0.015 Ω = 15 mΩ
    expect(form.efficiency.rows.map((r) => r.eta)).toEqual(['70', '88']);
    const back = bodyFromForm(form.values, form.efficiency) as typeof body;
    expect(back.load).toEqual(body.load);
    expect(back.bank).toEqual(body.bank);
    expect(back.converter.efficiency).toEqual([[1, 0.7], [3, 0.88]]);
  });
});
