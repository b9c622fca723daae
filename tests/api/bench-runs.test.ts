import { describe, expect, it } from 'vitest';
import { api } from './helpers/stack';
import { signedIn } from './helpers/session';

// POST/GET /api/v1/bench/runs: characterize a cell by IEC 62391-1 and keep it in its batch.
// REFERENCES.md derived vector: 10 F, U_R = 2.7 V, class 2 → I = 0.4·C·U_R mA = 10.8 mA;
// V1 = 2.16 V, V2 = 1.08 V, t2 − t1 = 1000 s.
const ratedVolts = 2.7;
const currentAmps = 0.0108;
const nominal = { farads: 10, esrOhms: 0.075 };

/** An ideal constant-current discharge: resting at U_R, the IR step, then dV/dt = −I/C, one sample a second. */
function dischargeLog({ farads, esrOhms, stopVolts = 0.9 }: { farads: number; esrOhms: number; stopVolts?: number }): [number, number][] {
  const log: [number, number][] = [[0, ratedVolts]];
  for (let t = 1; ; t++) {
    const volts = ratedVolts - currentAmps * esrOhms - (currentAmps * t) / farads;
    if (volts < stopVolts) break;
    log.push([t, Number(volts.toFixed(6))]);
  }
  return log;
}
const csvOf = (log: [number, number][]) => 'seconds,volts\n' + log.map(([t, v]) => `${t},${v}`).join('\n') + '\n';

const batch = `test-batch-${process.pid}-${Date.now()}`;
const fields = (cell: string) => ({
  batch_label: batch, cell_label: cell, nominal_farads: String(nominal.farads), nominal_esr_ohms: String(nominal.esrOhms),
  rated_volts: String(ratedVolts), current_amps: String(currentAmps),
});

async function upload(email: string, cell: string, log: [number, number][], over: Record<string, string> = {}) {
  const s = await signedIn(email);
  let req = s.agent.post('/api/v1/bench/runs').set('origin', s.origin);
  for (const [name, value] of Object.entries({ ...fields(cell), ...over })) req = req.field(name, value);
  return req.attach('file', Buffer.from(csvOf(log)), { filename: `${cell}.csv`, contentType: 'text/csv' });
}

