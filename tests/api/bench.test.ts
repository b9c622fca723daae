import { describe, expect, it } from 'vitest';
import { api } from './helpers/stack';
import { signedIn } from './helpers/session';

// POST /api/v1/bench/characterize against the running app, with synthetic IEC 62391-1 logs.
// REFERENCES.md derived vector: 10 F, U_R = 2.7 V, class 2 → I = 0.4·C·U_R mA = 10.8 mA;
// V1 = 2.16 V, V2 = 1.08 V, t2 − t1 = 1000 s.
const ratedVolts = 2.7;
const currentAmps = 0.0108;
const farads = 10;
const esrOhms = 0.25;

/**
 * An ideal constant-current discharge: resting at U_R at t = 0, then the IR step and the
 * straight fall dV/dt = −I/C, one sample a second down to `stopVolts`.
 */
function dischargeLog({ stopVolts = 0.9, startVolts = ratedVolts } = {}): [number, number][] {
  const log: [number, number][] = [[0, startVolts]];
  for (let t = 1; ; t++) {
    const volts = startVolts - currentAmps * esrOhms - (currentAmps * t) / farads;
    if (volts < stopVolts) break;
    log.push([t, Number(volts.toFixed(6))]);
  }
  return log;
}

const csvOf = (log: [number, number][]) => 'seconds,volts\n' + log.map(([t, v]) => `${t},${v}`).join('\n') + '\n';

async function characterizeJson(payload: unknown, email = 'deployer@larkspur.example') {
  const s = await signedIn(email);
  return s.agent.post('/api/v1/bench/characterize').set('origin', s.origin).send(payload as object);
}

async function characterizeCsv(csv: string, fields: Record<string, string> = { rated_volts: '2.7', current_amps: '0.0108' }) {
  const s = await signedIn('owner@larkspur.example');
  let req = s.agent.post('/api/v1/bench/characterize').set('origin', s.origin);
  for (const [name, value] of Object.entries(fields)) req = req.field(name, value);
  return req.attach('file', Buffer.from(csv), { filename: 'cell-07.csv', contentType: 'text/csv' });
}

function expectRecovered(body: Record<string, number>) {
  // REFERENCES.md derived vector: t2 − t1 = 1000 s for 10 F at 10.8 mA between 2.16 V and 1.08 V.
  expect(body.t2_seconds - body.t1_seconds).toBeCloseTo(1000, 1);
  // t1: 2.7 − I·R − I·t/C = 2.16 V → t1 = (0.54 − I·R)·C/I (derived here from the synthetic log).
  expect(body.t1_seconds).toBeCloseTo(((0.54 - currentAmps * esrOhms) * farads) / currentAmps, 1);
  // C = I·(t2 − t1)/(V1 − V2) (IEC 62391-1, REFERENCES.md) recovers the 10 F the log was made with.
  expect(body.capacitance_farads).toBeCloseTo(farads, 2);
  // R = ΔV/I from the straight part extrapolated to the start (IEC 62391-1): the 0.25 Ω put in.
  expect(body.esr_ohms).toBeCloseTo(esrOhms, 2);
}

