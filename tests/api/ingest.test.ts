import http from 'node:http';
import { SignJWT } from 'jose';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { api, appUrl } from './helpers/stack';
import { createTestNode } from './helpers/fleet';

afterAll(closeDb);

let node: Awaited<ReturnType<typeof createTestNode>>;
let other: Awaited<ReturnType<typeof createTestNode>>;
beforeAll(async () => {
  node = await createTestNode('ingest');
  other = await createTestNode('ingest-other');
});

const post = (token: string | null, body: unknown, type = 'application/json') => {
  const req = api().post('/api/v1/readings').set('content-type', type);
  if (token) req.set('authorization', `Bearer ${token}`);
  return req.send(typeof body === 'string' ? body : JSON.stringify(body));
};
const iso = (secondsAgo: number) => new Date(Date.now() - secondsAgo * 1000).toISOString();
const stored = async (nodeId: number) => Number((await db()('readings').where({ node_id: nodeId }).count({ n: '*' }))[0].n);
const isProblem = (res: { headers: Record<string, string>; body: { status?: number } }, status: number) => {
  expect(res.headers['content-type']).toContain('application/problem+json');
  expect(res.body.status).toBe(status);
};

describe('POST /api/v1/readings (DESIGN.md §5)', () => {
  it('accepts one reading and answers accepted, duplicates, state and next_report_s', async () => {
    const res = await post(node.token, { t: iso(600), v: 4.91, seq: 1, vp: 0.1, temp: -2.5, rssi: -67 });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ accepted: 1, duplicates: 0 });
    expect(['steady', 'thin', 'short', 'dark', 'silent', 'new']).toContain(res.body.state);
    expect(Number.isInteger(res.body.next_report_s)).toBe(true);
    expect(res.body.next_report_s).toBeGreaterThan(0);
  });

  it('accepts a batch and Unix-seconds times, and counts a repeat as a duplicate stored once', async () => {
    const before = await stored(node.nodeId);
    const batch = { readings: [{ t: Math.floor(Date.now() / 1000) - 500, v: 4.9 }, { t: iso(400), v: 4.89 }, { t: iso(400), v: 4.89 }] };
    const first = await post(node.token, batch);
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ accepted: 2, duplicates: 1 });
    const again = await post(node.token, batch);
    expect(again.body).toMatchObject({ accepted: 0, duplicates: 3 });
    expect(await stored(node.nodeId)).toBe(before + 2);
  });

  it('accepts text/csv with a header line', async () => {
    const csv = `t,v,vp\n${iso(300)},4.88,0\n${iso(290)},4.87,\n`;
    const res = await post(node.token, csv, 'text/csv');
    expect(res.status).toBe(200);
    expect(res.body.accepted).toBe(2);
  });

  it('stores the time received when t is absent', async () => {
    const res = await post(node.token, { v: 4.86 });
    expect(res.status).toBe(200);
    const last = await db()('readings').where({ node_id: node.nodeId }).orderBy('t', 'desc').first('t');
    expect(Math.abs(new Date(last.t).getTime() - Date.now())).toBeLessThan(60_000);
  });

  it('stores nothing of a batch with one bad item, and points at it (422)', async () => {
    const before = await stored(node.nodeId);
    const res = await post(node.token, { readings: [{ t: iso(200), v: 4.8 }, { t: iso(190), v: 'high' }, { t: iso(180), v: 4.7, colour: 'red' }] });
    expect(res.status).toBe(422);
    isProblem(res, 422);
    const pointers = res.body.errors.map((e: { pointer: string }) => e.pointer);
    expect(pointers).toContain('/readings/1/v');
    expect(pointers.some((p: string) => p.startsWith('/readings/2'))).toBe(true);
    expect(await stored(node.nodeId)).toBe(before);
  });

  it('refuses times more than 5 minutes ahead or older than 400 days', async () => {
    const ahead = await post(node.token, { t: new Date(Date.now() + 10 * 60_000).toISOString(), v: 4.8 });
    const old = await post(node.token, { t: new Date(Date.now() - 401 * 86_400_000).toISOString(), v: 4.8 });
    expect(ahead.status).toBe(422);
    expect(old.status).toBe(422);
    expect(ahead.body.errors[0].pointer).toBe('/t');
  });

  it('refuses a time that is not on the calendar instead of rolling it over (a broken node clock)', async () => {
    const year = new Date().getUTCFullYear();
    // 30 February would otherwise be read as 2 March, and 24:00 as the next midnight.
    for (const t of [`${year}-02-30T10:00:00Z`, `${year - 1}-12-01T24:00:00Z`]) {
      const res = await post(node.token, { t, v: 4.8 });
      isProblem(res, 422);
      expect(res.body.errors[0]).toEqual({ pointer: '/t', detail: 'Not a real date and time.' });
    }
  });

  it('answers 400 to malformed JSON and to a body that is not a reading', async () => {
    isProblem(await post(node.token, '{"v": 4.8', 'application/json'), 400);
    isProblem(await post(node.token, '[1,2,3]', 'application/json'), 400);
  });

  it('answers 415 to other media types', async () => {
    isProblem(await post(node.token, 'v=4.8', 'application/x-www-form-urlencoded'), 415);
  });

  it('answers 413 over 1000 readings and over 256 KiB', async () => {
    const many = { readings: Array.from({ length: 1001 }, (_, i) => ({ t: iso(3000 + i), v: 4.5 })) };
    isProblem(await post(node.token, many), 413);
    const big = JSON.stringify({ v: 4.8, pad: 'x'.repeat(300 * 1024) });
    isProblem(await post(node.token, big), 413);
  });

  it('answers 413 to a chunked body (no Content-Length) once it passes 256 KiB, and stores nothing', async () => {
    const before = await stored(node.nodeId);
    const url = new URL(appUrl());
    const answer = await new Promise<{ status: number; body: string; type: string }>((resolve, reject) => {
      const req = http.request({ host: url.hostname, port: url.port, path: '/api/v1/readings', method: 'POST',
        headers: { authorization: `Bearer ${node.token}`, 'content-type': 'application/json', 'transfer-encoding': 'chunked' } }, (res) => {
        let body = '';
        res.on('data', (c) => (body += c));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, body, type: String(res.headers['content-type']) }));
      });
      req.on('error', reject);
      req.write(`{"readings":[{"t":"${iso(90)}","v":4.5}],"pad":"`);
      let sent = 0;
      const more = () => {
        if (sent++ < 6) { req.write('x'.repeat(64 * 1024)); setTimeout(more, 10); } else req.end('"}');
      };
      more();
    });
    expect(answer.status).toBe(413);
    expect(answer.type).toContain('application/problem+json');
    expect(await stored(node.nodeId)).toBe(before);
  });

  it('answers 401 with WWW-Authenticate for missing, malformed, forged and alg:none tokens', async () => {
    const forged = await new SignJWT({}).setProtectedHeader({ alg: 'HS256' }).setSubject(String(node.nodeId)).setJti('0'.repeat(32))
      .setIssuer('duskwatch').setAudience('duskwatch:ingest').sign(new TextEncoder().encode('not-the-server-secret-not-the-server-secret'));
    const [h, p] = node.token.split('.');
    const none = `${Buffer.from(JSON.stringify({ alg: 'none', typ: 'JWT' })).toString('base64url')}.${p}.`;
    const hs512Header = Buffer.from(JSON.stringify({ alg: 'HS512', typ: 'JWT' })).toString('base64url');
    for (const token of [null, 'not-a-jwt', forged, none, `${hs512Header}.${p}.${node.token.split('.')[2]}`, `${h}.${p}.AAAA`]) {
      const res = await post(token, { v: 4.8 });
      expect(res.status, String(token)).toBe(401);
      expect(res.headers['www-authenticate']).toMatch(/^Bearer/);
      isProblem(res, 401);
    }
  });

  it('refuses an expired token signed with the server key, and one for another audience', async () => {
    const { readFileSync } = await import('node:fs');
    const { currentTestProfile } = await import('@/db/lifecycle/profile');
    const secret = JSON.parse(readFileSync(`${currentTestProfile().dataDir}/secrets.json`, 'utf8')).deviceTokenSecret as string;
    const cred = await db()('device_credentials').where({ node_id: node.nodeId }).whereNull('revoked_at').first('credential_id');
    const key = new TextEncoder().encode(secret);
    const base = () => new SignJWT({}).setProtectedHeader({ alg: 'HS256' }).setSubject(String(node.nodeId)).setJti(cred.credential_id).setIssuer('duskwatch');
    const expired = await base().setAudience('duskwatch:ingest').setIssuedAt(1_700_000_000).setExpirationTime(1_700_000_600).sign(key);
    const otherAudience = await base().setAudience('something-else').sign(key);
    const fine = await base().setAudience('duskwatch:ingest').sign(key);
    expect((await post(expired, { v: 4.8 })).status).toBe(401);
    expect((await post(otherAudience, { v: 4.8 })).status).toBe(401);
    expect((await post(fine, { t: iso(50), v: 4.8 })).status).toBe(200); // the same key and claims otherwise work
  });

  it('takes the node from the token: a token for node A cannot write node B', async () => {
    const before = await stored(other.nodeId);
    const res = await post(node.token, { v: 4.8, node: other.nodeId });
    expect(res.status).toBe(422); // unknown field
    const ok = await post(node.token, { t: iso(100), v: 4.8 });
    expect(ok.status).toBe(200);
    expect(await stored(other.nodeId)).toBe(before);
  });

  it('refuses a revoked token on the very next request', async () => {
    const fresh = await createTestNode('ingest-revoke');
    expect((await post(fresh.token, { v: 4.8 })).status).toBe(200);
    const revoke = await fresh.session.agent.delete(`/api/v1/nodes/${fresh.nodeId}/credentials/${fresh.credentialId}`).set('origin', fresh.session.origin);
    expect(revoke.status).toBe(204);
    isProblem(await post(fresh.token, { v: 4.8 }), 401);
  });

  it('refuses a token whose node was deleted', async () => {
    const fresh = await createTestNode('ingest-deleted');
    const del = await fresh.session.agent.delete(`/api/v1/nodes/${fresh.nodeId}`).set('origin', fresh.session.origin);
    expect(del.status).toBe(204);
    isProblem(await post(fresh.token, { v: 4.8 }), 401);
  });

  it('answers 429 with Retry-After when one node posts far too fast', async () => {
    const fast = await createTestNode('ingest-fast');
    let limited: { status: number; headers: Record<string, string> } | undefined;
    for (let i = 0; i < 300 && !limited; i++) {
      const res = await post(fast.token, { t: iso(1000 - i), v: 4.8 });
      if (res.status === 429) limited = res;
    }
    expect(limited?.status).toBe(429);
    expect(Number(limited?.headers['retry-after'])).toBeGreaterThan(0);
  });

  it('never stores a device token: only the credential id', async () => {
    const rows = await db()('device_credentials').select('*');
    const text = JSON.stringify(rows);
    expect(text).not.toContain(node.token);
    expect(text).not.toContain(node.token.split('.')[2]);
  });
});

