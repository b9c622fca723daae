import { afterAll, describe, expect, it } from 'vitest';
import { db, closeDb } from '@/lib/db/knex';
import { demoNodes } from '@/simulator/fleet/demo-fleet';
import { api } from './helpers/stack';

afterAll(closeDb);

describe('the app on loopback', () => {
  it('serves the signed-out landing page that leads to sign-in', async () => {
    const res = await api().get('/');
    expect(res.status).toBe(200);
    expect(res.text).toContain('Who makes it through tonight?');
    expect(res.text).toContain('href="/sign-in"');
  });

  it('sends security headers with every page', async () => {
    const res = await api().get('/');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("frame-ancestors 'none'");
    expect(res.headers['content-security-policy']).not.toContain('unsafe-eval');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});

describe('the seeded test database', () => {
  it('holds the demo organization with twelve nodes over four sites', async () => {
    const org = await db()('organizations').where({ name: 'Larkspur Hollow Watershed Trust' }).first();
    expect(org).toBeDefined();
    const sites = (await db()('sites').where({ org_id: org.id }).pluck('name')) as string[];
    for (const name of ['Mill Pond outlet', 'North Fork weir', 'Quarry Road culvert', 'Upper Meadow piezometer']) expect(sites).toContain(name);
    // The twelve demo nodes (other suites add test nodes of their own beside them).
    const names = await db()('nodes').where({ org_id: org.id }).pluck('name');
    expect(demoNodes.map((d) => d.name).filter((name) => names.includes(name))).toHaveLength(12);
  });

  it('holds fourteen days of readings for the reporting nodes', async () => {
    const rows = await db()('readings as r')
      .join('nodes as n', 'n.id', 'r.node_id')
      .join('organizations as o', 'o.id', 'n.org_id')
      .where('o.name', 'Larkspur Hollow Watershed Trust')
      .groupBy('r.node_id')
      .select('r.node_id')
      .min({ first: 'r.t' })
      .max({ last: 'r.t' });
    expect(rows.length).toBeGreaterThanOrEqual(11); // the `new` node has no readings yet
    const spansDays = rows.map((r) => (new Date(r.last).getTime() - new Date(r.first).getTime()) / 86_400_000);
    expect(Math.max(...spansDays)).toBeGreaterThan(13);
  });

  it('has a second organization, so tenancy can be seen', async () => {
    const [{ n }] = await db()('organizations').count({ n: '*' });
    expect(Number(n)).toBeGreaterThanOrEqual(2);
  });

  it('connects as an application user without schema privileges', async () => {
    await expect(db().raw('CREATE TABLE should_not_exist (id INT)')).rejects.toThrow(/denied/i);
  });

  it('commits durably (innodb_flush_log_at_trx_commit = 1)', async () => {
    const [rows] = await db().raw("SHOW VARIABLES LIKE 'innodb_flush_log_at_trx_commit'");
    expect(rows[0].Value).toBe('1');
  });

  it('partitions readings by time', async () => {
    const [rows] = await db().raw(
      "SELECT COUNT(*) AS n FROM information_schema.PARTITIONS WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = 'readings'",
    );
    expect(Number(rows[0].n)).toBeGreaterThan(12);
  });
});
