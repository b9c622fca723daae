import { describe, expect, it } from 'vitest';
import { api } from './helpers/stack';
import { signedIn } from './helpers/session';

// POST /api/v1/planner against the running app: an invented sensor node and 10 F / 2.7 V cells.
const load = { sleep_amps: 10e-6, awake_seconds: 2, awake_amps: 0.08, burst_seconds: 1, burst_amps: 0.3, interval_seconds: 300, max_interval_seconds: 3600 };
const converter = { start_volts: 1.0, cutoff_volts: 0.8, output_volts: 3.3, efficiency: 0.85, input_limit_amps: 2 };
const cell = { farads: 10, rated_volts: 2.7, esr_ohms: 0.075, leakage_amps: 0 };
const base = {
  load, converter, cell, cells_series: 2, site: { lat: 30, lon: 10 }, date: '2026-12-21',
  panel_watts: 0.5, charger_efficiency: 0.8, sun_factor: 0.25, charger_amps: 0.2,
};
const bankWatts = (3.3 * (10e-6 * 297 + 0.08 * 2 + 0.3 * 1)) / 300 / 0.85; // the average-power definition, ÷ η

async function plan(over: Record<string, unknown> = {}, email = 'viewer@larkspur.example') {
  const s = await signedIn(email);
  return s.agent.post('/api/v1/planner').set('origin', s.origin).send({ ...base, ...over });
}

/**
 * Night length (sun below −0.833°) on 21 December from the standard hour-angle formula
 * cos H = (sin h0 − sin φ sin δ)/(cos φ cos δ) with δ = −23.44° (standard spherical
 * astronomy result, from memory; the numbers derived here). Good to a few minutes: δ and the equation of time are held fixed.
 */
function decemberNightSeconds(latDeg: number): number {
  const rad = Math.PI / 180;
  const cosH = (Math.sin(-0.833 * rad) - Math.sin(latDeg * rad) * Math.sin(-23.44 * rad)) / (Math.cos(latDeg * rad) * Math.cos(-23.44 * rad));
  const dayHours = (2 * Math.acos(cosH)) / rad / 15;
  return (24 - dayHours) * 3600;
}

