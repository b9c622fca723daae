// Bench characterization by the IEC 62391-1 constant-current discharge method:
// C = I·(t2 − t1)/(V1 − V2), V1 = 0.8·U_R and V2 = 0.4·U_R, the times interpolated between
// samples; R = ΔV/I, ΔV from the voltage at discharge start down to the straight part of the
// curve (the samples between V1 and V2, least squares) extrapolated back to that instant.
// The log must start at the discharge start, resting at the charged voltage.

/** A bad input, naming the field at fault (for a 422 reply). */
export class EnergyInputError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = 'EnergyInputError';
  }
}

/** The discharge log never falls through one of the thresholds. */
export class NeverCrossesError extends EnergyInputError {
  constructor(
    readonly thresholdFraction: number,
    readonly thresholdVolts: number,
  ) {
    super(
      'samples',
      `the discharge log never falls through ${Math.round(thresholdFraction * 100)} % of the rated voltage (${thresholdVolts.toFixed(3)} V)`,
    );
    this.name = 'NeverCrossesError';
  }
}

export interface Characterization {
  capacitanceFarads: number;
  esrOhms: number;
  t1Seconds: number;
  t2Seconds: number;
}

export const V1_FRACTION = 0.8;
export const V2_FRACTION = 0.4;

export function characterizeDischarge({
  ratedVolts,
  currentAmps,
  samples,
}: {
  ratedVolts: number;
  currentAmps: number;
  samples: [seconds: number, volts: number][];
}): Characterization {
  if (!(ratedVolts > 0)) throw new EnergyInputError('ratedVolts', 'rated voltage must be above 0 V');
  if (!(currentAmps > 0)) throw new EnergyInputError('currentAmps', 'discharge current must be above 0 A');
  const log = [...samples].sort((a, b) => a[0] - b[0]);
  if (log.length < 3) throw new EnergyInputError('samples', 'a discharge log needs at least 3 samples');
  const v1 = V1_FRACTION * ratedVolts;
  const v2 = V2_FRACTION * ratedVolts;
  const t1Seconds = crossingSeconds({ log, volts: v1, fromIndex: 0 });
  if (t1Seconds === null) throw new NeverCrossesError(V1_FRACTION, v1);
  const t2Seconds = crossingSeconds({ log, volts: v2, fromIndex: log.findIndex(([t]) => t >= t1Seconds) });
  if (t2Seconds === null) throw new NeverCrossesError(V2_FRACTION, v2);
  const capacitanceFarads = (currentAmps * (t2Seconds - t1Seconds)) / (v1 - v2);
  const [startSeconds, startVolts] = log[0];
  const straight = log.filter(([t, v]) => t >= t1Seconds && t <= t2Seconds && v <= v1 && v >= v2);
  const line = straight.length >= 2 ? fitLine(straight) : fitLine([[t1Seconds, v1], [t2Seconds, v2]]);
  const deltaVolts = startVolts - (line.intercept + line.slope * startSeconds);
  return { capacitanceFarads, esrOhms: deltaVolts / currentAmps, t1Seconds, t2Seconds };
}

/** First downward crossing of `volts` at or after a sample, interpolated linearly; null if none. */
function crossingSeconds({
  log,
  volts,
  fromIndex,
}: {
  log: [number, number][];
  volts: number;
  fromIndex: number;
}): number | null {
  if (log[0][1] < volts) return null; // starts below the threshold: it is never crossed downward
  for (let i = Math.max(1, fromIndex); i < log.length; i++) {
    const [ta, va] = log[i - 1];
    const [tb, vb] = log[i];
    if (va >= volts && vb <= volts) return va === vb ? ta : ta + ((va - volts) * (tb - ta)) / (va - vb);
  }
  return null;
}

function fitLine(points: [number, number][]): { slope: number; intercept: number } {
  const n = points.length;
  const mx = points.reduce((a, [t]) => a + t, 0) / n;
  const my = points.reduce((a, [, v]) => a + v, 0) / n;
  let sxy = 0;
  let sxx = 0;
  for (const [t, v] of points) {
    sxy += (t - mx) * (v - my);
    sxx += (t - mx) ** 2;
  }
  const slope = sxx > 0 ? sxy / sxx : 0;
  return { slope, intercept: my - slope * mx };
}

export interface CellMeasurement {
  id?: string;
  capacitanceFarads: number;
  esrOhms: number;
}

export interface CellFlags extends CellMeasurement {
  capacitanceRatio: number;
  esrRatio: number;
  lowCapacitance: boolean;
  highEsr: boolean;
}

/** Each cell against its nominal rating: flagged below 80 % of rated capacitance or above 2× rated ESR. */
export function batchFlags({
  cells,
  nominal,
}: {
  cells: CellMeasurement[];
  nominal: { farads: number; esrOhms: number };
}): { cells: CellFlags[]; flagged: number; meanCapacitanceRatio: number; meanEsrRatio: number } {
  const flagged = cells.map((cell) => {
    const capacitanceRatio = cell.capacitanceFarads / nominal.farads;
    const esrRatio = cell.esrOhms / nominal.esrOhms;
    return { ...cell, capacitanceRatio, esrRatio, lowCapacitance: capacitanceRatio < 0.8, highEsr: esrRatio > 2 };
  });
  const mean = (xs: number[]) => (xs.length ? xs.reduce((a, b) => a + b, 0) / xs.length : Number.NaN);
  return {
    cells: flagged,
    flagged: flagged.filter((c) => c.lowCapacitance || c.highEsr).length,
    meanCapacitanceRatio: mean(flagged.map((c) => c.capacitanceRatio)),
    meanEsrRatio: mean(flagged.map((c) => c.esrRatio)),
  };
}
