import { modelBank } from './bank';
import type { BankSpec, ConverterSpec, LoadSpec, SiteSpec } from './types';

/** A physically impossible input, by its path in the input object (for a 422 naming each field). */
export interface FieldProblem {
  path: string[];
  message: string;
}

// Checks the relations a schema cannot see field by field. Shape and type checks belong to
// the route's schema; this assumes finite numbers.
const volts = (v: number) => `${Number(v.toFixed(3))} V`;

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
  if (!Number.isInteger(bank.cellsSeries) || bank.cellsSeries < 1) add(['bank', 'cellsSeries'], 'Must be a whole number, at least 1.');
  if (!Number.isInteger(bank.cellsParallel) || bank.cellsParallel < 1) add(['bank', 'cellsParallel'], 'Must be a whole number, at least 1.');
  if (!(bank.cellFarads > 0)) add(['bank', 'cellFarads'], 'Must be above 0 F.');
  if (!(bank.cellRatedVolts > 0)) add(['bank', 'cellRatedVolts'], 'Must be above 0 V.');
  if (!(bank.cellEsrOhms >= 0)) add(['bank', 'cellEsrOhms'], 'Must not be negative.');
  if (!(bank.cellLeakageAmps >= 0)) add(['bank', 'cellLeakageAmps'], 'Must not be negative.');
  const maxVolts = modelBank({ bank }).maxVolts;
  if (!(converter.cutoffVolts > 0)) add(['converter', 'cutoffVolts'], 'Must be above 0 V.');
  else if (converter.cutoffVolts >= maxVolts) add(['converter', 'cutoffVolts'], `Must be below the bank's maximum (${volts(maxVolts)}).`);
  if (!(converter.startVolts >= converter.cutoffVolts)) add(['converter', 'startVolts'], `Must not be below the cutoff (${volts(converter.cutoffVolts)}).`);
  else if (converter.startVolts > maxVolts) add(['converter', 'startVolts'], `Must not exceed the bank's maximum (${volts(maxVolts)}).`);
  if (!(converter.outputVolts > 0)) add(['converter', 'outputVolts'], 'Must be above 0 V.');
  if (!(converter.inputLimitAmps > 0)) add(['converter', 'inputLimitAmps'], 'Must be above 0 A.');
  checkEfficiency(converter.efficiency, add);
  for (const key of ['sleepAmps', 'awakeAmps', 'burstAmps', 'awakeSeconds', 'burstSeconds'] as const) {
    if (!(load[key] >= 0)) add(['load', key], 'Must not be negative.');
  }
  if (!(load.intervalSeconds >= load.awakeSeconds + load.burstSeconds) || !(load.intervalSeconds > 0)) {
    add(['load', 'intervalSeconds'], `Must be at least the awake plus burst time (${Number((load.awakeSeconds + load.burstSeconds).toFixed(3))} s).`);
  }
  if (!(load.maxIntervalSeconds >= load.intervalSeconds)) add(['load', 'maxIntervalSeconds'], `Must not be below the report interval (${load.intervalSeconds} s).`);
  if (site && !(Math.abs(site.lat) <= 90)) add(['site', 'lat'], 'Must be between −90° and 90°.');
  if (site && !(Math.abs(site.lon) <= 180)) add(['site', 'lon'], 'Must be between −180° and 180°.');
  if (site && !(Math.abs(site.rechargeElevationDeg) < 90)) add(['site', 'rechargeElevationDeg'], 'Must be between −90° and 90°.');
  return problems;
}

function checkEfficiency(efficiency: ConverterSpec['efficiency'], add: (path: string[], message: string) => void) {
  const ok = (eta: number) => eta > 0 && eta <= 1;
  if (typeof efficiency === 'number') {
    if (!ok(efficiency)) add(['converter', 'efficiency'], 'Must be above 0 and at most 1.');
    return;
  }
  if (efficiency.length === 0) add(['converter', 'efficiency'], 'The table needs at least one point.');
  efficiency.forEach(([volts, eta], i) => {
    if (!(volts >= 0)) add(['converter', 'efficiency', String(i), '0'], 'Volts must not be negative.');
    if (!ok(eta)) add(['converter', 'efficiency', String(i), '1'], 'Must be above 0 and at most 1.');
  });
}
