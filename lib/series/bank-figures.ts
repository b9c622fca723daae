import { energyJoules, modelBank, solveBurstFloor, type BankSpec, type ConverterSpec, type LoadSpec } from '../energy';
import type { BankFigures } from './wire';

/** The bank's fixed figures the charts draw against: C, full volts, the cutoff (dotted), the burst floor (dashed). */
export function bankFigures({ spec }: { spec: { bank: BankSpec; converter: ConverterSpec; load: LoadSpec } }): BankFigures {
  const bank = modelBank({ bank: spec.bank });
  const floor = solveBurstFloor({ bank, converter: spec.converter, load: spec.load }).volts;
  return {
    farads: bank.farads,
    max_volts: bank.maxVolts,
    cutoff_volts: spec.converter.cutoffVolts,
    start_volts: spec.converter.startVolts,
    burst_floor_volts: Number(floor.toFixed(5)),
    energy_full_joules: energyJoules({ farads: bank.farads, volts: bank.maxVolts }),
  };
}
