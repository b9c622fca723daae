import { spawn } from 'node:child_process';
import autocannon from 'autocannon';
import type { Knex } from 'knex';
import mysql from 'mysql2/promise';
import type { NormalizedReading } from '@/lib/ingest/normalize';
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

/**
 * The same rows through POST /api/v1/readings in batches of 500, 8 connections at once
 * (autocannon, like the single-reading run: a lean client, so that on two cores the load tool
 * takes about the share of the machine the mysql2 client takes in the raw run). The readings
 * stored are counted in the table afterwards, so the figure is what was durably stored.
 */
export async function ingestBatchRowsPerSecond(url: string, conn: DbConn, devices: { tokens: string[]; nodeIds: number[] }, totalRows: number, startMs: number) {
  const { tokens, nodeIds } = devices;
  const bodies = Array.from({ length: Math.ceil(totalRows / BATCH) }, (_, p) => {
    const base = startMs + Math.floor(p / tokens.length) * BATCH * 60_000;
    const readings = Array.from({ length: BATCH }, (_, i) => ({ t: new Date(base + i * 60_000).toISOString(), v: 4.5 + (i % 50) / 100 }));
    return { authorization: `Bearer ${tokens[p % tokens.length]}`, body: JSON.stringify({ readings }) };
  });
  let next = 0;
  const run = async () => {
    // Timed to the last reply, not to when autocannon resolves: autocannon notices that its
    // `amount` is done only on its one-second tick, which on a 4-second run is up to a
    // quarter of the figure (the app's results came out in steps of 800k/4 s and 800k/5 s).
    let lastReplyMs = 0;
    const t0 = performance.now();
    const result = await autocannon({
      url: `${url}/api/v1/readings`, connections: CLIENTS, amount: bodies.length, method: 'POST',
      requests: [{
        setupRequest: (req: Record<string, unknown>) => {
          const { authorization, body } = bodies[Math.min(next++, bodies.length - 1)];
          return { ...req, headers: { 'content-type': 'application/json', authorization }, body };
        },
        onResponse: () => { lastReplyMs = performance.now(); },
      }],
    } as unknown as autocannon.Options);
    return { seconds: ((lastReplyMs || performance.now()) - t0) / 1000, result };
  };
  const { value: { seconds, result }, peakMb } = await withPeakRss(run);
  const db = await mysql.createConnection(conn);
  const [rows] = await db.query('SELECT COUNT(*) AS n FROM readings WHERE node_id IN (?) AND t >= ? AND t < ?',
    [nodeIds, new Date(startMs), new Date(startMs + Math.ceil(bodies.length / tokens.length) * BATCH * 60_000)]);
  await db.end();
  const accepted = Number((rows as { n: number }[])[0].n);
  return { rowsPerSecond: accepted / seconds, accepted, errors: result.non2xx + result.errors, peakMb };
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

/**
 * A post's database work without HTTP: the device check and the grouped store of readings
 * already validated, through lib/ingest itself, with a fixed status in place of the energy
 * model. `close` ends the pools it opened in the bench process.
 */
async function ingestWithoutHttp() {
  const { authenticateDevice } = await import('@/lib/ingest/device-auth');
  const { storeAllNewGrouped } = await import('@/lib/ingest/store-fast');
  return {
    async store(token: string, readings: NormalizedReading[]): Promise<boolean> {
      const device = await authenticateDevice({ headers: { get: (name) => (name === 'authorization' ? `Bearer ${token}` : null) }, body: null });
      const status = { ...FIXED_STATUS, last_reading_at: readings[readings.length - 1].t, evaluated_at: new Date() };
      return storeAllNewGrouped({ nodeId: device.nodeId, orgId: device.orgId, readings, status });
    },
    async close() {
      await (await import('@/lib/db/fast-pool')).closeFastPool();
      await (await import('@/lib/db/knex')).closeDb();
    },
  };
}

const reading = (t: Date, v: number): NormalizedReading => ({ t, v, vp: null, temp: null, rssi: null, seq: null });

/**
 * A ceiling for the single-reading run: the same posts' database work alone (see
 * ingestWithoutHttp) from 32 callers at once inside the bench process. However lean the
 * route, posts per second cannot pass this on the same machine.
 */
export async function databaseWorkReadingsPerSecond(tokens: string[], seconds: number, startMs: number) {
  const ingest = await ingestWithoutHttp();
  let counter = 0;
  let stored = 0;
  const t0 = performance.now();
  const until = t0 + seconds * 1000;
  await Promise.all(Array.from({ length: 32 }, async () => {
    while (performance.now() < until) {
      const n = counter++;
      const t = new Date(startMs + Math.floor(n / tokens.length) * 60_000);
      if (await ingest.store(tokens[n % tokens.length], [reading(t, 4.6)])) stored++;
    }
  }));
  const perSecond = stored / ((performance.now() - t0) / 1000);
  await ingest.close();
  return perSecond;
}

/**
 * The same for the batch run: 8 callers storing the same 500-reading posts, with no HTTP and
 * no JSON: what the database side of ingest reaches on this machine, beside the raw insert.
 */
export async function databaseWorkBatchRowsPerSecond(tokens: string[], totalRows: number, startMs: number) {
  const ingest = await ingestWithoutHttp();
  const posts = Array.from({ length: Math.ceil(totalRows / BATCH) }, (_, p) => {
    const base = startMs + Math.floor(p / tokens.length) * BATCH * 60_000;
    return { token: tokens[p % tokens.length], readings: Array.from({ length: BATCH }, (_, i) => reading(new Date(base + i * 60_000), 4.5 + (i % 50) / 100)) };
  });
  let next = 0;
  let stored = 0;
  const t0 = performance.now();
  await Promise.all(Array.from({ length: CLIENTS }, async () => {
    for (let p = next++; p < posts.length; p = next++) {
      if (await ingest.store(posts[p].token, posts[p].readings)) stored += posts[p].readings.length;
    }
  }));
  const perSecond = stored / ((performance.now() - t0) / 1000);
  await ingest.close();
  return perSecond;
}

const FIXED_STATUS = {
  state: 'steady', volts: 4.6, panel_volts: null, energy_joules: 130, soc: 0.85, burst_floor_volts: 2.1, reserve_joules: 100,
  margin: 2, load_watts: 0.01, recharge_at: null, brownout_at: null, next_report_s: 600,
} as const;

/** The energy model's evaluation of one reading (the status every post updates), on one core. */
export async function modelMicrosecondsPerReading(knex: Knex) {
  const { deriveNodeStatus } = await import('@/lib/status/derive-status');
  const { modelSpecFromRows } = await import('@/lib/status/node-spec');
  const node = await knex('nodes').first();
  const site = await knex('sites').where({ id: node.site_id }).first();
  const spec = modelSpecFromRows(node, site);
  const run = (n: number) => {
    const t0 = performance.now();
    for (let i = 0; i < n; i++) {
      deriveNodeStatus({ spec, latest: { t: new Date(Date.now() - i * 60_000), volts: 3.6 + (i % 20) / 10, panelVolts: null }, now: new Date(), thresholds: { steady: 1.5, thin: 1.1 } });
    }
    return ((performance.now() - t0) * 1000) / n;
  };
  run(2000);
  return run(20_000);
}
