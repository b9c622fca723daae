import { averageOutputWatts, energyJoules, modelBank, reserveJoules, shortCircuitAmps, solveBurstFloor, usableJoules, type BankModel } from '@/lib/energy';
import { bankFromWire, bankSchema, converterFromWire, converterSchema, loadFromWire, loadSchema } from '@/lib/schemas/model';

/**
 * The figures shown beside the inputs as they are typed, from the pure energy model in the
 * browser. A figure appears only once the inputs it needs pass the same schemas the server uses.
 */
export interface BankFigures extends BankModel {
  fullJoules: number;
  shortCircuitAmps: number;
}

export interface LoadFigures {
  burstFloorVolts: number;
  burstReachable: boolean;
  usableAtFullJoules: number;
  reserveAtFullJoules: number;
  averageOutputWatts: number;
}

export function computeBankFigures(bank: unknown): BankFigures | null {
  const parsed = bankSchema.safeParse(bank);
  if (!parsed.success) return null;
  const model = modelBank({ bank: bankFromWire(parsed.data) });
  return {
    ...model,
    fullJoules: energyJoules({ farads: model.farads, volts: model.maxVolts }),
    // At full charge: the worst case a short would see.
    shortCircuitAmps: shortCircuitAmps({ volts: model.maxVolts, esrOhms: model.esrOhms }),
  };
}

/**
 * Values the server accepts but a practitioner would look at twice. Cell ratings: electric
 * double-layer cells are rated about 2.3–3.0 V and lithium-ion capacitors about 3.8–4.2 V
 * (common practice, from memory); nothing sold as one cell is rated near 10 V.
 */
export const EDLC_USUAL_MAX_VOLTS = 3.0;
export const ONE_CELL_MAX_VOLTS = 4.2;

export function bankNotes(bank: unknown): string[] {
  const parsed = bankSchema.safeParse(bank);
  if (!parsed.success) return [];
  const b = parsed.data;
  const notes: string[] = [];
  if (b.cell_rated_volts > ONE_CELL_MAX_VOLTS) {
    notes.push(`${b.cell_rated_volts} V is more than one supercapacitor cell is rated for. For a module, enter its cells in series and one cell's rating.`);
  } else if (b.cell_rated_volts > EDLC_USUAL_MAX_VOLTS) {
    notes.push(`${b.cell_rated_volts} V is above a double-layer cell's usual 2.3–3.0 V: right for a lithium-ion capacitor; check the maker's rating.`);
  }
  if (b.cell_esr_ohms === 0) notes.push('An ESR of 0 Ω leaves the short-circuit current without a limit in these figures: enter the datasheet ESR.');
  return notes;
}

/**
 * Typical low-voltage boost parts have their output set between about 1.8 and 4 V, 3.3 V being
 * the usual choice (common practice; DESIGN.md §1). Outside that range the part is unusual
 * enough that its efficiency and current limit should come from its own datasheet.
 */
export const USUAL_OUTPUT_VOLTS = { min: 1.8, max: 4 } as const;

/** Converter values the server accepts but a practitioner would look at twice. */
export function converterNotes(converter: unknown): string[] {
  const c = converterSchema.safeParse(converter);
  if (!c.success) return [];
  const out = c.data.output_volts;
  if (out >= USUAL_OUTPUT_VOLTS.min && out <= USUAL_OUTPUT_VOLTS.max) return [];
  return [`An output of ${out} V is outside the usual ${USUAL_OUTPUT_VOLTS.min}–${USUAL_OUTPUT_VOLTS.max} V of low-voltage boost parts: take its efficiency and input current limit from that part's datasheet.`];
}

export function computeLoadFigures(body: { bank?: unknown; converter?: unknown; load?: unknown }): LoadFigures | null {
  const b = bankSchema.safeParse(body.bank);
  const c = converterSchema.safeParse(body.converter);
  const l = loadSchema.safeParse(body.load);
  if (!b.success || !c.success || !l.success) return null;
  const bank = modelBank({ bank: bankFromWire(b.data) });
  const converter = converterFromWire(c.data);
  const load = loadFromWire(l.data);
  if (converter.cutoffVolts >= bank.maxVolts) return null; // the cross-field check names this field
  const floor = solveBurstFloor({ bank, converter, load });
  return {
    burstFloorVolts: floor.volts,
    burstReachable: floor.reachable,
    usableAtFullJoules: usableJoules({ farads: bank.farads, volts: bank.maxVolts, floorVolts: converter.cutoffVolts }),
    reserveAtFullJoules: floor.reachable ? reserveJoules({ farads: bank.farads, volts: bank.maxVolts, burstFloorVolts: floor.volts }) : 0,
    averageOutputWatts: averageOutputWatts({ load, outputVolts: converter.outputVolts }),
  };
}
