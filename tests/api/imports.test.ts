import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { createTestNode } from './helpers/fleet';
import { signedIn } from './helpers/session';

afterAll(closeDb);

let node: Awaited<ReturnType<typeof createTestNode>>;
beforeAll(async () => { node = await createTestNode('import'); });

const upload = (agent: typeof node.session.agent, nodeId: number, content: string | Buffer, filename = 'log.csv') =>
  agent.post(`/api/v1/nodes/${nodeId}/imports`).set('origin', node.session.origin).attach('file', Buffer.isBuffer(content) ? content : Buffer.from(content), filename);

describe('CSV imports for a node', () => {
  it('store the good lines, report duplicates and rejected lines with reasons, and keep the report', async () => {
    const base = Date.now() - 3 * 86_400_000;
    const t = (i: number) => new Date(base + i * 600_000).toISOString();
    const csv = ['t,v,vp', `${t(0)},4.90,0`, `${t(1)},4.89,`, `${t(1)},4.89,`, `${t(2)},lots,`, `${t(3)},4.87`, `not-a-time,4.8,0`, ''].join('\n');
    const res = await upload(node.session.agent, node.nodeId, csv);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ lines: 6, accepted: 2, duplicates: 1, rejected: 3, status: 'done' });
    const reasons = res.body.rejections.map((r: { line: number }) => r.line);
    expect(reasons).toEqual([5, 6, 7]);
    const list = await node.session.agent.get(`/api/v1/nodes/${node.nodeId}/imports`);
    expect(list.body.imports[0]).toMatchObject({ id: res.body.id, accepted: 2, rejected: 3 });
    expect(list.body.imports[0].rejections).toHaveLength(3);
  });

  it('streams a 100,000-line file', async () => {
    const start = Date.now() - 200 * 86_400_000;
    const lines = ['t,v'];
    for (let i = 0; i < 100_000; i++) lines.push(`${Math.floor(start / 1000) + i * 60},${(4.5 + 0.3 * Math.sin(i / 500)).toFixed(3)}`);
    const res = await upload(node.session.agent, node.nodeId, lines.join('\n'), 'year.csv');
    expect(res.status).toBe(201);
    expect(res.body.accepted).toBe(100_000);
    const [{ n }] = await db()('readings').where({ node_id: node.nodeId }).count({ n: '*' });
    expect(Number(n)).toBeGreaterThanOrEqual(100_000);
  }, 120_000);

  it('refuses a file with an unknown header as problem+json', async () => {
    const res = await upload(node.session.agent, node.nodeId, 'time,volts\n1,2\n');
    expect(res.status).toBe(422);
    expect(res.headers['content-type']).toContain('application/problem+json');
  });

  it('reports non-UTF-8 lines instead of storing garbage', async () => {
    const good = `${Math.floor(Date.now() / 1000) - 5 * 86_400},4.70,0\n`;
    const latin1 = Buffer.concat([Buffer.from('t,v,vp\n' + good), Buffer.from([0x31, 0x37, 0x36, 0x34, 0x36, 0x30, 0x30, 0x30, 0x30, 0x30, 0x2c, 0xe9, 0x0a])]);
    const res = await upload(node.session.agent, node.nodeId, latin1);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ accepted: 1, rejected: 1 });
    expect(res.body.rejections[0]).toEqual({ line: 3, reason: 'Not UTF-8 text.' });
  });

  it('refuses bank volts above the bank rating (over 10 %) or below 0 V, line by line, with the figures in V', async () => {
    // The bank's rating from the node's own record: ns × Vr (DESIGN.md §3).
    const ratedVolts = node.body.bank.cells_series * node.body.bank.cell_rated_volts;
    const base = Date.now() - 4 * 86_400_000;
    const t = (i: number) => new Date(base + i * 600_000).toISOString();
    const csv = ['t,v', `${t(0)},${ratedVolts.toFixed(2)}`, `${t(1)},${(ratedVolts * 1.2).toFixed(2)}`, `${t(2)},-0.20`, `${t(3)},${(ratedVolts * 10).toFixed(2)}`, `${t(4)},${(ratedVolts * 0.9).toFixed(2)}`].join('\n');
    const res = await upload(node.session.agent, node.nodeId, csv);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ lines: 5, accepted: 2, rejected: 3, status: 'done' });
    const byLine = Object.fromEntries(res.body.rejections.map((r: { line: number; reason: string }) => [r.line, r.reason]));
    expect(Object.keys(byLine)).toEqual(['3', '4', '5']);
    expect(byLine[3]).toContain(`${(ratedVolts * 1.2).toFixed(2)} V`);
    expect(byLine[3]).toContain(`rating of ${ratedVolts.toFixed(2)} V`);
    expect(byLine[4]).toContain('below 0 V');
    expect(byLine[5]).toContain(`${(ratedVolts * 10).toFixed(2)} V`); // ten times the rating: the wrong column or unit
    const stored = (await db()('readings').where({ node_id: node.nodeId }).where('t', '>=', new Date(base)).where('t', '<=', new Date(base + 4 * 600_000)).orderBy('t').pluck('v')).map(Number);
    expect(stored).toHaveLength(2);
    expect(stored[0]).toBeCloseTo(ratedVolts, 2); // FLOAT column: close, not equal
    expect(stored[1]).toBeCloseTo(ratedVolts * 0.9, 2);
  });

  it('an import of only refused lines is failed, "Nothing imported", with the reason, in the reply and in the history', async () => {
    const ratedVolts = node.body.bank.cells_series * node.body.bank.cell_rated_volts;
    const t0 = Date.now() - 6 * 86_400_000;
    const csv = ['t,v', `${new Date(t0).toISOString()},${(ratedVolts * 2).toFixed(2)}`, `${new Date(t0 + 600_000).toISOString()},lots`].join('\n');
    const res = await upload(node.session.agent, node.nodeId, csv, 'all-bad.csv');
    expect(res.status).toBe(422);
    expect(res.headers['content-type']).toContain('application/problem+json');
    expect(res.body.title).toBe('Nothing imported');
    expect(res.body.detail).toMatch(/^None of the 2 lines could be stored\. Line 2: v: .* V is more than 10 % above/);
    expect(res.body.import).toMatchObject({ lines: 2, accepted: 0, rejected: 2, status: 'failed' });
    const list = await node.session.agent.get(`/api/v1/nodes/${node.nodeId}/imports`);
    const row = list.body.imports.find((r: { id: number }) => r.id === res.body.import.id);
    expect(row).toMatchObject({ filename: 'all-bad.csv', status: 'failed', accepted: 0, reason: res.body.detail });
    const kept = await db()('imports').where({ id: res.body.import.id }).first('status');
    expect(kept.status).toBe('failed');
  });

  it('a header with no readings is failed too; a file sent again is done with "already stored"', async () => {
    const empty = await upload(node.session.agent, node.nodeId, 't,v\n\n');
    expect(empty.status).toBe(422);
    expect(empty.body.detail).toBe('The file has a header line but no readings.');
    const csv = ['t,v', `${new Date(Date.now() - 7 * 86_400_000).toISOString()},4.60`].join('\n');
    expect((await upload(node.session.agent, node.nodeId, csv)).status).toBe(201);
    const again = await upload(node.session.agent, node.nodeId, csv);
    expect(again.status).toBe(201);
    expect(again.body).toMatchObject({ accepted: 0, duplicates: 1, status: 'done' });
    expect(again.body.reason).toContain('already stored');
  });

  it('says a semicolon-separated file uses semicolons and asks for commas and decimal points', async () => {
    const csv = ['t;v;vp', `${new Date(Date.now() - 86_400_000).toISOString()};4,80;5,10`].join('\n');
    const res = await upload(node.session.agent, node.nodeId, csv, 'comma-decimals.csv');
    expect(res.status).toBe(422);
    expect(res.headers['content-type']).toContain('application/problem+json');
    expect(res.body.detail).toContain('semicolons');
    expect(res.body.detail).toContain('commas between columns');
    expect(res.body.detail).toContain('decimal point');
    expect(res.body.import.status).toBe('failed');
    // Semicolon lines under a comma header get the same hint on their own line.
    const mixed = await upload(node.session.agent, node.nodeId, ['t,v', `${new Date(Date.now() - 86_400_000).toISOString()};4.80`].join('\n'));
    expect(mixed.status).toBe(422);
    expect(mixed.body.import.rejections[0].reason).toContain('semicolons');
  });

  it('is for deployers and owners only; other organizations get 404', async () => {
    const viewer = await signedIn('viewer@larkspur.example');
    const v = await viewer.agent.post(`/api/v1/nodes/${node.nodeId}/imports`).set('origin', viewer.origin).attach('file', Buffer.from('t,v\n'), 'x.csv');
    expect(v.status).toBe(403);
    const stranger = await signedIn('owner@cinderflats.example');
    const s = await stranger.agent.post(`/api/v1/nodes/${node.nodeId}/imports`).set('origin', stranger.origin).attach('file', Buffer.from('t,v\n'), 'x.csv');
    expect(s.status).toBe(404);
  });
});
