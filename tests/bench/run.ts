import os from 'node:os';
import { profileEnv, resolveProfile } from '@/db/lifecycle/profile';
import { rootKnex } from '@/db/lifecycle/stack';
import { withTestStack } from '@/db/lifecycle/test-stack';
import { createBenchFleet } from './fixtures';
import { bareServerRequestsPerSecond, ingestBatchRowsPerSecond, rawInsertRowsPerSecond, singleReadingRequestsPerSecond } from './ingest';
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
    const startRaw = Date.now() - 380 * day;
    const startHttp = Date.now() - 300 * day;
    const rowsPerRun = 800_000;

    // Eight clients uploading backlogs for 32 devices (four each, so no device passes its rate
    // limit); the raw baseline writes the same rows for the same 32 nodes. Both are warmed up
    // first on other nodes and times (JIT, pools, buffer pool), since one run lasts seconds.
    const devices = 32;
    // BENCH_ONLY=single: only the one-reading-a-request rows (for tuning).
    let batch = { rowsPerSecond: 0, errors: 0, peakMb: 0 };
    if (process.env.BENCH_ONLY !== 'single') {
      await rawInsertRowsPerSecond(conn, fleet.nodeIds.slice(900, 908), 20_000, Date.now() - 395 * day);
      await ingestBatchRowsPerSecond(env.APP_URL, fleet.tokens.slice(908, 916), 20_000, Date.now() - 330 * day);
      const raw = await rawInsertRowsPerSecond(conn, fleet.nodeIds.slice(0, devices), rowsPerRun, startRaw);
      batch = await ingestBatchRowsPerSecond(env.APP_URL, fleet.tokens.slice(0, devices), rowsPerRun, startHttp);
      rows.push({ what: 'Ingest, batches of 500, 8 clients (readings/s)', figure: batch.rowsPerSecond.toFixed(0), baseline: `raw mysql2 multi-row insert ${raw.toFixed(0)}/s`,
        ratio: pct(batch.rowsPerSecond / raw), target: '≥ 50 %', ok: batch.rowsPerSecond / raw >= 0.5 && batch.errors === 0, tool: 'fetch, 8 concurrent clients, 32 devices' });
    }

    const bare = await bareServerRequestsPerSecond(10);
    const single = await singleReadingRequestsPerSecond(env.APP_URL, fleet.tokens, 15, Date.now() - 200 * day);
    rows.push({ what: 'Ingest, one reading a request, 32 clients (requests/s)', figure: single.requestsPerSecond.toFixed(0), baseline: `bare Node HTTP fixed reply ${bare.toFixed(0)}/s`,
      ratio: pct(single.requestsPerSecond / bare), target: '≥ 40 % and ≥ 1000/s', ok: single.requestsPerSecond / bare >= 0.4 && single.requestsPerSecond >= 1000 && single.non2xx === 0, tool: 'autocannon' });
    rows.push({ what: 'App resident memory under ingest load (MB)', figure: Math.max(batch.peakMb, single.peakMb).toFixed(0), baseline: '—', ratio: '—', target: '< 500 MB', ok: Math.max(batch.peakMb, single.peakMb) < 500, tool: '/proc VmRSS' });
    if (single.non2xx) console.log(`[bench] single-reading run: ${single.non2xx} non-2xx answers`);

    // BENCH_ONLY=ingest|single: those rows only, printed and not written to the README (for tuning).
    if (!process.env.BENCH_ONLY) rows.push(...(await extraBenches({ env, profile, root, fleet })));
    await root.destroy();
  });
  report(rows);
}

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
