import type { Knex } from 'knex';
import os from 'node:os';
import { profileEnv, resolveProfile } from '@/db/lifecycle/profile';
import { rootKnex } from '@/db/lifecycle/stack';
import { withTestStack } from '@/db/lifecycle/test-stack';
import { createBenchFleet } from './fixtures';
import { bareServerRequestsPerSecond, databaseWorkBatchRowsPerSecond, databaseWorkReadingsPerSecond, ingestBatchRowsPerSecond, modelMicrosecondsPerReading, rawInsertRowsPerSecond, singleReadingRequestsPerSecond } from './ingest';
import { writeReadmeBlock } from './measure';
import { extraBenches } from './more';

/**
 * npm run bench: benchmarks on loopback against the real app and MariaDB (test slot 9, its own
 * data dir and ports). Every figure is a ratio against a baseline measured in the same run.
 * Prints a table and writes it into the README's performance section.
 */
export interface Row { what: string; figure: string; baseline: string; ratio: string; target: string; ok: boolean | null; tool: string }

async function main() {
  const profile = resolveProfile('test', process.cwd(), 9);
  const env = profileEnv(profile);
  Object.assign(process.env, env);
  const rows: Row[] = [];
  await withTestStack(profile, env, async () => {
    const root = rootKnex(profile);
    const fleet = await createBenchFleet(root, { nodes: 1000, secret: env.DEVICE_TOKEN_SECRET });
    // The same transport the app uses (the private Unix socket), so the ratio compares like with like.
    const conn = { socketPath: profile.socketPath, user: 'duskwatch_app', password: env.DB_PASSWORD, database: profile.dbName };
    const day = 86_400_000;
    const rowsPerRun = 800_000;

    // Eight clients uploading backlogs for 32 devices (four each, so no device passes its rate
    // limit); the raw baseline writes the same rows for the same 32 nodes. Both are warmed up
    // first on other nodes and times (JIT, pools, buffer pool), since one run lasts seconds, and
    // then run in turns, three rounds each, each round on days of its own: this VM's disk and
    // CPU drift by a third within minutes, so the figures are the medians of the three.
    const devices = 32;
    const only = process.env.BENCH_ONLY;
    let batch = { rowsPerSecond: 0, errors: 0, peakMb: 0 };
    let singlePeakMb = 0;
    if (only !== 'single') {
      await rawInsertRowsPerSecond(conn, fleet.nodeIds.slice(900, 908), 20_000, Date.now() - 395 * day);
      await ingestBatchRowsPerSecond(env.APP_URL, conn, slice(fleet, 908, 916), 20_000, Date.now() - 330 * day);
      const raws: number[] = [];
      const runs: (typeof batch)[] = [];
      for (let round = 0; round < 3; round++) {
        await settle(root);
        raws.push(await rawInsertRowsPerSecond(conn, fleet.nodeIds.slice(0, devices), rowsPerRun, Date.now() - (380 - 20 * round) * day));
        await settle(root);
        runs.push(await ingestBatchRowsPerSecond(env.APP_URL, conn, slice(fleet, 0, devices), rowsPerRun, Date.now() - (300 - 20 * round) * day));
      }
      const raw = median(raws);
      batch = { rowsPerSecond: median(runs.map((r) => r.rowsPerSecond)), errors: runs.reduce((n, r) => n + r.errors, 0), peakMb: Math.max(...runs.map((r) => r.peakMb)) };
      console.log(`[bench] batch rounds: raw ${raws.map((x) => x.toFixed(0)).join(', ')}; app ${runs.map((r) => r.rowsPerSecond.toFixed(0)).join(', ')}`);
      rows.push({ what: 'Ingest, batches of 500, 8 clients (readings/s)', figure: batch.rowsPerSecond.toFixed(0), baseline: `raw mysql2 multi-row insert ${raw.toFixed(0)}/s`,
        ratio: pct(batch.rowsPerSecond / raw), target: '≥ 50 %', ok: batch.rowsPerSecond / raw >= 0.5 && batch.errors === 0, tool: 'autocannon, 8 connections, 32 devices, stored rows counted; medians of 3 interleaved rounds' });
      // Where the rest goes: the same posts' database work alone, beside the raw insert.
      await settle(root);
      const dbBatch = await databaseWorkBatchRowsPerSecond(fleet.tokens.slice(0, devices), rowsPerRun, Date.now() - 240 * day);
      rows.push({ what: '… its database work alone (readings, rollups, status; no HTTP, no JSON)', figure: dbBatch.toFixed(0), baseline: `raw mysql2 multi-row insert ${raw.toFixed(0)}/s`,
        ratio: pct(dbBatch / raw), target: 'informative', ok: null, tool: 'lib/ingest in the bench process, 8 callers' });
    }

    // BENCH_ONLY=batch: only the batch rows (for tuning).
    if (only !== 'batch') {
      const bare = await bareServerRequestsPerSecond(10);
      const single = await singleReadingRequestsPerSecond(env.APP_URL, fleet.tokens, 15, Date.now() - 200 * day);
      rows.push({ what: 'Ingest, one reading a request, 32 clients (requests/s)', figure: single.requestsPerSecond.toFixed(0), baseline: `bare Node HTTP fixed reply ${bare.toFixed(0)}/s`,
        ratio: pct(single.requestsPerSecond / bare), target: '≥ 40 % and ≥ 1000/s', ok: single.requestsPerSecond / bare >= 0.4 && single.requestsPerSecond >= 1000 && single.non2xx === 0, tool: 'autocannon' });
      // Why the 40 % is out of reach here: what the same posts cost without HTTP, and the model's share.
      const dbOnly = await databaseWorkReadingsPerSecond(fleet.tokens, 10, Date.now() - 150 * day);
      rows.push({ what: '… its database work alone, 32 callers, no HTTP, no model (readings/s)', figure: dbOnly.toFixed(0), baseline: `bare Node HTTP fixed reply ${bare.toFixed(0)}/s`,
        ratio: pct(dbOnly / bare), target: 'ceiling (informative)', ok: null, tool: 'lib/ingest in the bench process' });
      const modelUs = await modelMicrosecondsPerReading(root);
      rows.push({ what: '… the energy model for one reading (µs, one core)', figure: modelUs.toFixed(0), baseline: `${((0.4 * bare * modelUs) / 1e6).toFixed(2)} cores at 40 % of bare`,
        ratio: '—', target: 'informative', ok: null, tool: 'deriveNodeStatus in a loop' });
      singlePeakMb = single.peakMb;
      if (single.non2xx) console.log(`[bench] single-reading run: ${single.non2xx} non-2xx answers`);
    }
    rows.push({ what: 'App resident memory under ingest load (MB)', figure: Math.max(batch.peakMb, singlePeakMb).toFixed(0), baseline: '—', ratio: '—', target: '< 500 MB', ok: Math.max(batch.peakMb, singlePeakMb) < 500, tool: '/proc VmRSS' });

    // BENCH_ONLY=ingest|batch|single: those rows only, printed and not written to the README (for tuning).
    if (!process.env.BENCH_ONLY) rows.push(...(await extraBenches({ env, profile, root, fleet })));
    await root.destroy();
  });
  report(rows);
}

