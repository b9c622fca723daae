import { spawn } from 'node:child_process';
import autocannon from 'autocannon';
import mysql from 'mysql2/promise';
import { withPeakRss } from './measure';

interface DbConn { socketPath: string; user: string; password: string; database: string }

const BATCH = 500;
const CLIENTS = 8;

/**
 * Baseline: raw mysql2 multi-row inserts, 500 rows a statement, 8 connections at once. The
 * rows are built before the clock starts (as the HTTP run's bodies are), so both runs time
 * only the storing.
 */
export async function rawInsertRowsPerSecond(conn: DbConn, nodeIds: number[], totalRows: number, startMs: number, volts: (i: number) => number = (i) => 4.5 + (i % 50) / 100): Promise<number> {
  const pool = mysql.createPool({ ...conn, connectionLimit: CLIENTS });
  const statements = Array.from({ length: Math.ceil(totalRows / BATCH) }, (_, s) => {
    const nodeId = nodeIds[s % nodeIds.length];
    const base = startMs + Math.floor(s / nodeIds.length) * BATCH * 60_000;
    const first = Math.floor(s / nodeIds.length) * BATCH;
    return Array.from({ length: Math.min(BATCH, totalRows - s * BATCH) }, (_, i) => [nodeId, new Date(base + i * 60_000), volts(first + i)]);
  });
  let next = 0;
  const t0 = performance.now();
  await Promise.all(Array.from({ length: CLIENTS }, async () => {
    for (let s = next++; s < statements.length; s = next++) await pool.query('INSERT INTO readings (node_id, t, v) VALUES ?', [statements[s]]);
  }));
  const seconds = (performance.now() - t0) / 1000;
  await pool.end();
  return totalRows / seconds;
}

/** The same rows through POST /api/v1/readings in batches of 500, 8 clients at once. */
export async function ingestBatchRowsPerSecond(url: string, tokens: string[], totalRows: number, startMs: number) {
  const bodies = Array.from({ length: Math.ceil(totalRows / BATCH) }, (_, p) => {
    const base = startMs + Math.floor(p / tokens.length) * BATCH * 60_000;
    const readings = Array.from({ length: BATCH }, (_, i) => ({ t: new Date(base + i * 60_000).toISOString(), v: 4.5 + (i % 50) / 100 }));
    return { token: tokens[p % tokens.length], body: JSON.stringify({ readings }) };
  });
  let next = 0;
  let accepted = 0;
  let errors = 0;
  const run = async () => {
    const t0 = performance.now();
    await Promise.all(Array.from({ length: CLIENTS }, async () => {
      for (let p = next++; p < bodies.length; p = next++) {
        const { token, body } = bodies[p];
        const res = await fetch(`${url}/api/v1/readings`, { method: 'POST', headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' }, body });
        if (res.ok) accepted += ((await res.json()) as { accepted: number }).accepted;
        else { errors++; await res.text(); }
      }
    }));
    return (performance.now() - t0) / 1000;
  };
  const { value: seconds, peakMb } = await withPeakRss(run);
  return { rowsPerSecond: accepted / seconds, accepted, errors, peakMb };
}

/** autocannon, 32 connections, one reading a request, each request a fresh (node, t). */
export async function singleReadingRequestsPerSecond(url: string, tokens: string[], seconds: number, startMs: number) {
  let counter = 0;
  const run = () => autocannon({
    url: `${url}/api/v1/readings`,
    connections: 32,
    duration: seconds,
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    requests: [{
      setupRequest: (req: Record<string, unknown>) => {
        const n = counter++;
        const token = tokens[n % tokens.length];
        const t = new Date(startMs + Math.floor(n / tokens.length) * 60_000).toISOString();
        return { ...req, headers: { ...(req.headers as object), authorization: `Bearer ${token}` }, body: JSON.stringify({ t, v: 4.6 }) };
      },
    }],
  } as unknown as autocannon.Options);
  const { value: result, peakMb } = await withPeakRss(run);
  return { requestsPerSecond: result.requests.average, non2xx: result.non2xx, errors: result.errors, peakMb, total: result.requests.total };
}

/** Baseline: the same load against a bare Node HTTP server answering a fixed reply. */
export async function bareServerRequestsPerSecond(seconds: number): Promise<number> {
  const port = 3199;
  const child = spawn(process.execPath, ['--import', 'tsx', 'tests/bench/bare-server.ts', String(port)], { stdio: ['ignore', 'pipe', 'inherit'] });
  await new Promise<void>((resolve) => child.stdout!.once('data', () => resolve()));
  try {
    const result = await autocannon({
      url: `http://127.0.0.1:${port}/api/v1/readings`, connections: 32, duration: seconds, method: 'POST',
      headers: { 'content-type': 'application/json', authorization: 'Bearer x' }, body: JSON.stringify({ t: new Date().toISOString(), v: 4.6 }),
    });
    return result.requests.average;
  } finally {
    child.kill('SIGTERM');
  }
}
