import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { NODE_STATES } from '@/lib/config/node-states';
import { closeDb, db } from '@/lib/db/knex';
import { listLiveNodes } from '@/lib/db/queries/sites';
import { createTestNode, deployer } from './helpers/fleet';
import { signedIn } from './helpers/session';
import { appUrl } from './helpers/stack';

afterAll(closeDb);

type Session = Awaited<ReturnType<typeof signedIn>>;
let dep: Session;
beforeAll(async () => { dep = await deployer(); });

const unique = (p: string) => `${p}-${process.pid}-${Date.now()}-${Math.random().toString(36).slice(2, 6)}`;
// An invented place; the zone is a real IANA name (IANA tz database, from memory).
const body = (over: Record<string, unknown> = {}) => ({ name: unique('site'), lat: 47.25, lon: 11.4, time_zone: 'Europe/Vienna', recharge_elevation_deg: 3, notes: 'test', ...over });
const post = (s: Session, b: unknown) => s.agent.post('/api/v1/sites').set('origin', s.origin).send(b as object);

describe('sites: create, read, update, delete', () => {
  it('a deployer creates a site, reads it, changes it and deletes it', async () => {
    const b = body();
    const made = await post(dep, b);
    expect(made.status).toBe(201);
    expect(made.body).toMatchObject({ ...b, live_nodes: 0 });
    const id = made.body.id as number;
    expect(made.headers.location).toBe(`/api/v1/sites/${id}`);

    const list = await dep.agent.get('/api/v1/sites');
    expect(list.body.sites.map((s: { id: number }) => s.id)).toContain(id);

    const put = await dep.agent.put(`/api/v1/sites/${id}`).set('origin', dep.origin).send({ ...b, lat: -33.9, time_zone: 'UTC', recharge_elevation_deg: -0.833 });
    expect(put.status).toBe(200);
    expect(put.body).toMatchObject({ id, lat: -33.9, time_zone: 'UTC', recharge_elevation_deg: -0.833 });
    const row = await db()('sites').where({ id }).first();
    expect(row).toMatchObject({ lat: -33.9, time_zone: 'UTC' });

    expect((await dep.agent.delete(`/api/v1/sites/${id}`).set('origin', dep.origin)).status).toBe(204);
    expect((await dep.agent.get(`/api/v1/sites/${id}`)).status).toBe(404);
  });

  it('answers 422 with a JSON pointer per bad field, in words the form shows', async () => {
    // Latitude lies within ±90° by definition (common practice); no IANA zone is named Mars/Base (from memory).
    const res = await post(dep, body({ lat: 91, time_zone: 'Mars/Base', name: 'two\nlines' }));
    expect(res.status).toBe(422);
    expect(res.headers['content-type']).toContain('application/problem+json');
    const byPointer = Object.fromEntries(res.body.errors.map((e: { pointer: string; detail: string }) => [e.pointer, e.detail]));
    expect(byPointer['/lat']).toBe('Latitude is between −90° and 90°.');
    expect(byPointer['/time_zone']).toMatch(/^Not a known time zone/);
    expect(byPointer['/name']).toBe('Use one line.');
    expect(Object.keys(byPointer).sort()).toEqual(['/lat', '/name', '/time_zone']);
  });

  it('refuses a lower-case zone, a longitude past 180° and unknown fields', async () => {
    const res = await post(dep, body({ time_zone: 'europe/vienna', lon: -180.5, extra: 1 }));
    expect(res.status).toBe(422);
    const pointers = res.body.errors.map((e: { pointer: string }) => e.pointer).sort();
    expect(pointers).toEqual(expect.arrayContaining(['/lon', '/time_zone']));
    expect(pointers.length).toBeGreaterThanOrEqual(3); // the unknown key too
  });

  it('keeps site names unique within the organization', async () => {
    const b = body();
    expect((await post(dep, b)).status).toBe(201);
    const again = await post(dep, body({ name: b.name }));
    expect(again.status).toBe(422);
    expect(again.body.errors).toEqual([{ pointer: '/name', detail: 'Another site already has this name.' }]);
  });

  it('hides another organization’s site: 404 for read, change and delete, exactly like a missing one', async () => {
    const made = await post(dep, body());
    const id = made.body.id as number;
    const stranger = await signedIn('owner@cinderflats.example');
    const missing = await stranger.agent.get('/api/v1/sites/999999999');
    const get = await stranger.agent.get(`/api/v1/sites/${id}`);
    expect(get.status).toBe(404);
    expect(get.body.detail).toBe(missing.body.detail);
    expect((await stranger.agent.put(`/api/v1/sites/${id}`).set('origin', stranger.origin).send(body())).status).toBe(404);
    expect((await stranger.agent.delete(`/api/v1/sites/${id}`).set('origin', stranger.origin)).status).toBe(404);
    const list = await stranger.agent.get('/api/v1/sites');
    expect(list.body.sites.map((s: { id: number }) => s.id)).not.toContain(id);
    expect(await db()('sites').where({ id }).first('id')).toBeTruthy();
  });

  it('answers 409 deleting a site with nodes, and keeps it', async () => {
    const site = (await post(dep, body())).body;
    const template = await createTestNode('site-del');
    const node = await dep.agent.post('/api/v1/nodes').set('origin', dep.origin).send({ ...template.body, name: unique('on-site'), site_id: site.id });
    expect(node.status).toBe(201);
    expect((await dep.agent.get(`/api/v1/sites/${site.id}`)).body.live_nodes).toBe(1);

    const del = await dep.agent.delete(`/api/v1/sites/${site.id}`).set('origin', dep.origin);
    expect(del.status).toBe(409);
    expect(del.headers['content-type']).toContain('application/problem+json');
    expect(del.body.detail).toMatch(/still has 1 node/);

    // A deleted node keeps its readings for the record, so the site stays too (still 409).
    expect((await dep.agent.delete(`/api/v1/nodes/${node.body.id}`).set('origin', dep.origin)).status).toBe(204);
    const after = await dep.agent.delete(`/api/v1/sites/${site.id}`).set('origin', dep.origin);
    expect(after.status).toBe(409);
    expect(after.body.detail).toMatch(/records of deleted nodes/);
    expect(await db()('sites').where({ id: site.id }).first('id')).toBeTruthy();
  });

  it('lets a viewer read sites but not write them', async () => {
    const viewer = await signedIn('viewer@larkspur.example');
    const list = await viewer.agent.get('/api/v1/sites');
    expect(list.status).toBe(200);
    expect(list.body.sites.length).toBeGreaterThan(0);
    expect((await post(viewer, body())).status).toBe(403);
    const some = list.body.sites[0];
    expect((await viewer.agent.put(`/api/v1/sites/${some.id}`).set('origin', viewer.origin).send(body())).status).toBe(403);
    expect((await viewer.agent.delete(`/api/v1/sites/${some.id}`).set('origin', viewer.origin)).status).toBe(403);
  });

  it('accepts real IANA zones, UTC among them, and refuses others with one error on the zone', async () => {
    // Real IANA names (IANA tz database, from memory), a three-part one and a quarter-hour one among them.
    for (const zone of ['UTC', 'America/Argentina/Buenos_Aires', 'Asia/Kathmandu', 'Pacific/Chatham']) {
      const res = await post(dep, body({ time_zone: zone }));
      expect(res.status, zone).toBe(201);
      expect(res.body.time_zone, zone).toBe(zone);
    }
    // An offset typed as text, a made-up city and an empty field are not IANA zones.
    for (const [zone, detail] of [['UTC-8', /^Not a known time zone/], ['+08:00', /^Not a known time zone/], ['Europe/Atlantis', /^Not a known time zone/], ['', /^Choose a time zone\.$/]] as const) {
      const res = await post(dep, body({ time_zone: zone }));
      expect(res.status, zone).toBe(422);
      expect(res.body.errors.map((e: { pointer: string }) => e.pointer), zone).toEqual(['/time_zone']);
      expect(res.body.errors[0].detail, zone).toMatch(detail);
    }
  });
});

