import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { batchFlags, characterizeDischarge, NeverCrossesError, V1_FRACTION, V2_FRACTION } from '@/lib/energy';

// A synthetic constant-current discharge log, derived here: resting at U_R at t = 0, then the
// ESR step I·R and a straight fall I·t/C, down to `endVolts`.
function dischargeLog({
  farads,
  esrOhms,
  amps,
  ratedVolts,
  stepSeconds,
  endVolts = 0.2 * ratedVolts,
  noise = () => 0,
}: {
  farads: number;
  esrOhms: number;
  amps: number;
  ratedVolts: number;
  stepSeconds: number;
  endVolts?: number;
  noise?: () => number;
}): [number, number][] {
  const log: [number, number][] = [[0, ratedVolts + noise()]];
  for (let t = stepSeconds; ; t += stepSeconds) {
    const volts = ratedVolts - amps * esrOhms - (amps * t) / farads;
    if (volts < endVolts) break;
    log.push([t, volts + noise()]);
  }
  return log;
}

describe('IEC 62391-1 characterization', () => {
  it('derived vector: 10 F, 2.7 V, class 2 → 10.8 mA, V1 2.16 V, V2 1.08 V, t2 − t1 = 1000 s', () => {
    const amps = (0.4 * 10 * 2.7) / 1000; // IEC 62391-1 class 2: I = 0.4·C·U_R mA
    expect(amps).toBeCloseTo(10.8e-3, 12); // REFERENCES.md derived vector: 10.8 mA
    expect(V1_FRACTION * 2.7).toBeCloseTo(2.16, 12); // REFERENCES.md: V1 = 2.16 V
    expect(V2_FRACTION * 2.7).toBeCloseTo(1.08, 12); // REFERENCES.md: V2 = 1.08 V
    const samples = dischargeLog({ farads: 10, esrOhms: 0.025, amps, ratedVolts: 2.7, stepSeconds: 7 });
    const result = characterizeDischarge({ ratedVolts: 2.7, currentAmps: amps, samples });
    expect(result.t2Seconds - result.t1Seconds).toBeCloseTo(1000, 6); // REFERENCES.md: t2 − t1 = 1000 s
    expect(result.capacitanceFarads).toBeCloseTo(10, 6); // IEC 62391-1: C = I·(t2 − t1)/(V1 − V2)
    expect(result.esrOhms).toBeCloseTo(0.025, 6); // derived here: the log's own ESR step
    // derived here: t1 = (U_R − I·R − V1)·C/I
    expect(result.t1Seconds).toBeCloseTo(((2.7 - amps * 0.025 - 2.16) * 10) / amps, 6);
  });

  it('extrapolates back to the first sample when the log clock does not start at 0 (derived here)', () => {
    const samples = dischargeLog({ farads: 50, esrOhms: 0.04, amps: 1, ratedVolts: 2.7, stepSeconds: 0.5 }).map(
      ([t, v]): [number, number] => [t + 3600, v],
    );
    const result = characterizeDischarge({ ratedVolts: 2.7, currentAmps: 1, samples });
    expect(result.esrOhms).toBeCloseTo(0.04, 6);
    expect(result.capacitanceFarads).toBeCloseTo(50, 6);
    expect(result.t1Seconds).toBeCloseTo(3600 + (2.7 - 0.04 - 2.16) * 50, 6);
  });

  it('names the threshold a log never crosses', () => {
    const short = dischargeLog({ farads: 10, esrOhms: 0.02, amps: 0.1, ratedVolts: 2.7, stepSeconds: 1, endVolts: 1.5 });
    expect(() => characterizeDischarge({ ratedVolts: 2.7, currentAmps: 0.1, samples: short })).toThrowError(NeverCrossesError);
    try {
      characterizeDischarge({ ratedVolts: 2.7, currentAmps: 0.1, samples: short });
    } catch (error) {
      expect(error).toMatchObject({ field: 'samples', thresholdFraction: 0.4 });
      expect((error as Error).message).toContain('40 %');
    }
    const low: [number, number][] = [[0, 2.0], [1, 1.9], [2, 1.8]];
    expect(() => characterizeDischarge({ ratedVolts: 2.7, currentAmps: 0.1, samples: low })).toThrowError(/80 %/);
  });

  it('rejects a non-positive current, naming the field', () => {
    expect(() => characterizeDischarge({ ratedVolts: 2.7, currentAmps: 0, samples: [[0, 2.7], [1, 2], [2, 1]] })).toThrowError(
      expect.objectContaining({ field: 'currentAmps' }),
    );
  });

  it('recovers C and ESR from noisy synthetic logs (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 500, noNaN: true }),
        fc.double({ min: 0.005, max: 0.2, noNaN: true }),
        // the ESR step I·R between 20 mV (well above the noise) and 250 mV (well above V1)
        fc.double({ min: 0.02, max: 0.25, noNaN: true }),
        fc.integer({ min: 1, max: 2 ** 30 }),
        (farads, esrOhms, stepVolts, seed) => {
          const amps = stepVolts / esrOhms;
          let state = seed;
          const noise = () => ((state = (state * 1103515245 + 12345) % 2 ** 31) / 2 ** 31 - 0.5) * 1e-3; // ±0.5 mV
          const stepSeconds = (farads * 2.7) / amps / 1000;
          const samples = dischargeLog({ farads, esrOhms, amps, ratedVolts: 2.7, stepSeconds, noise });
          const r = characterizeDischarge({ ratedVolts: 2.7, currentAmps: amps, samples });
          return Math.abs(r.capacitanceFarads / farads - 1) < 0.01 && Math.abs(r.esrOhms / esrOhms - 1) < 0.05;
        },
      ),
      { numRuns: 100 },
    );
  });
});

describe('batch view', () => {
  it('flags cells below 80 % of rated capacitance or above twice the rated ESR', () => {
    const batch = batchFlags({
      nominal: { farads: 100, esrOhms: 0.02 },
      cells: [
        { id: 'a', capacitanceFarads: 97, esrOhms: 0.021 },
        { id: 'b', capacitanceFarads: 79, esrOhms: 0.02 },
        { id: 'c', capacitanceFarads: 100, esrOhms: 0.041 },
        { id: 'd', capacitanceFarads: 80, esrOhms: 0.04 }, // exactly on both limits: not flagged
      ],
    });
    expect(batch.cells.map((c) => [c.id, c.lowCapacitance, c.highEsr])).toEqual([
      ['a', false, false],
      ['b', true, false],
      ['c', false, true],
      ['d', false, false],
    ]);
    expect(batch.flagged).toBe(2);
    expect(batch.meanCapacitanceRatio).toBeCloseTo((0.97 + 0.79 + 1 + 0.8) / 4, 12);
  });
});
