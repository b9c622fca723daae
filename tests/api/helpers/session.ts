import supertest from 'supertest';
import { appUrl } from './stack';

export const DEMO_PASSWORD = 'duskwatch-demo';

/**
 * A signed-in browser stand-in: next-auth's credentials flow (CSRF token, then the callback),
 * cookies kept by the agent, and our Origin on every write like a real browser sends.
 */
export async function signIn(email: string, password = DEMO_PASSWORD) {
  const agent = supertest.agent(appUrl());
  const csrf = await agent.get('/api/auth/csrf');
  const res = await agent
    .post('/api/auth/callback/credentials')
    .type('form')
    .send({ email, password, csrfToken: csrf.body.csrfToken, json: 'true' });
  const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  const ok = cookies.some((c) => c.startsWith('next-auth.session-token='));
  return { agent, ok, cookies, origin: appUrl() };
}

export async function signedIn(email: string, password = DEMO_PASSWORD) {
  const s = await signIn(email, password);
  if (!s.ok) throw new Error(`sign-in failed for ${email}`);
  return s;
}
