import { afterAll, describe, expect, it } from 'vitest';
import { closeDb } from '@/lib/db/knex';
import { api } from './helpers/stack';
import { signIn } from './helpers/session';

afterAll(closeDb);

describe('web hygiene (OWASP ASVS 5.0 V3, OWASP API8:2023 security misconfiguration)', () => {
  it('sends a content security policy without unsafe-eval, frame-ancestors none, nosniff and a referrer policy', async () => {
    for (const path of ['/', '/sign-in', '/api/v1/openapi.json']) {
      const res = await api().get(path);
      const csp = res.headers['content-security-policy'];
      expect(csp, path).toContain("frame-ancestors 'none'");
      expect(csp, path).not.toContain('unsafe-eval');
      expect(res.headers['x-content-type-options']).toBe('nosniff');
      expect(res.headers['referrer-policy']).toBe('strict-origin-when-cross-origin');
    }
  });

  it('does not let a request carrying x-middleware-subrequest skip proxy.ts', async () => {
    const res = await api().get('/fleet').set('x-middleware-subrequest', 'proxy:proxy:proxy:proxy:proxy').redirects(0);
    expect(res.status).toBeGreaterThanOrEqual(300);
    expect(res.status).toBeLessThan(400);
    expect(res.headers.location).toContain('/sign-in');
  });

  it('answers a missing page with a generic 404, no stack trace', async () => {
    const res = await api().get('/no/such/page');
    expect(res.status).toBe(404);
    expect(res.text).not.toMatch(/at \w+ \(|node_modules|\.ts:\d+/);
  });

  it('answers an unknown API id and a broken id as a plain 404 problem, no internals', async () => {
    const s = await signIn('viewer@larkspur.example');
    for (const id of ['99999999', 'abc', '1;DROP TABLE nodes', '-1', '1e3']) {
      const res = await s.agent.get(`/api/v1/nodes/${encodeURIComponent(id)}`);
      expect(res.status, id).toBe(404);
      expect(res.headers['content-type']).toContain('application/problem+json');
      expect(JSON.stringify(res.body)).not.toMatch(/sql|knex|stack|ER_/i);
    }
  });

  it('sets the session cookie HttpOnly and SameSite=Lax (Secure is set when APP_URL is https)', async () => {
    const s = await signIn('viewer@larkspur.example');
    const cookie = s.cookies.find((c) => c.startsWith('next-auth.session-token='))!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });
});