describe('bench runs', () => {
  it('stores a good cell (CSV upload) with C and ESR recovered and no flag', async () => {
    const res = await upload('deployer@larkspur.example', 'A1', dischargeLog({ farads: 10, esrOhms: 0.08 }));
    expect(res.status).toBe(201);
    // t2 − t1 = C·(V1 − V2)/I = 10·1.08/0.0108 = 1000 s (REFERENCES.md derived vector).
    expect(res.body.t2_seconds - res.body.t1_seconds).toBeCloseTo(1000, 1);
    // C = I·(t2 − t1)/(V1 − V2) (IEC 62391-1) recovers the 10 F the log was made with (derived here).
    expect(res.body.capacitance_farads).toBeCloseTo(10, 2);
    // R = ΔV/I from the step at the start (IEC 62391-1): the 0.08 Ω put in.
    expect(res.body.esr_ohms).toBeCloseTo(0.08, 3);
    expect(res.body.capacitance_ratio).toBeCloseTo(1, 3);
    expect(res.body.esr_ratio).toBeCloseTo(0.08 / 0.075, 3);
    expect(res.body).toMatchObject({ batch_label: batch, cell_label: 'A1', low_capacitance: false, high_esr: false });
  });

  it('flags a 7 F cell below 80 % of its 10 F rating, and a cell above twice its rated ESR (JSON)', async () => {
    // 7 F / 10 F = 70 % < 80 %: weak (the issue's batch rule).
    const weak = await upload('owner@larkspur.example', 'A2', dischargeLog({ farads: 7, esrOhms: 0.08 }));
    expect(weak.status).toBe(201);
    expect(weak.body.capacitance_farads).toBeCloseTo(7, 2);
    expect(weak.body).toMatchObject({ low_capacitance: true, high_esr: false });
    // 0.2 Ω > 2 × 0.075 Ω = 0.15 Ω: high ESR.
    const s = await signedIn('deployer@larkspur.example');
    const lossy = await s.agent.post('/api/v1/bench/runs').set('origin', s.origin).send({
      batch_label: batch, cell_label: 'A3', nominal_farads: 10, nominal_esr_ohms: 0.075, rated_volts: ratedVolts, current_amps: currentAmps,
      samples: dischargeLog({ farads: 10, esrOhms: 0.2 }),
    });
    expect(lossy.status).toBe(201);
    expect(lossy.body.esr_ohms).toBeCloseTo(0.2, 3);
    expect(lossy.body).toMatchObject({ low_capacitance: false, high_esr: true });
  });

  it('lists the batch with its flags for any member, and nothing of it to another organization', async () => {
    const viewer = await signedIn('viewer@larkspur.example');
    const res = await viewer.agent.get('/api/v1/bench/runs');
    expect(res.status).toBe(200);
    const mine = res.body.batches.find((b: { batch_label: string }) => b.batch_label === batch);
    expect(mine.cells.map((c: { cell_label: string }) => c.cell_label)).toEqual(['A1', 'A2', 'A3']);
    expect(mine.flagged).toBe(2);
    // Mean capacitance ratio (10 + 7 + 10)/3/10 = 0.9 (derived here).
    expect(mine.mean_capacitance_ratio).toBeCloseTo(0.9, 2);
    const other = await signedIn('owner@cinderflats.example');
    const theirs = (await other.agent.get('/api/v1/bench/runs')).body.batches;
    expect(theirs.find((b: { batch_label: string }) => b.batch_label === batch)).toBeUndefined();
  });

  it('refuses viewers (403) and signed-out callers (401)', async () => {
    const res = await upload('viewer@larkspur.example', 'V1', dischargeLog({ farads: 10, esrOhms: 0.08 }));
    expect(res.status).toBe(403);
    const anon = await api().post('/api/v1/bench/runs').set('content-type', 'application/json').send({});
    expect(anon.status).toBe(401);
  });

  it('answers 422 naming missing fields, and a log that never reaches 40 % of the rated voltage', async () => {
    const s = await signedIn('deployer@larkspur.example');
    const missing = await s.agent.post('/api/v1/bench/runs').set('origin', s.origin).field('batch_label', batch).field('rated_volts', '2.7');
    expect(missing.status).toBe(422);
    const pointers = missing.body.errors.map((e: { pointer: string }) => e.pointer);
    for (const p of ['/cell_label', '/nominal_farads', '/nominal_esr_ohms', '/current_amps', '/file']) expect(pointers).toContain(p);
    // Stops at 1.5 V, above V2 = 0.4 × 2.7 = 1.08 V (IEC 62391-1 threshold).
    const short = await upload('deployer@larkspur.example', 'A4', dischargeLog({ farads: 10, esrOhms: 0.08, stopVolts: 1.5 }));
    expect(short.status).toBe(422);
    expect(short.body.errors[0].pointer).toBe('/file');
    expect(short.body.errors[0].detail).toContain('40 %');
    // A bad field and bad lines in the file are named together, so one upload shows all to fix.
    let both = s.agent.post('/api/v1/bench/runs').set('origin', s.origin);
    for (const [name, value] of Object.entries({ ...fields('A5'), current_amps: '-1' })) both = both.field(name, value);
    const mixed = await both.attach('file', Buffer.from('seconds,volts\n0,2.7\n1,abc\n2,2.6\n3;\n'), { filename: 'A5.csv', contentType: 'text/csv' });
    expect(mixed.status).toBe(422);
    const named = mixed.body.errors.map((e: { pointer: string; line?: number }) => `${e.pointer}${e.line ? `:${e.line}` : ''}`);
    expect(named).toEqual(expect.arrayContaining(['/current_amps', '/file:3', '/file:5']));
    // Nothing stored for the refused uploads.
    const listed = (await s.agent.get('/api/v1/bench/runs')).body.batches.find((b: { batch_label: string }) => b.batch_label === batch);
    expect(listed.cells).toHaveLength(3);
  });
});
