import { describe, expect, it } from 'vitest';
import { api } from './helpers/stack';
import { signedIn } from './helpers/session';

// POST /api/v1/model/evaluate against the running app. An invented node: three strings of two
// 400 F / 2.7 V cells (6 cells), a 3.3 V boost converter, a sensor reporting every 5 min.
const cellFarads = 400;
const bank = { cells_series: 2, cells_parallel: 3, cell_farads: cellFarads, cell_rated_volts: 2.7, cell_esr_ohms: 0.02, cell_leakage_amps: 0 };
const converter = { start_volts: 1.0, cutoff_volts: 0.8, output_volts: 3.3, efficiency: 0.85, input_limit_amps: 2 };
const load = { sleep_amps: 10e-6, awake_seconds: 2, awake_amps: 0.08, burst_seconds: 1, burst_amps: 0.3, interval_seconds: 300, max_interval_seconds: 3600 };
const kyiv = { lat: 50.45466, lon: 30.5238, recharge_elevation_deg: -0.833 };
const body = (over: Record<string, unknown> = {}) => ({ bank, converter, load, site: kyiv, volts: 5.4, at: '2026-06-20T20:00:00Z', ...over });

const bankFarads = (3 * cellFarads) / 2; // np·C/ns (OpenStax College Physics 2e §19.6: parallel adds, series divides)
const bankEsrOhms = (2 * 0.02) / 3;
const outputWatts = (3.3 * (10e-6 * (300 - 3) + 0.08 * 2 + 0.3 * 1)) / 300; // the average-power definition

async function evaluate(payload: unknown, email = 'viewer@larkspur.example') {
  const s = await signedIn(email);
  return s.agent.post('/api/v1/model/evaluate').set('origin', s.origin).send(payload as object);
}

