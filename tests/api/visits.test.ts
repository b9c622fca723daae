import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { api } from './helpers/stack';
import { createTestNode } from './helpers/fleet';
import { signedIn } from './helpers/session';

afterAll(closeDb);

let node: Awaited<ReturnType<typeof createTestNode>>;
beforeAll(async () => { node = await createTestNode('visits'); });

// A 1×1 PNG: the 8-byte signature 89 50 4E 47 0D 0A 1A 0A (PNG spec, RFC 2083 §3.1), then IHDR/IDAT/IEND.
const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==', 'base64');
const today = new Date().toISOString().slice(0, 10);

function postVisit(s: typeof node.session, nodeId: number, fields: Record<string, string>, photo?: { bytes: Buffer; filename: string; type: string }) {
  let req = s.agent.post(`/api/v1/nodes/${nodeId}/visits`).set('origin', s.origin);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  if (photo) req = req.attach('photo', photo.bytes, { filename: photo.filename, contentType: photo.type });
  return req;
}

describe('field visits', () => {
  it('stores a visit with a PNG photo under a random name and serves it back through the authorized route', async () => {
    expect(PNG.subarray(0, 8).toString('hex')).toBe('89504e470d0a1a0a');
    const res = await postVisit(node.session, node.nodeId, { visited_on: today, work_done: 'Cleaned the panel; bank at 4.8 V.' }, { bytes: PNG, filename: 'panel.png', type: 'image/png' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ visited_on: today, work_done: 'Cleaned the panel; bank at 4.8 V.', has_photo: true, by: 'Bo Demo-Deployer' });
    const row = await db()('field_visits').where({ id: res.body.id }).first();
    expect(row.photo_path).toMatch(/^[0-9a-f]{32}\.png$/);
    expect(row.photo_path).not.toContain('panel');
    const stored = path.resolve(process.env.UPLOAD_DIR!, 'visits', row.photo_path);
    expect(existsSync(stored)).toBe(true);
    expect(readFileSync(stored).equals(PNG)).toBe(true);

    const photo = await node.session.agent.get(`/api/v1/nodes/${node.nodeId}/visits/${res.body.id}/photo`).buffer(true);
    expect(photo.status).toBe(200);
    expect(photo.headers['content-type']).toBe('image/png');
    expect(photo.headers['x-content-type-options']).toBe('nosniff');
    expect(Buffer.from(photo.body).equals(PNG)).toBe(true);

    const list = await node.session.agent.get(`/api/v1/nodes/${node.nodeId}/visits`);
    expect(list.body.visits[0]).toMatchObject({ id: res.body.id, has_photo: true });
    expect(JSON.stringify(list.body)).not.toContain(row.photo_path); // the stored name never leaves the server
  });

  it('refuses a text file renamed .png, whatever the browser claims, and stores nothing', async () => {
    const before = await db()('field_visits').where({ node_id: node.nodeId }).count({ n: '*' }).first();
    const res = await postVisit(node.session, node.nodeId, { visited_on: today, work_done: 'x' }, { bytes: Buffer.from('hello, not an image\n'), filename: 'photo.png', type: 'image/png' });
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([{ pointer: '/photo', detail: 'The photo must be a JPEG or PNG image.' }]);
    const after = await db()('field_visits').where({ node_id: node.nodeId }).count({ n: '*' }).first();
    expect(Number(after?.n)).toBe(Number(before?.n));
  });

  it('refuses a photo over 5 MB', async () => {
    const big = Buffer.concat([PNG.subarray(0, 8), Buffer.alloc(5 * 1_048_576)]);
    const res = await postVisit(node.session, node.nodeId, { visited_on: today, work_done: 'big' }, { bytes: big, filename: 'big.png', type: 'image/png' });
    expect(res.status).toBe(422);
    expect(res.body.errors[0].pointer).toBe('/photo');
  });

  it('accepts a visit without a photo; its photo route is 404', async () => {
    const res = await postVisit(node.session, node.nodeId, { visited_on: today, work_done: 'Read the logger.' });
    expect(res.status).toBe(201);
    expect(res.body.has_photo).toBe(false);
    expect((await node.session.agent.get(`/api/v1/nodes/${node.nodeId}/visits/${res.body.id}/photo`)).status).toBe(404);
  });

  it('names bad fields by pointer: an impossible date, a date in the future, nothing done', async () => {
    const bad = await postVisit(node.session, node.nodeId, { visited_on: '2026-02-30', work_done: ' ' });
    expect(bad.status).toBe(422);
    const pointers = bad.body.errors.map((e: { pointer: string }) => e.pointer).sort();
    expect(pointers).toEqual(['/visited_on', '/work_done']);
    const future = new Date(Date.now() + 5 * 86_400_000).toISOString().slice(0, 10);
    const later = await postVisit(node.session, node.nodeId, { visited_on: future, work_done: 'x' });
    expect(later.body.errors).toEqual([{ pointer: '/visited_on', detail: 'The visit cannot be in the future.' }]);
  });

  it('lets a viewer see visits and photos but not add them; another organization gets 404; signed out gets 401', async () => {
    const made = await postVisit(node.session, node.nodeId, { visited_on: today, work_done: 'Swapped the antenna.' }, { bytes: PNG, filename: 'a.png', type: 'image/png' });
    const photoUrl = `/api/v1/nodes/${node.nodeId}/visits/${made.body.id}/photo`;
    const viewer = await signedIn('viewer@larkspur.example');
    expect((await viewer.agent.get(`/api/v1/nodes/${node.nodeId}/visits`)).status).toBe(200);
    expect((await viewer.agent.get(photoUrl)).status).toBe(200);
    expect((await postVisit(viewer, node.nodeId, { visited_on: today, work_done: 'x' })).status).toBe(403);

    const stranger = await signedIn('owner@cinderflats.example');
    expect((await stranger.agent.get(photoUrl)).status).toBe(404);
    expect((await stranger.agent.get(`/api/v1/nodes/${node.nodeId}/visits`)).status).toBe(404);
    expect((await postVisit(stranger, node.nodeId, { visited_on: today, work_done: 'x' })).status).toBe(404);

    expect((await api().get(photoUrl)).status).toBe(401);
  });
});