describe('a site’s live nodes (listLiveNodes, the site page’s list)', () => {
  it('lists the site’s nodes that are not retired, with state, last reading and volts, only for its organization', async () => {
    const site = (await post(dep, body())).body;
    const read = await createTestNode('live-read', { site_id: site.id });
    const quiet = await createTestNode('live-quiet', { site_id: site.id });
    const gone = await createTestNode('live-gone', { site_id: site.id });
    expect((await dep.agent.delete(`/api/v1/nodes/${gone.nodeId}`).set('origin', dep.origin)).status).toBe(204);
    const rated = read.body.bank.cells_series * read.body.bank.cell_rated_volts;
    const volts = Number((rated * 0.8).toFixed(3));
    const res = await fetch(`${appUrl()}/api/v1/readings`, {
      method: 'POST', headers: { authorization: `Bearer ${read.token}`, 'content-type': 'application/json' }, body: JSON.stringify({ v: volts }),
    });
    expect(res.status).toBe(200);

    const { org_id: orgId } = await db()('sites').where({ id: site.id }).first('org_id');
    const live = await listLiveNodes(orgId, site.id);
    expect(live.map((n) => n.id).sort((a, b) => a - b)).toEqual([read.nodeId, quiet.nodeId].sort((a, b) => a - b));
    const withReading = live.find((n) => n.id === read.nodeId)!;
    expect(withReading.name).toBe(read.body.name);
    expect(NODE_STATES).toContain(withReading.state);
    expect(withReading.volts).toBeCloseTo(volts, 6); // no calibration on test nodes
    expect(withReading.max_volts).toBeCloseTo(rated, 9);
    expect(Date.now() - Date.parse(withReading.last_reading_at!)).toBeLessThan(5 * 60_000);
    expect(live.find((n) => n.id === quiet.nodeId)).toMatchObject({ state: 'new', volts: null, last_reading_at: null });

    // The same site asked for under another organization: nothing, like a missing site.
    const other = await db()('organizations').whereNot({ id: orgId }).first('id');
    expect(await listLiveNodes(other.id, site.id)).toEqual([]);
  });
});
