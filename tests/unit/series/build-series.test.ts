import { describe, expect, it } from 'vitest';
import { buildSeriesColumns, calibrate } from '@/lib/series/build-series';

describe('buildSeriesColumns', () => {
  const bucket = { t: 0, n: 3, vMin: 2.0, vMax: 3.0, vMean: 2.5, vLast: 2.2, tLast: 50, vpMax: 5.1 };

  it('calibrates min, mean, max and last with v = gain·v + offset', () => {
    const c = buildSeriesColumns({ buckets: [bucket], calibration: { gain: 1.004, offsetVolts: -0.003 }, bankFarads: 25, burstFloorVolts: 1.1 });
    // derived here: 1.004·2 − 0.003 = 2.005; 1.004·3 − 0.003 = 3.009; 1.004·2.5 − 0.003 = 2.507
    expect(c.v_min[0]).toBeCloseTo(2.005, 9);
    expect(c.v_max[0]).toBeCloseTo(3.009, 9);
    expect(c.v_mean[0]).toBeCloseTo(2.507, 9);
    expect(c.v_last[0]).toBeCloseTo(1.004 * 2.2 - 0.003, 9);
    expect(c.vp_max[0]).toBe(5.1); // panel volts are not bank volts: no calibration
  });

  it('swaps min and max under a negative gain, keeping min ≤ mean ≤ max', () => {
    const c = buildSeriesColumns({ buckets: [bucket], calibration: { gain: -1, offsetVolts: 5 }, bankFarads: 25, burstFloorVolts: 1.1 });
    expect([c.v_min[0], c.v_mean[0], c.v_max[0]]).toEqual([2, 2.5, 3]);
  });

  it('gives energy ½·C·V² and reserve ½·C·(V² − Vf²) above the burst floor', () => {
    // OpenStax College Physics 2e §19.7 Example 19.11: E = ½CV², 8.00 µF at 10.0 kV → 400 J
    const check = buildSeriesColumns({ buckets: [{ ...bucket, vMin: 10_000, vMax: 10_000, vMean: 10_000 }], calibration: { gain: 1, offsetVolts: 0 }, bankFarads: 8e-6, burstFloorVolts: 0 });
    expect(check.energy_mean_joules[0]).toBeCloseTo(400, 6);
    expect(check.reserve_mean_joules[0]).toBeCloseTo(400, 6);
    // derived here: 25 F at 2.5 V holds 78.125 J; above a 1.1 V floor 78.125 − 15.125 = 63 J
    const c = buildSeriesColumns({ buckets: [bucket], calibration: { gain: 1, offsetVolts: 0 }, bankFarads: 25, burstFloorVolts: 1.1 });
    expect(c.energy_mean_joules[0]).toBeCloseTo(78.125, 3);
    expect(c.reserve_mean_joules[0]).toBeCloseTo(63, 3);
    const below = buildSeriesColumns({ buckets: [{ ...bucket, vMin: 0.9 }], calibration: { gain: 1, offsetVolts: 0 }, bankFarads: 25, burstFloorVolts: 1.1 });
    expect(below.reserve_min_joules[0]).toBe(0); // nothing in reserve under the floor
  });

  it('calibrate is the node-spec formula', () => {
    expect(calibrate({ calibration: { gain: 0.997, offsetVolts: 0.002 }, volts: 4 })).toBeCloseTo(3.99, 12);
  });
});