describe('POST /api/v1/model/evaluate', () => {
  it('gives a full bank of 6 × 400 F / 2.7 V cells 6 × 1458 J', async () => {
    const res = await evaluate(body());
    expect(res.status).toBe(200);
    // Common practice: a 400 F cell rated 2.7 V stores ½·400·2.7² = 1458 J (≈ 0.41 Wh).
    expect(res.body.energy_joules).toBeCloseTo(6 * 1458, 6);
    // Usable above the cutoff: W = ½C(Vmax² − Vmin²) (standard textbook result, REFERENCES.md).
    expect(res.body.usable_joules).toBeCloseTo(0.5 * bankFarads * (5.4 ** 2 - 0.8 ** 2), 6);
    expect(res.body.soc).toBeCloseTo(1, 9); // full by the definition
    // Short-circuit current V/ESR_bank with ESR_bank = ns·ESR/np (the definitions).
    expect(res.body.short_circuit_amps).toBeCloseTo(5.4 / bankEsrOhms, 6);
    expect(res.body.state).toBe('steady');
    expect(res.body.next_report_s).toBe(300);
    expect(res.body.brownout_at).toBeNull();
  });

  it('puts the burst floor where the standard pulse droop I·t/C + I·ESR meets the cutoff', async () => {
    const res = await evaluate(body());
    // ΔV_total = I·t/C + I·ESR (standard, REFERENCES.md "Pulse droop"), with the converter's
    // input current at the cutoff I = P/(η·V_cut) (boost converter relation, REFERENCES.md).
    const inputAmps = (3.3 * 0.3) / (0.85 * 0.8);
    const droopFloor = 0.8 + (inputAmps * 1) / bankFarads + inputAmps * bankEsrOhms;
    expect(res.body.burst_floor_volts).toBeCloseTo(droopFloor, 3); // within 0.5 mV (derived here: the droop formula is first order)
    // Reserve = usable energy above the floor: ½C(V² − V_floor²) (REFERENCES.md usable energy).
    expect(res.body.reserve_joules).toBeCloseTo(0.5 * bankFarads * (5.4 ** 2 - res.body.burst_floor_volts ** 2), 3);
    // Bank-side power = output power / η with no leakage (the definition).
    expect(res.body.load_watts).toBeCloseTo(outputWatts / 0.85, 9);
  });

  it('takes the recharge at the Kyiv sunrise of 2026-06-21 (USNO 01:46 UTC ± 2 min) and the margin over that night', async () => {
    const res = await evaluate(body());
    const rechargeMs = Date.parse(res.body.recharge_at);
    // US Naval Observatory, Kyiv 50.45466 N 30.5238 E, 2026-06-21 sunrise 01:46 UTC (REFERENCES.md).
    expect(Math.abs(rechargeMs - Date.parse('2026-06-21T01:46:00Z'))).toBeLessThanOrEqual(2 * 60_000);
    // Constant η and no leakage: the bank draws a constant power, so the draw to recharge is
    // P·T and the margin reserve/(P·T) (derived here from the definitions).
    const windowSeconds = (rechargeMs - Date.parse('2026-06-20T20:00:00Z')) / 1000;
    expect(res.body.margin).toBeCloseTo(res.body.reserve_joules / ((outputWatts / 0.85) * windowSeconds), 6);
  });

  it('projects the brownout at the constant-power hold-up time t = C(V1² − V2²)/(2P)', async () => {
    // One string of two 10 F cells at 2.5 V on the same night: the reserve runs out before sunrise.
    const small = { ...bank, cell_farads: 10, cells_parallel: 1 };
    const at = '2026-06-20T20:00:00Z';
    const res = await evaluate(body({ bank: small, volts: 2.5, at }));
    expect(res.status).toBe(200);
    const farads = 10 / 2;
    const watts = outputWatts / 0.85;
    // Constant-power hold-up (standard textbook result, REFERENCES.md), from 2.5 V to the floor.
    const holdSeconds = (farads * (2.5 ** 2 - res.body.burst_floor_volts ** 2)) / (2 * watts);
    const brownoutSeconds = (Date.parse(res.body.brownout_at) - Date.parse(at)) / 1000;
    expect(brownoutSeconds / holdSeconds).toBeCloseTo(1, 3);
    expect(res.body.margin).toBeLessThan(1); // a projected brownout means margin < 1 (issue 4)
    expect(res.body.state).toBe('short');
    // Cadence (issue 4): the smallest whole interval T with reserve ≥ P(T)·window, where
    // P(T) = V_out·(sleep·(T − 3) + 0.46 A·s)/(η·T); solved for T here (derived here).
    const windowSeconds = (Date.parse(res.body.recharge_at) - Date.parse(at)) / 1000;
    const k = (3.3 / 0.85) * windowSeconds;
    const edgeSeconds = (k * (0.08 * 2 + 0.3 * 1 - 3 * 10e-6)) / (res.body.reserve_joules - k * 10e-6);
    expect(edgeSeconds).toBeGreaterThan(300);
    expect(edgeSeconds).toBeLessThan(3600);
    expect(res.body.next_report_s).toBe(Math.ceil(edgeSeconds));
  });

  it('answers null for a margin the model calls infinite (nothing drawn)', async () => {
    const idle = { ...load, sleep_amps: 0, awake_amps: 0, burst_amps: 0 };
    const res = await evaluate(body({ load: idle }));
    expect(res.status).toBe(200);
    expect(res.body.margin).toBeNull(); // JSON has no Infinity; documented in lib/schemas/evaluate.ts
    expect(res.body.state).toBe('steady');
  });

  it('names a negative farads by its JSON pointer (RFC 6901) in a 422 problem+json (RFC 9457)', async () => {
    const res = await evaluate(body({ bank: { ...bank, cell_farads: -400 } }));
    expect(res.status).toBe(422);
    expect(res.headers['content-type']).toContain('application/problem+json');
    expect(res.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/bank/cell_farads']);
  });

  it("names a cutoff above the bank's maximum (2 × 2.7 V) and an instant without offset", async () => {
    const cutoff = await evaluate(body({ converter: { ...converter, cutoff_volts: 6, start_volts: 6.2 } }));
    expect(cutoff.status).toBe(422);
    const pointers = cutoff.body.errors.map((e: { pointer: string }) => e.pointer);
    expect(pointers).toContain('/converter/cutoff_volts');
    expect(pointers).toContain('/converter/start_volts');
    const at = await evaluate(body({ at: '2026-06-20 20:00' }));
    expect(at.status).toBe(422);
    expect(at.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/at']);
  });

  it('refuses volts far above the bank and a body with unknown fields', async () => {
    const over = await evaluate(body({ volts: 7 }));
    expect(over.status).toBe(422);
    expect(over.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/volts']);
    const extra = await evaluate(body({ bank: { ...bank, colour: 'blue' } }));
    expect(extra.status).toBe(422);
    expect(extra.body.errors[0].pointer).toBe('/bank');
  });

  it('answers 401 signed out and 403 without our Origin', async () => {
    const out = await api().post('/api/v1/model/evaluate').set('origin', process.env.APP_URL!).send(body());
    expect(out.status).toBe(401);
    const s = await signedIn('viewer@larkspur.example');
    const noOrigin = await s.agent.post('/api/v1/model/evaluate').send(body());
    expect(noOrigin.status).toBe(403);
  });
});
