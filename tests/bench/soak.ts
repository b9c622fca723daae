import os from 'node:os';
import { profileEnv, resolveProfile } from '@/db/lifecycle/profile';
import { rootKnex } from '@/db/lifecycle/stack';
import { withTestStack } from '@/db/lifecycle/test-stack';
import { startFleet } from '@/simulator/runner/fleet';
import { buildGenericNodes } from '@/simulator/runner/generic-fleet';
import { createBenchFleet } from './fixtures';
import { appRssMb, writeReadmeBlock } from './measure';

/**
 * npm run soak (issue 9, "load held"): 1000 simulated nodes post through the public ingest
 * contract for SOAK_MINUTES (default 10) of wall time at SOAK_SPEED× simulated time, against
 * the real app and MariaDB on test slot 8. Passes when no post got an error answer, every
 * acknowledged reading is in the database once, the queues drained, and the app's memory
 * stayed bounded (last-third peak no more than 20 % over the first-third peak, and < 500 MB).
 * Writes its figures into the README's reliability section.
 */
const NODES = Number(process.env.SOAK_NODES ?? 1000);
const MINUTES = Number(process.env.SOAK_MINUTES ?? 10);
const SPEED = Number(process.env.SOAK_SPEED ?? 120);

async function main() {
  const profile = resolveProfile('test', process.cwd(), 8);
  const env = profileEnv(profile);
  Object.assign(process.env, env);
  const result = await withTestStack(profile, env, async () => {
    const root = rootKnex(profile);
    const bench = await createBenchFleet(root, { nodes: NODES, secret: env.DEVICE_TOKEN_SECRET });
    const sims = buildGenericNodes({ count: NODES, seed: 77, latDeg: 47.1, lonDeg: -120.5, startAt: new Date(Date.now() - (MINUTES * 60 * SPEED) * 1000 - 3_600_000) });
    const samples: { s: number; mb: number }[] = [];
    const t0 = Date.now();
    const sampler = setInterval(() => samples.push({ s: (Date.now() - t0) / 1000, mb: appRssMb() }), 5000);
    let lastLine = 0;
    const fleet = startFleet({
      nodes: sims.map((sim, i) => ({ nodeId: String(bench.nodeIds[i]), token: bench.tokens[i], label: sim.spec.slug, sim })),
      baseUrl: env.APP_URL, speed: SPEED, durationSeconds: MINUTES * 60, drainSeconds: 60,
      sender: { timeoutMs: 10_000 },
      onTick: (f) => {
        if (Date.now() - lastLine < 60_000) return;
        lastLine = Date.now();
        const s = f.stats().totals;
        console.log(`[soak] ${((Date.now() - t0) / 60_000).toFixed(1)} min: ${s.posts} posts, ${s.acked} readings acked, queued ${s.queued}, errors ${JSON.stringify(s.errors)}, app ${appRssMb().toFixed(0)} MB`);
      },
    });
    const final = await fleet.done;
    clearInterval(sampler);
    const wallSeconds = (Date.now() - t0) / 1000;
    const stored = Number((await root('readings').whereIn('node_id', bench.nodeIds).count({ n: '*' }))[0].n);
    const distinct = Number((await root.raw('SELECT COUNT(*) AS n FROM (SELECT DISTINCT node_id, t FROM readings WHERE node_id BETWEEN ? AND ?) d', [bench.nodeIds[0], bench.nodeIds[bench.nodeIds.length - 1]]))[0][0].n);
    await root.destroy();
    return { final: final.totals, wallSeconds, stored, distinct, samples };
  });

  const { final, wallSeconds, stored, distinct, samples } = result;
  const third = Math.max(1, Math.floor(samples.length / 3));
  const peak = (xs: { mb: number }[]) => Math.max(...xs.map((x) => x.mb));
  const early = peak(samples.slice(0, third));
  const late = peak(samples.slice(-third));
  const errors = Object.values(final.errors).reduce((a, b) => a + b, 0);
  const checks = {
    'no error answers': errors === 0 && final.mismatches === 0,
    'acknowledged = stored, once each': final.acked === stored && stored === distinct && final.accepted === final.acked,
    'queues drained, nothing dropped': final.queued === 0 && final.dropped === 0,
    'memory bounded': late <= early * 1.2 && late < 500,
  };
  const ok = Object.values(checks).every(Boolean);
  const header = `Soak ${new Date().toISOString().slice(0, 16)}Z on ${os.cpus().length} × ${os.cpus()[0]?.model ?? 'CPU'}: ${NODES} simulated nodes (simulator/runner, the public ingest contract), ${MINUTES} min of wall time at ${SPEED}× simulated time.`;
  const table = [
    '| figure | value |', '| --- | --- |',
    `| posts answered | ${final.posts} (${(final.posts / wallSeconds).toFixed(0)}/s) |`,
    `| readings acknowledged / stored / distinct | ${final.acked} / ${stored} / ${distinct} |`,
    `| error answers, dropped, left queued | ${errors} (${JSON.stringify(final.errors)}), ${final.dropped}, ${final.queued} |`,
    `| app memory, peak first third → last third | ${early.toFixed(0)} MB → ${late.toFixed(0)} MB |`,
    ...Object.entries(checks).map(([what, pass]) => `| ${what} | ${pass ? 'held' : 'FAILED'} |`),
  ].join('\n');
  console.log(`\n${header}\n\n${table}\n`);
  if (NODES === 1000 && MINUTES >= 10) writeReadmeBlock('soak', `${header}\n\n${table}`);
  process.exit(ok ? 0 : 1);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
