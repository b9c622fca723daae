import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { currentTestProfile, loadSecrets } from '@/db/lifecycle/profile';
import { rootKnex } from '@/db/lifecycle/stack';
import { closeDb, db } from '@/lib/db/knex';
import { listReadingPartitions, monthStart, type MonthPartition } from '@/lib/db/queries/partitions';
import { rebuildRollups } from '@/lib/db/queries/rollups';
import { loadNodeSeries } from '@/lib/db/queries/series';
import { MONTHS_AHEAD, openMaintenanceKnex, RETENTION_PASS_LOCK, runRetentionPass } from '@/lib/jobs/retention-pass';
import { startJobRunner } from '@/lib/jobs/runner';
import { createTestOrg, SMTP_FROM, startCatcher, type TestOrg } from './alerts-fixtures';

// The retention pass against the real test database, as the maintenance user, with a `now`
// chosen from the table's own partitions: the oldest month falls out of a retention whose
// cutoff lies 10 days into the second month, and `now` sits near the last month partition so
// that months ahead must be added. Ageing out time-series rows by dropping whole partitions
// is common practice; DROP PARTITION / REORGANIZE PARTITION as in the MariaDB Knowledge Base
// ("Partition Maintenance"); the privileges they need were checked on MariaDB 10.11 here.
const DAY = 86_400_000;
const profile = currentTestProfile();
const root = rootKnex(profile);
const maint = openMaintenanceKnex({ password: loadSecrets(profile).maintPassword });
let org: TestOrg;
let oldest: MonthPartition;
let now: Date;
let retentionDays: number;
let cutoff: Date;
let heldBack: Date; // older than the cutoff, in the partition that holds the cutoff

const hourly = (from: Date, n: number) => Array.from({ length: n }, (_, i) => new Date(from.getTime() + i * 3_600_000));
const countReadings = async (from: Date, to: Date) =>
  Number((await root('readings').where('node_id', org.nodeId).andWhere('t', '>=', from).andWhere('t', '<', to).count({ n: '*' }))[0].n);
const countRollups = async (from: Date, to: Date) =>
  Number((await root('reading_rollups').where('node_id', org.nodeId).andWhere('bucket_start', '>=', from).andWhere('bucket_start', '<', to).count({ n: '*' }))[0].n);
const lastBound = (parts: MonthPartition[]) => parts.map((p) => p.lessThan).filter((d): d is Date => d !== null).at(-1)!;
const oldDay = () => new Date(monthStart(oldest.lessThan!, -1).getTime() + 4 * DAY);

beforeAll(async () => {
  const parts = await listReadingPartitions(root);
  [oldest] = parts;
  now = new Date(lastBound(parts).getTime() - 45 * DAY);
  retentionDays = Math.floor((now.getTime() - (oldest.lessThan!.getTime() + 10 * DAY)) / DAY);
  cutoff = new Date(now.getTime() - retentionDays * DAY);
  heldBack = new Date(cutoff.getTime() - DAY);
  org = await createTestOrg(db());
  const rows = [...hourly(oldDay(), 24), heldBack, ...hourly(new Date(now.getTime() - 10 * DAY), 24)]
    .map((t, i) => ({ node_id: org.nodeId, t, v: 4 + (i % 7) / 10, vp: null }));
  await db()('readings').insert(rows);
  await rebuildRollups(db(), org.nodeId);
});

afterAll(async () => {
  await Promise.all([root.destroy(), maint.destroy(), closeDb()]);
});