/** The tokens and node ids of fleet nodes [from, to). */
const slice = (fleet: { tokens: string[]; nodeIds: number[] }, from: number, to: number) => ({ tokens: fleet.tokens.slice(from, to), nodeIds: fleet.nodeIds.slice(from, to) });
/**
 * Lets InnoDB write out the dirty pages the previous run left (up to 30 s), so that no run
 * pays for the one before it: without this the run after a big insert did the flushing of both.
 */
async function settle(root: Knex) {
  const [[{ Value: pct }]] = await root.raw("SHOW GLOBAL VARIABLES LIKE 'innodb_max_dirty_pages_pct'");
  await root.raw('SET GLOBAL innodb_max_dirty_pages_pct = 0');
  try {
    for (const until = Date.now() + 30_000; Date.now() < until;) {
      const [[{ Value: dirty }]] = await root.raw("SHOW GLOBAL STATUS LIKE 'Innodb_buffer_pool_pages_dirty'");
      if (Number(dirty) < 100) break;
      await new Promise((resolve) => setTimeout(resolve, 250));
    }
  } finally {
    await root.raw('SET GLOBAL innodb_max_dirty_pages_pct = ?', [Number(pct)]);
  }
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const pct = (x: number) => `${(x * 100).toFixed(0)} %`;

function report(rows: Row[]) {
  const cpu = os.cpus()[0]?.model ?? 'unknown CPU';
  const header = `Measured ${new Date().toISOString().slice(0, 16)}Z on ${os.cpus().length} × ${cpu}, ${(os.totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}, MariaDB 10.11 (durable commits).`;
  const table = [
    '| what | figure | baseline (same run) | ratio | target | met | load tool |',
    '| --- | --- | --- | --- | --- | --- | --- |',
    ...rows.map((r) => `| ${r.what} | ${r.figure} | ${r.baseline} | ${r.ratio} | ${r.target} | ${r.ok === null ? '—' : r.ok ? 'yes' : 'no'} | ${r.tool} |`),
  ].join('\n');
  console.log(`\n${header}\n\n${table}\n`);
  if (!process.env.BENCH_ONLY) writeReadmeBlock('bench', `${header}\n\n${table}`);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
