import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { createTestNode } from './helpers/fleet';

afterAll(closeDb);

let node: Awaited<ReturnType<typeof createTestNode>>;
beforeAll(async () => { node = await createTestNode('cred-label'); });

const create = (body: unknown) =>
  node.session.agent.post(`/api/v1/nodes/${node.nodeId}/credentials`).set('origin', node.session.origin).send(body as object);
const count = async () => Number((await db()('device_credentials').where({ node_id: node.nodeId }).count({ n: '*' }))[0].n);

describe('a new credential needs a label', () => {
  it.each([
    ['empty', { label: '' }],
    ['only spaces', { label: '   \t ' }],
    ['missing', {}],
  ])('%s: 422 problem+json with a pointer at /label, and nothing made', async (_name, body) => {
    const before = await count();
    const res = await create(body);
    expect(res.status).toBe(422);
    expect(res.headers['content-type']).toContain('application/problem+json');
    expect(res.body).toMatchObject({ status: 422, title: 'Invalid values' });
    expect(res.body.errors).toEqual([{ pointer: '/label', detail: expect.stringContaining('Give the credential a label') }]);
    expect(res.body.token).toBeUndefined();
    expect(await count()).toBe(before);
  });

  it('refuses a label longer than the column (120 characters)', async () => {
    const res = await create({ label: 'x'.repeat(121) });
    expect(res.status).toBe(422);
    expect(res.body.errors[0].pointer).toBe('/label');
  });

  it('stores a good label trimmed and answers 201 with the token once', async () => {
    const res = await create({ label: '  mast logger rev C  ' });
    expect(res.status).toBe(201);
    expect(res.body.label).toBe('mast logger rev C');
    const row = await db()('device_credentials').where({ id: res.body.id }).first('label');
    expect(row.label).toBe('mast logger rev C');
  });
});
