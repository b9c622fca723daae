import { readFileSync } from 'node:fs';
import type { Knex } from 'knex';
import { chromium } from 'playwright-core';
import type { Profile } from '@/db/lifecycle/profile';
import { BENCH_OWNER } from './fixtures';
import { rawInsertRowsPerSecond } from './ingest';
import { percentile, withPeakRss } from './measure';
import type { Row } from './run';

/** Series, fleet, margin pass, chart drawing, import memory, partition pruning. */
export async function extraBenches(ctx: { env: Record<string, string>; profile: Profile; root: Knex; fleet: { orgId: number; nodeIds: number[]; tokens: string[] } }): Promise<Row[]> {
  const { env, profile, root, fleet } = ctx;
  const rows: Row[] = [];
  process.env.DUSKWATCH_TEST_STACK = '1';
  const { signedIn } = await import('../api/helpers/session');
  const owner = await signedIn(BENCH_OWNER.email, BENCH_OWNER.password);
  const conn = { socketPath: profile.socketPath, user: 'duskwatch_app', password: env.DB_PASSWORD, database: profile.dbName };

  // A year of one-minute readings for one node, in a table of at least 10 million rows.
  const yearNode = fleet.nodeIds[0];
  const yearStart = Date.now() - 365 * 86_400_000;
  await root('readings').where({ node_id: yearNode }).delete();
  await rawInsertRowsPerSecond(conn, [yearNode], 525_600, yearStart, (i) => 4.2 + 0.9 * Math.max(0, Math.sin((i / 1440) * 2 * Math.PI)));
  const [{ n: before }] = await root('readings').count({ n: '*' });
  if (Number(before) < 10_000_000) await rawInsertRowsPerSecond(conn, fleet.nodeIds.slice(1), 10_000_000 - Number(before), Date.now() - 390 * 86_400_000);
  const { rebuildRollups } = await import('@/lib/db/queries/rollups');
  await rebuildRollups(root, yearNode);
  const [{ n: total }] = await root('readings').count({ n: '*' });

  const ranges = [1, 7, 30, 90, 365];
  const seriesMs: number[] = [];
  let maxBuckets = 0;
  for (let k = 0; k < 8; k++) {
    for (const days of ranges) {
      const to = Math.floor(Date.now() / 1000);
      const t0 = performance.now();
      const res = await owner.agent.get(`/api/v1/nodes/${yearNode}/series?from=${to - days * 86_400}&to=${to}&buckets=2000`);
      seriesMs.push(performance.now() - t0);
      maxBuckets = Math.max(maxBuckets, res.body.count ?? res.body.buckets?.t?.length ?? 0);
    }
  }
  const seriesP95 = percentile(seriesMs, 95);
  rows.push({ what: `Series, a year of 1-minute readings in a ${(Number(total) / 1e6).toFixed(1)} M-row table, ranges 1 d–1 y (p95 ms)`, figure: seriesP95.toFixed(0), baseline: `≤ ${maxBuckets} buckets a reply`, ratio: '—', target: '≤ 150 ms, ≤ 2000 buckets', ok: seriesP95 <= 150 && maxBuckets <= 2000, tool: 'supertest, 40 requests' });

  // Margin pass over the 1000 bench nodes, then the fleet endpoint over them.
  const { db } = await import('@/lib/db/knex');
  const { runMarginPass } = await import('@/lib/jobs/margin-pass');
  const t0 = performance.now();
  const pass = await runMarginPass({ knex: db(), appUrl: env.APP_URL, orgIds: [fleet.orgId] });
  const passSeconds = (performance.now() - t0) / 1000;
  rows.push({ what: `Margin pass over ${pass.nodes.length} nodes (s)`, figure: passSeconds.toFixed(2), baseline: '—', ratio: '—', target: '≤ 5 s', ok: passSeconds <= 5 && pass.failures.length === 0, tool: 'runMarginPass, in process' });

  const fleetMs: number[] = [];
  let listed = 0;
  for (let i = 0; i < 40; i++) {
    const t1 = performance.now();
    const res = await owner.agent.get('/api/v1/fleet');
    fleetMs.push(performance.now() - t1);
    listed = res.body.nodes?.length ?? 0;
  }
  const fleetP95 = percentile(fleetMs, 95);
  rows.push({ what: `Fleet endpoint with ${listed} nodes (p95 ms)`, figure: fleetP95.toFixed(0), baseline: '—', ratio: '—', target: '≤ 100 ms', ok: fleetP95 <= 100 && listed >= 1000, tool: 'supertest, 40 requests' });

  // A 100,000-line CSV import: the app's memory may not grow by more than 100 MB.
  const lines = ['t,v'];
  const importStart = Math.floor((Date.now() - 120 * 86_400_000) / 1000);
  for (let i = 0; i < 100_000; i++) lines.push(`${importStart + i * 60},${(4.5 + 0.3 * Math.sin(i / 500)).toFixed(3)}`);
  const { value: imported, peakMb, startMb } = await withPeakRss(async () =>
    owner.agent.post(`/api/v1/nodes/${fleet.nodeIds[1]}/imports`).set('origin', env.APP_URL).attach('file', Buffer.from(lines.join('\n')), 'year.csv'));
  const growth = peakMb - startMb;
  rows.push({ what: 'App memory growth during a 100,000-line CSV import (MB)', figure: growth.toFixed(0), baseline: `${startMb.toFixed(0)} MB before`, ratio: '—', target: '≤ 100 MB', ok: growth <= 100 && imported.status === 201, tool: '/proc VmRSS' });

  // Partitioning: a one-day range touches one or two monthly partitions of the readings table.
  const [explain] = await root.raw('EXPLAIN PARTITIONS SELECT COUNT(*) FROM readings WHERE node_id = ? AND t >= ? AND t < ?', [yearNode, new Date(Date.now() - 86_400_000), new Date()]);
  const parts = String(explain[0].partitions ?? '').split(',').filter(Boolean).length;
  const [[{ n: partitionCount }]] = await root.raw("SELECT COUNT(*) AS n FROM information_schema.PARTITIONS WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'readings'");
  rows.push({ what: 'Partition pruning: partitions read for a one-day range', figure: String(parts), baseline: `${partitionCount} monthly partitions`, ratio: '—', target: '≤ 2', ok: parts <= 2, tool: 'EXPLAIN PARTITIONS' });

  rows.push(...(await (await import('./retention')).retentionBenches({ profile, root })));
  rows.push(await chartDraw());
  return rows;
}