describe('GET /api/v1/openapi.json', () => {
  it('serves the contract to device makers without signing in', async () => {
    const res = await api().get('/api/v1/openapi.json');
    expect(res.status).toBe(200);
    expect(res.body.openapi).toBe('3.1.0');
    expect(res.body.paths['/api/v1/readings']).toBeDefined();
  });
});

describe('chart rollups kept on ingest', () => {
  it('fold each post into its buckets exactly as a full recomputation would (derived here)', async () => {
    const { rebuildRollups } = await import('@/lib/db/queries/rollups');
    const fresh = await createTestNode('ingest-rollup');
    const base = Date.now() - 5 * 3600_000;
    const at = (min: number) => new Date(base + min * 60_000).toISOString();
    await post(fresh.token, { readings: [0, 3, 7, 61, 62].map((m, i) => ({ t: at(m), v: 4.5 + i / 100, vp: i % 2 ? 5.9 : undefined })) });
    await post(fresh.token, { readings: [2, 3, 90].map((m) => ({ t: at(m), v: 4.41 })) }); // 3 is a duplicate
    await post(fresh.token, { t: at(1), v: 4.7, vp: 6.1 }); // older than the newest: still folded in
    const snapshot = async () => (await db()('reading_rollups').where({ node_id: fresh.nodeId }).orderBy(['bucket_seconds', 'bucket_start']))
      .map((r) => ({ ...r, v_sum: Number(r.v_sum).toFixed(4) }));
    const incremental = await snapshot();
    await db()('reading_rollups').where({ node_id: fresh.nodeId }).delete();
    await rebuildRollups(db(), fresh.nodeId);
    expect(incremental).toEqual(await snapshot());
    expect(incremental.filter((r) => r.bucket_seconds === 3600).reduce((n, r) => n + r.n, 0)).toBe(8);
  });
});