describe('POST /api/v1/bench/characterize', () => {
  it('recovers C and ESR from a JSON class-2 log of a 10 F / 2.7 V cell', async () => {
    const res = await characterizeJson({ rated_volts: ratedVolts, current_amps: currentAmps, samples: dischargeLog() });
    expect(res.status).toBe(200);
    expect(Object.keys(res.body).sort()).toEqual(['capacitance_farads', 'esr_ohms', 't1_seconds', 't2_seconds']);
    expectRecovered(res.body);
  });

  it('recovers the same from a CSV upload (multipart/form-data, CRLF line ends)', async () => {
    const res = await characterizeCsv(csvOf(dischargeLog()).replace(/\n/g, '\r\n'));
    expect(res.status).toBe(200);
    expectRecovered(res.body);
  });

  it('takes a log of 200 000 samples (a class-4 discharge logged at 10 kHz) and refuses one more', async () => {
    // IEC 62391-1 class 4: I = 40·C·U_R mA = 1080 mA for 10 F / 2.7 V (REFERENCES.md); then
    // t2 − t1 = C·(V1 − V2)/I = 10·1.08/1.08 = 10 s (derived here from the standard's formula).
    const amps = 1.08;
    const samples: [number, number][] = [[0, ratedVolts]];
    // 2.7 V down to 0.54 V in 20 s: 200 000 samples, 0.1 ms apart.
    for (let i = 1; i < 200_000; i++) samples.push([i / 10_000, Number((ratedVolts - amps * 0.01 - (amps * i) / 10_000 / farads).toFixed(6))]);
    const ok = await characterizeJson({ rated_volts: ratedVolts, current_amps: amps, samples });
    expect(ok.status).toBe(200);
    expect(ok.body.t2_seconds - ok.body.t1_seconds).toBeCloseTo(10, 3);
    expect(ok.body.capacitance_farads).toBeCloseTo(farads, 3);
    expect(ok.body.esr_ohms).toBeCloseTo(0.01, 3); // the 10.8 mV step put in at 1.08 A (R = ΔV/I, IEC 62391-1)
    const tooMany = await characterizeJson({ rated_volts: ratedVolts, current_amps: amps, samples: [...samples, [20, 0.5]] });
    expect(tooMany.status).toBe(422);
    expect(tooMany.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/samples']);
  });

  it('says which threshold a log never crosses: 40 % of rated', async () => {
    const res = await characterizeJson({ rated_volts: ratedVolts, current_amps: currentAmps, samples: dischargeLog({ stopVolts: 1.5 }) });
    expect(res.status).toBe(422);
    expect(res.headers['content-type']).toContain('application/problem+json');
    expect(res.body.errors[0].pointer).toBe('/samples');
    expect(res.body.errors[0].detail).toContain('40 %');
    expect(res.body.threshold_volts).toBeCloseTo(1.08, 6); // 0.4 × 2.7 V (IEC 62391-1 V2)
  });

  it('says 80 % when the log starts below it, also for an upload', async () => {
    const res = await characterizeCsv(csvOf(dischargeLog({ startVolts: 2.0 })));
    expect(res.status).toBe(422);
    expect(res.body.errors[0].pointer).toBe('/file');
    expect(res.body.errors[0].detail).toContain('80 %');
    expect(res.body.threshold_volts).toBeCloseTo(2.16, 6); // 0.8 × 2.7 V (IEC 62391-1 V1)
  });

  it('names the malformed CSV lines by number', async () => {
    const lines = csvOf(dischargeLog()).split('\n');
    lines[4] = '4,two point six'; // line 5 of the file, counting the header as line 1
    lines[9] = '9;2.6;extra';
    const res = await characterizeCsv(lines.join('\n'));
    expect(res.status).toBe(422);
    expect(res.body.errors.map((e: { line: number }) => e.line)).toEqual([5, 10]);
    expect(res.body.errors[0].detail).toMatch(/^line 5:/);
    const noHeader = await characterizeCsv(csvOf(dischargeLog()).split('\n').slice(1).join('\n'));
    expect(noHeader.status).toBe(422);
    expect(noHeader.body.errors[0].line).toBe(1);
  });

  it('names missing upload fields and a non-positive current', async () => {
    const missing = await characterizeCsv(csvOf(dischargeLog()), { rated_volts: '2.7' });
    expect(missing.status).toBe(422);
    expect(missing.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/current_amps']);
    const zero = await characterizeJson({ rated_volts: ratedVolts, current_amps: 0, samples: dischargeLog() });
    expect(zero.status).toBe(422);
    expect(zero.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/current_amps']);
  });

  it('answers 415 to other media types, 403 to a viewer and 401 signed out', async () => {
    const s = await signedIn('deployer@larkspur.example');
    const text = await s.agent.post('/api/v1/bench/characterize').set('origin', s.origin).set('content-type', 'text/csv').send(csvOf(dischargeLog()));
    expect(text.status).toBe(415);
    const viewer = await characterizeJson({ rated_volts: ratedVolts, current_amps: currentAmps, samples: dischargeLog() }, 'viewer@larkspur.example');
    expect(viewer.status).toBe(403);
    const out = await api().post('/api/v1/bench/characterize').set('origin', process.env.APP_URL!).send({});
    expect(out.status).toBe(401);
  });
});
