import type { EfficiencyPoint } from './types';

export type Efficiency = number | EfficiencyPoint[];

/** Table points in ascending volts (copies; the caller's table is left alone). */
export function sortEfficiencyTable(table: EfficiencyPoint[]): EfficiencyPoint[] {
  return [...table].sort((a, b) => a[0] - b[0]);
}

/** Converter efficiency at an input voltage: constant, or linear in the table, flat beyond its ends. */
export function efficiencyAt({ efficiency, volts }: { efficiency: Efficiency; volts: number }): number {
  if (typeof efficiency === 'number') return efficiency;
  const table = isAscending(efficiency) ? efficiency : sortEfficiencyTable(efficiency);
  if (table.length === 0) throw new RangeError('efficiency table is empty');
  const first = table[0];
  const last = table[table.length - 1];
  if (volts <= first[0]) return first[1];
  if (volts >= last[0]) return last[1];
  for (let i = 1; i < table.length; i++) {
    const [v1, e1] = table[i];
    if (volts <= v1) {
      const [v0, e0] = table[i - 1];
      return v1 === v0 ? e1 : e0 + ((e1 - e0) * (volts - v0)) / (v1 - v0);
    }
  }
  return last[1];
}

/** Voltages where the efficiency curve has kinks (integrators split their ranges there). */
export function efficiencyBreakVolts({ efficiency }: { efficiency: Efficiency }): number[] {
  return typeof efficiency === 'number' ? [] : efficiency.map(([v]) => v);
}

/** Converter input current: I_in = V_out·I_out / (η·V_in). */
export function inputCurrentAmps({
  outputWatts,
  eta,
  inputVolts,
}: {
  outputWatts: number;
  eta: number;
  inputVolts: number;
}): number {
  return outputWatts / (eta * inputVolts);
}

function isAscending(table: EfficiencyPoint[]): boolean {
  for (let i = 1; i < table.length; i++) if (table[i][0] < table[i - 1][0]) return false;
  return true;
}