describe('POST /api/v1/planner', () => {
  it('asks for more cells in parallel at 60° N than at 30° N on the December solstice night', async () => {
    const south = await plan({ site: { lat: 30, lon: 10 } });
    const north = await plan({ site: { lat: 60, lon: 10 } });
    expect(south.status).toBe(200);
    expect(north.status).toBe(200);
    // Night lengths from the hour-angle formula (derived here), within 5 min.
    expect(Math.abs(south.body.night_seconds - decemberNightSeconds(30))).toBeLessThan(300);
    expect(Math.abs(north.body.night_seconds - decemberNightSeconds(60))).toBeLessThan(300);
    // A longer night needs more stored energy (sanity, derived here).
    expect(north.body.cells_parallel).toBeGreaterThan(south.body.cells_parallel);
    for (const r of [south, north]) {
      expect(r.body.margin).toBeGreaterThanOrEqual(1.5); // the default target margin
      expect(r.body.bank.cells_parallel).toBe(r.body.cells_parallel);
      // Constant η, no leakage: the draw over the night is P·T (derived here from the definitions).
      expect(r.body.night_draw_joules).toBeCloseTo(bankWatts * r.body.window_seconds, 6);
    }
  });

  it('answers the smallest count: one cell fewer misses the target', async () => {
    const chosen = await plan({ site: { lat: 60, lon: 10 } });
    const fewer = await plan({ site: { lat: 60, lon: 10 }, max_cells_parallel: chosen.body.cells_parallel - 1 });
    expect(fewer.status).toBe(200);
    expect(fewer.body.cells_parallel).toBeNull();
    expect(fewer.body.bank.cells_parallel).toBe(chosen.body.cells_parallel - 1);
    expect(fewer.body.margin).toBeLessThan(1.5);
  });

  it('gives the constant-current charge time t = C·ΔV/I and the panel time ½C(V² − V_cut²)/P', async () => {
    const res = await plan();
    const farads = (res.body.cells_parallel * 10) / 2; // np·C/ns (OpenStax College Physics 2e §19.6)
    expect(res.body.bank_farads).toBeCloseTo(farads, 9);
    expect(res.body.bank_max_volts).toBeCloseTo(5.4, 9);
    // t = C·ΔV/I at constant current (standard textbook result, REFERENCES.md hold-up relation).
    expect(res.body.cc_charge_seconds).toBeCloseTo((farads * (5.4 - 0.8)) / 0.2, 6);
    // Energy ½C(V² − V_cut²) (REFERENCES.md usable energy) at the panel's 0.5 W × 0.8 × 0.25.
    expect(res.body.panel_charge_seconds).toBeCloseTo((0.5 * farads * (5.4 ** 2 - 0.8 ** 2)) / (0.5 * 0.8 * 0.25), 6);
  });

  it('stores 1458 J per 400 F / 2.7 V cell at full charge', async () => {
    const res = await plan({ cell: { ...cell, farads: 400 } });
    expect(res.status).toBe(200);
    // Common practice: ½·400·2.7² = 1458 J per cell; the bank holds 2 × cells_parallel of them.
    expect(res.body.energy_full_joules).toBeCloseTo(1458 * 2 * res.body.cells_parallel, 6);
  });

  it('sends a discharge curve of at most 300 points that follows the constant-power law', async () => {
    const res = await plan({ site: { lat: 60, lon: 10 }, extra_days: 3 });
    const curve: [number, number][] = res.body.discharge_curve;
    expect(curve.length).toBeGreaterThan(50);
    expect(curve.length).toBeLessThanOrEqual(300);
    expect(curve[0]).toEqual([0, 5.4]);
    expect(res.body.window_seconds).toBeCloseTo(res.body.night_seconds + 3 * 86_400, 6);
    // Constant power: V(t) = sqrt(V0² − 2Pt/C), from t = C(V1² − V2²)/(2P) (REFERENCES.md).
    const farads = (res.body.cells_parallel * 10) / 2;
    for (const [t, volts] of curve) {
      expect(volts).toBeCloseTo(Math.sqrt(5.4 ** 2 - (2 * bankWatts * t) / farads), 3);
    }
  });

  it('names bad fields by JSON pointer: negative cell farads, cutoff above cells_series × rated', async () => {
    const negative = await plan({ cell: { ...cell, farads: -10 } });
    expect(negative.status).toBe(422);
    expect(negative.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/cell/farads']);
    const cutoff = await plan({ cells_series: 1, converter: { ...converter, cutoff_volts: 3, start_volts: 3 } });
    expect(cutoff.status).toBe(422);
    expect(cutoff.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/converter/cutoff_volts', '/converter/start_volts']);
    const date = await plan({ date: '2026-02-30' });
    expect(date.status).toBe(422);
    expect(date.body.errors[0].pointer).toBe('/date');
  });

  it('says when no bank of these cells can finish the burst, with the converter current, and draws no curve', async () => {
    // I_in = V_out·I_burst/(η·V_full) (REFERENCES.md, boost converter): 3.3 V × 5 A / (0.85 × 5.4 V) = 3.59 A, over the 2 A limit
    const res = await plan({ load: { ...load, burst_amps: 5 } });
    expect(res.status).toBe(200);
    expect(res.body.cells_parallel).toBeNull();
    expect(res.body.burst_blocked.input_amps).toBeCloseTo((3.3 * 5) / (0.85 * 5.4), 6);
    expect(res.body.burst_blocked.limit_amps).toBe(2);
    expect(res.body.discharge_curve).toEqual([]);
    // an ordinary plan has none, and its short-circuit figure is V_max ÷ ESR of the bank
    const ok = await plan();
    expect(ok.body.burst_blocked).toBeNull();
    expect(ok.body.short_circuit_amps).toBeCloseTo(ok.body.bank_max_volts / ok.body.bank_esr_ohms, 6);
  });

  it('refuses an efficiency typed as a fraction of a percent (0.85 % for 85 %) and says the limits in units', async () => {
    const res = await plan({ converter: { ...converter, efficiency: 0.0085 } });
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([{ pointer: '/converter/efficiency', detail: 'Must be at least 0.1.' }]);
    const big = await plan({ cell: { ...cell, farads: 200_000 } });
    expect(big.body.errors).toEqual([{ pointer: '/cell/farads', detail: 'Must be at most 100000 F.' }]);
    const start = await plan({ converter: { ...converter, start_volts: 0.5 } });
    expect(start.body.errors).toEqual([{ pointer: '/converter/start_volts', detail: 'Must not be below the cutoff (0.8 V).' }]);
  });

  it('answers 401 signed out', async () => {
    const res = await api().post('/api/v1/planner').set('origin', process.env.APP_URL!).send(base);
    expect(res.status).toBe(401);
  });
});
