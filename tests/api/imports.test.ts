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
    const latin1 = Buffer.concat([Buffer.from('t,v,vp\n'), Buffer.from([0x31, 0x37, 0x36, 0x34, 0x36, 0x30, 0x30, 0x30, 0x30, 0x30, 0x2c, 0xe9, 0x0a])]);
    const res = await upload(node.session.agent, node.nodeId, latin1);
    expect(res.status).toBe(201);
    expect(res.body.rejected).toBe(1);
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
