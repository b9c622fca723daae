import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { api } from './helpers/stack';
import { signIn, signedIn } from './helpers/session';

afterAll(closeDb);

const larkspurNodeId = async () =>
  (await db()('nodes as n').join('organizations as o', 'o.id', 'n.org_id').where('o.slug', 'larkspur-hollow').first('n.id')).id as number;

describe('sign-in (next-auth credentials, JWT session)', () => {
  it.each(['owner@larkspur.example', 'deployer@larkspur.example', 'viewer@larkspur.example', 'owner@cinderflats.example'])(
    '%s signs in and gets an HttpOnly, SameSite=Lax session cookie',
    async (email) => {
      const s = await signIn(email);
      expect(s.ok).toBe(true);
      const cookie = s.cookies.find((c) => c.startsWith('next-auth.session-token='))!;
      expect(cookie).toMatch(/HttpOnly/i);
      expect(cookie).toMatch(/SameSite=Lax/i);
      const me = await s.agent.get('/api/v1/nodes');
      expect(me.status).toBe(200);
    },
  );

  it('refuses a wrong password and an unknown e-mail with the same answer', async () => {
    const wrong = await signIn('viewer@larkspur.example', 'not-the-password');
    const unknown = await signIn('nobody@larkspur.example', 'not-the-password');
    expect(wrong.ok).toBe(false);
    expect(unknown.ok).toBe(false);
  });

  it('writes audit rows for sign-in and failed sign-in', async () => {
    await signIn('deployer@larkspur.example');
    await signIn('deployer@larkspur.example', 'wrong-password-here');
    const actions = await db()('audit_log').where({ target: 'deployer@larkspur.example' }).pluck('action');
    expect(actions).toContain('signin');
    expect(actions).toContain('signin_failed');
  });
});

describe('roles and tenancy (OWASP API1:2023 object level, API5:2023 function level)', () => {
  it('answers 401 problem+json when signed out', async () => {
    const res = await api().get('/api/v1/nodes');
    expect(res.status).toBe(401);
    expect(res.headers['content-type']).toContain('application/problem+json');
    expect(res.body.status).toBe(401);
  });

  it("refuses a viewer's POST to a deployer route with 403", async () => {
    const s = await signedIn('viewer@larkspur.example');
    const res = await s.agent.post('/api/v1/nodes').set('origin', s.origin).send({ name: 'x' });
    expect(res.status).toBe(403);
    expect(res.headers['content-type']).toContain('application/problem+json');
  });

  it('answers 404 to an owner of another organization, exactly as for a missing node', async () => {
    const s = await signedIn('owner@cinderflats.example');
    const theirs = await s.agent.get(`/api/v1/nodes/${await larkspurNodeId()}`);
    const missing = await s.agent.get('/api/v1/nodes/99999999');
    expect(theirs.status).toBe(404);
    expect(missing.status).toBe(404);
    expect(theirs.body.title).toBe(missing.body.title);
  });

  it('refuses a cookie-authenticated write without our Origin (CSRF)', async () => {
    const s = await signedIn('owner@larkspur.example');
    const none = await s.agent.delete('/api/v1/nodes/99999999');
    const foreign = await s.agent.delete('/api/v1/nodes/99999999').set('origin', 'http://evil.example');
    expect(none.status).toBe(403);
    expect(foreign.status).toBe(403);
  });
});