describe('retention of raw readings', () => {
  it('drops the month partitions older than the retention, keeps the rest and the rollups, and adds months ahead', async () => {
    expect(cutoff.getTime()).toBeGreaterThan(oldest.lessThan!.getTime());
    const oldFrom = monthStart(oldDay());
    expect(await countReadings(oldFrom, oldest.lessThan!)).toBe(24);
    const rollupsBefore = await countRollups(oldFrom, oldest.lessThan!);
    expect(rollupsBefore).toBe(48); // 24 five-minute and 24 hourly buckets
    const dayFrom = oldDay().getTime() / 1000;
    const before = await loadNodeSeries({ orgId: org.orgId, nodeId: org.nodeId, fromSeconds: dayFrom, toSeconds: dayFrom + 86_400, buckets: 1000, now });
    expect(before.source).toBe('raw');

    const outcome = await runRetentionPass({ knex: maint, retentionDays, now });
    expect(outcome.ran).toBe(true);
    if (!outcome.ran) return;
    expect(outcome.value.dropped).toEqual([oldest.name]);
    expect(outcome.value.added.length).toBeGreaterThan(0);

    const after = await listReadingPartitions(root);
    expect(after.map((p) => p.name)).not.toContain(oldest.name);
    expect(after.at(-1)).toMatchObject({ name: 'pmax', lessThan: null });
    expect(lastBound(after).getTime()).toBeGreaterThanOrEqual(monthStart(now, MONTHS_AHEAD + 1).getTime());
    expect(await countReadings(oldFrom, oldest.lessThan!)).toBe(0);
    expect(await countReadings(heldBack, new Date(heldBack.getTime() + 1))).toBe(1);
    expect(await countReadings(new Date(now.getTime() - 10 * DAY), now)).toBe(24);
    expect(await countRollups(oldFrom, oldest.lessThan!)).toBe(rollupsBefore);

    // The chart of that old day still draws, now from the 5-minute rollups, with the same means.
    const later = await loadNodeSeries({ orgId: org.orgId, nodeId: org.nodeId, fromSeconds: dayFrom, toSeconds: dayFrom + 86_400, buckets: 1000, now });
    expect(later.source).toBe('rollup-300');
    expect(later.count).toBe(24);
    expect(later.buckets.v_mean).toEqual(before.buckets.v_mean);
  });

  it('changes nothing when run again', async () => {
    const parts = (await listReadingPartitions(root)).map((p) => p.name);
    const outcome = await runRetentionPass({ knex: maint, retentionDays, now });
    expect(outcome).toMatchObject({ ran: true, value: { dropped: [], added: [] } });
    expect((await listReadingPartitions(root)).map((p) => p.name)).toEqual(parts);
  });

  it('keeps every raw reading when retention is off, and still keeps months ahead', async () => {
    const later = new Date(now.getTime() + 62 * DAY);
    const outcome = await runRetentionPass({ knex: maint, retentionDays: null, now: later });
    expect(outcome).toMatchObject({ ran: true, value: { cutoff: null, dropped: [] } });
    expect(lastBound(await listReadingPartitions(root)).getTime()).toBeGreaterThanOrEqual(monthStart(later, MONTHS_AHEAD + 1).getTime());
    expect(await countReadings(heldBack, new Date(heldBack.getTime() + 1))).toBe(1);
  });

  it('skips while another runner holds the lock', async () => {
    const holder = await root.client.acquireConnection();
    try {
      await root.raw('SELECT GET_LOCK(?, 0)', [RETENTION_PASS_LOCK]).connection(holder);
      expect(await runRetentionPass({ knex: maint, retentionDays, now })).toEqual({ ran: false });
    } finally {
      await root.raw('SELECT RELEASE_LOCK(?)', [RETENTION_PASS_LOCK]).connection(holder);
      await root.client.releaseConnection(holder);
    }
  });

  it('runs as a step of the job runner and logs what it did', async () => {
    const mail = await startCatcher('retention');
    const lines: string[] = [];
    const runner = startJobRunner({
      knex: db(), intervalSeconds: 3600, appUrl: 'http://127.0.0.1:3999', smtp: { host: '127.0.0.1', port: mail.port, from: SMTP_FROM },
      retention: { knex: maint, days: 730 }, log: (line) => lines.push(line),
    });
    try {
      const until = Date.now() + 20_000;
      while (Date.now() < until && !lines.some((l) => l.startsWith('[retention]'))) await new Promise((r) => setTimeout(r, 100));
    } finally {
      await runner.stop();
      await mail.catcher.close();
    }
    expect(lines.find((l) => l.startsWith('[retention]')), lines.join('\n')).toMatch(/^\[retention\] raw kept 730 d \(cutoff \d{4}-\d{2}-\d{2}\), dropped \[.*\], added \[.*\]/);
  });

  it('leaves the app user without DDL, and the maintenance user without data or other tables', async () => {
    const [first] = await listReadingPartitions(root);
    // ER_TABLEACCESS_DENIED_ERROR (1142), MariaDB's answer to a missing table privilege (from memory).
    await expect(db().raw(`ALTER TABLE readings DROP PARTITION ${first.name}`)).rejects.toThrow(/ALTER command denied/);
    await expect(db().raw('ALTER TABLE readings REORGANIZE PARTITION pmax INTO (PARTITION pmax VALUES LESS THAN (MAXVALUE))')).rejects.toThrow(/ALTER command denied/);
    await expect(db().raw('CALL readings_drop_month(?)', [first.name])).rejects.toThrow(/execute command denied/i);
    await expect(maint.raw('SELECT COUNT(*) FROM readings')).rejects.toThrow(/SELECT command denied/);
    await expect(maint.raw('DELETE FROM reading_rollups')).rejects.toThrow(/DELETE command denied/);
    await expect(maint.raw('ALTER TABLE nodes ADD COLUMN x INT')).rejects.toThrow(/ALTER command denied/);
    expect((await listReadingPartitions(root)).map((p) => p.name)).toContain(first.name);
  });

  it('gives the maintenance user no table privilege on readings: only the procedures, which refuse recent months', async () => {
    const [first] = await listReadingPartitions(root);
    // Before the procedures it held ALTER and DROP on readings, and DROP alone allows TRUNCATE.
    await expect(maint.raw('TRUNCATE TABLE readings')).rejects.toThrow(/DROP command denied/);
    await expect(maint.raw(`ALTER TABLE readings DROP PARTITION ${first.name}`)).rejects.toThrow(/ALTER command denied/);
    await expect(maint.raw('ALTER TABLE readings DROP COLUMN seq')).rejects.toThrow(/ALTER command denied/);

    const thisMonth = `p${new Date().toISOString().slice(0, 7).replace('-', '')}`;
    await expect(maint.raw('CALL readings_drop_month(?)', [thisMonth])).rejects.toThrow(/may hold readings from the last 35 days/);
    await expect(maint.raw('CALL readings_drop_month(?)', ['pmax'])).rejects.toThrow(/not a month partition name/);
    await expect(maint.raw('CALL readings_drop_month(?)', ["p202601; DROP TABLE nodes"])).rejects.toThrow(/not a month partition name/);
    await expect(maint.raw('CALL readings_drop_month(?)', ['p199001'])).rejects.toThrow(/no such partition/);
    await expect(maint.raw('CALL readings_add_months(?)', ['2099-01-01'])).rejects.toThrow(/at most 36 months ahead/);
    const names = (await listReadingPartitions(root)).map((p) => p.name);
    expect(names).toContain(thisMonth);
    expect(names).toContain(first.name);
    expect(await root.schema.hasTable('nodes')).toBe(true);
  });
});
