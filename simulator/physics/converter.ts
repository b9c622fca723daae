import type { EfficiencySpec } from './types';

/** Efficiency at an input voltage: constant, or linear between table rows, held at the ends. */
export function getEfficiency({ efficiency, inputVolts }: { efficiency: EfficiencySpec; inputVolts: number }): number {
  if (typeof efficiency === 'number') return efficiency;
  const rows = [...efficiency].sort((a, b) => a[0] - b[0]);
  if (inputVolts <= rows[0][0]) return rows[0][1];
  for (let i = 1; i < rows.length; i += 1) {
    const [v1, e1] = rows[i];
    if (inputVolts <= v1) {
      const [v0, e0] = rows[i - 1];
      return e0 + ((e1 - e0) * (inputVolts - v0)) / (v1 - v0);
    }
  }
  return rows[rows.length - 1][1];
}

/**
 * Terminal volts and input current when the converter draws `inputWatts` from a source of
 * resting volts V behind `esrOhms`: V_t = (V + sqrt(V² − 4·ESR·P)) / 2 (derived here from
 * V_t = V − I·ESR and I·V_t = P). Null when no operating point exists (the source collapses).
 */
export function solveTerminal({ restingVolts, esrOhms, inputWatts }: { restingVolts: number; esrOhms: number; inputWatts: number }): { terminalVolts: number; amps: number } | null {
  const disc = restingVolts * restingVolts - 4 * esrOhms * inputWatts;
  if (disc < 0 || restingVolts <= 0) return null;
  const terminalVolts = (restingVolts + Math.sqrt(disc)) / 2;
  return { terminalVolts, amps: inputWatts / terminalVolts };
}
