import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { api } from './helpers/stack';
import { signIn, signedIn } from './helpers/session';

// OWASP ASVS 5.0 V6.3.1 (brute force slowed, no permanent lock-out); OWASP API4:2023.
afterAll(async () => {
  await db()('signin_throttle').where('throttle_key', 'like', 'ip:%').delete();
  await closeDb();
});

async function makeUser(email: string, password: string) {
  const owner = await signedIn('owner@larkspur.example');
  const inv = await owner.agent.post('/api/v1/team/invitations').set('origin', owner.origin).send({ email, role: 'viewer' });
  const token = String(inv.body.link).split('/').pop();
  const ok = await api().post('/api/v1/invitations/accept').set('origin', process.env.APP_URL!).send({ token, name: 'Throttle Test', password });
  expect(ok.status).toBe(201);
}

describe('sign-in throttling', () => {
  it('slows a wrong-password storm on one account, then lets the real user back in', async () => {
    const email = 'throttled@larkspur.example';
    const password = 'the right passphrase';
    await makeUser(email, password);
    for (let i = 0; i < 7; i++) expect((await signIn(email, `wrong guess ${i}`)).ok).toBe(false);
    const row = await db()('signin_throttle').where({ throttle_key: `email:${email}` }).first();
    expect(row.failures).toBe(7);
    expect(new Date(row.blocked_until).getTime()).toBeGreaterThan(Date.now());
    // Even the right password is refused while the account is cooling down …
    expect((await signIn(email, password)).ok).toBe(false);
    // … and works once the (short, growing) wait is over: no permanent lock-out.
    await db()('signin_throttle').where({ throttle_key: `email:${email}` }).update({ blocked_until: new Date(Date.now() - 1000) });
    expect((await signIn(email, password)).ok).toBe(true);
    expect(await db()('signin_throttle').where({ throttle_key: `email:${email}` }).first()).toBeUndefined();
  });

  it('counts failures per client address from the socket: a spoofed X-Forwarded-For cannot dodge it', async () => {
    await db()('signin_throttle').where('throttle_key', 'like', 'ip:%').delete();
    for (let i = 0; i < 3; i++) {
      const agent = api();
      const csrf = await agent.get('/api/auth/csrf');
      const cookie = ([] as string[]).concat(csrf.headers['set-cookie'] ?? []).map((c) => c.split(';')[0]).join('; ');
      await api().post('/api/auth/callback/credentials').set('cookie', cookie).set('x-forwarded-for', `203.0.113.${i + 1}`)
        .type('form').send({ email: `spoof${i}@larkspur.example`, password: 'nope nope nope', csrfToken: csrf.body.csrfToken, json: 'true' });
    }
    const keys = await db()('signin_throttle').where('throttle_key', 'like', 'ip:%').pluck('throttle_key');
    expect(keys.some((k: string) => k.includes('203.0.113'))).toBe(false);
    const local = await db()('signin_throttle').where('throttle_key', 'like', 'ip:%127.0.0.1').first();
    expect(local.failures).toBeGreaterThanOrEqual(3);
  });
});
