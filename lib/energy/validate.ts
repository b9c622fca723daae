import { modelBank } from './bank';
import type { BankSpec, ConverterSpec, LoadSpec, SiteSpec } from './types';

/** A physically impossible input, by its path in the input object (for a 422 naming each field). */
export interface FieldProblem {
  path: string[];
  message: string;
}

// Checks the relations a schema cannot see field by field. Shape and type checks belong to
// the route's schema; this assumes finite numbers.
export function checkNodeSpecs({
  bank,
  converter,
  load,
  site,
}: {
  bank: BankSpec;
  converter: ConverterSpec;
  load: LoadSpec;
  site?: SiteSpec;
}): FieldProblem[] {
  const problems: FieldProblem[] = [];
  const add = (path: string[], message: string) => problems.push({ path, message });
  if (!Number.isInteger(bank.cellsSeries) || bank.cellsSeries < 1) add(['bank', 'cellsSeries'], 'must be a whole number ≥ 1');
  if (!Number.isInteger(bank.cellsParallel) || bank.cellsParallel < 1) add(['bank', 'cellsParallel'], 'must be a whole number ≥ 1');
  if (!(bank.cellFarads > 0)) add(['bank', 'cellFarads'], 'must be above 0 F');
  if (!(bank.cellRatedVolts > 0)) add(['bank', 'cellRatedVolts'], 'must be above 0 V');
  if (!(bank.cellEsrOhms >= 0)) add(['bank', 'cellEsrOhms'], 'must not be negative');
  if (!(bank.cellLeakageAmps >= 0)) add(['bank', 'cellLeakageAmps'], 'must not be negative');
  const maxVolts = modelBank({ bank }).maxVolts;
  if (!(converter.cutoffVolts > 0)) add(['converter', 'cutoffVolts'], 'must be above 0 V');
  else if (converter.cutoffVolts >= maxVolts) add(['converter', 'cutoffVolts'], `must be below the bank's maximum (${Number(maxVolts.toFixed(3))} V)`);
  if (!(converter.startVolts >= converter.cutoffVolts)) add(['converter', 'startVolts'], 'must not be below the cutoff');
  else if (converter.startVolts > maxVolts) add(['converter', 'startVolts'], `must not exceed the bank's maximum (${Number(maxVolts.toFixed(3))} V)`);
  if (!(converter.outputVolts > 0)) add(['converter', 'outputVolts'], 'must be above 0 V');
  if (!(converter.inputLimitAmps > 0)) add(['converter', 'inputLimitAmps'], 'must be above 0 A');
  checkEfficiency(converter.efficiency, add);
  for (const key of ['sleepAmps', 'awakeAmps', 'burstAmps', 'awakeSeconds', 'burstSeconds'] as const) {
    if (!(load[key] >= 0)) add(['load', key], 'must not be negative');
  }
  if (!(load.intervalSeconds >= load.awakeSeconds + load.burstSeconds) || !(load.intervalSeconds > 0)) {
    add(['load', 'intervalSeconds'], 'must be at least the awake plus burst time');
  }
  if (!(load.maxIntervalSeconds >= load.intervalSeconds)) add(['load', 'maxIntervalSeconds'], 'must not be below the interval');
  if (site && !(Math.abs(site.lat) <= 90)) add(['site', 'lat'], 'must be between −90 and 90');
  if (site && !(Math.abs(site.lon) <= 180)) add(['site', 'lon'], 'must be between −180 and 180');
  if (site && !(Math.abs(site.rechargeElevationDeg) < 90)) add(['site', 'rechargeElevationDeg'], 'must be between −90 and 90');
  return problems;
}

function checkEfficiency(efficiency: ConverterSpec['efficiency'], add: (path: string[], message: string) => void) {
  const ok = (eta: number) => eta > 0 && eta <= 1;
  if (typeof efficiency === 'number') {
    if (!ok(efficiency)) add(['converter', 'efficiency'], 'must be above 0 and at most 1');
    return;
  }
  if (efficiency.length === 0) add(['converter', 'efficiency'], 'table must have at least one point');
  efficiency.forEach(([volts, eta], i) => {
    if (!(volts >= 0)) add(['converter', 'efficiency', String(i), '0'], 'volts must not be negative');
    if (!ok(eta)) add(['converter', 'efficiency', String(i), '1'], 'must be above 0 and at most 1');
  });
}