/** uPlot drawing 100,000 points in Debian's headless Chromium. */
async function chartDraw(): Promise<Row> {
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync'] });
  try {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    await page.setContent('<div id="c"></div>');
    await page.addStyleTag({ content: readFileSync('node_modules/uplot/dist/uPlot.min.css', 'utf8') });
    await page.addScriptTag({ content: readFileSync('node_modules/uplot/dist/uPlot.iife.min.js', 'utf8') });
    const times: number[] = await page.evaluate(async () => {
      const n = 100_000;
      const xs = new Float64Array(n);
      const ys = new Float64Array(n);
      for (let i = 0; i < n; i++) { xs[i] = 1_700_000_000 + i * 60; ys[i] = 4.2 + Math.sin(i / 700); }
      const out: number[] = [];
      for (let k = 0; k < 5; k++) {
        const el = document.getElementById('c')!;
        el.innerHTML = '';
        const t0 = performance.now();
        // eslint-disable-next-line @typescript-eslint/no-explicit-any
        const U = (window as any).uPlot;
        new U({ width: 1200, height: 300, series: [{}, { stroke: 'orange' }] }, [xs, ys], el);
        await new Promise((r) => requestAnimationFrame(() => r(null)));
        out.push(performance.now() - t0);
      }
      return out;
    });
    const ms = [...times].sort((a, b) => a - b)[2];
    return { what: 'Chart: 100,000 points drawn in headless Chromium (median of 5, ms)', figure: ms.toFixed(0), baseline: '—', ratio: '—', target: '≤ 300 ms', ok: ms <= 300, tool: 'playwright-core + uPlot' };
  } finally {
    await browser.close();
  }
}
