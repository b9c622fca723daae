import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { api } from './helpers/stack';
import { signIn, signedIn } from './helpers/session';
import { ROLE_SENTENCE } from '@/lib/auth/role-words';
import { formatInTimeZone, TIME_PATTERNS } from '@/lib/format/time';

afterAll(closeDb);

const tokenFrom = (link: string) => link.split('/').pop()!;
const escapeRegExp = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

async function invite(email: string, role: 'owner' | 'deployer' | 'viewer') {
  const owner = await signedIn('owner@larkspur.example');
  const res = await owner.agent.post('/api/v1/team/invitations').set('origin', owner.origin).send({ email, role });
  expect(res.status).toBe(201);
  return { owner, token: tokenFrom(res.body.link as string) };
}

async function accept(token: string, password = 'a long enough passphrase') {
  return api().post('/api/v1/invitations/accept').set('origin', process.env.APP_URL!).send({ token, name: 'Temp Person', password });
}

async function membershipIdOf(email: string) {
  return (await db()('memberships as m').join('users as u', 'u.id', 'm.user_id').where('u.email', email).first('m.id')).id as number;
}

describe('invitations', () => {
  it('send an e-mail through the outbox and work exactly once', async () => {
    const { token } = await invite('once@larkspur.example', 'viewer');
    const mail = await db()('email_outbox').where({ to_address: 'once@larkspur.example', purpose: 'invitation' }).first();
    expect(mail.text_body).toContain(token);
    // Who invites, where to, which role and what it may do, the expiry, and what to do if unexpected.
    const inviter = await db()('users').where({ email: 'owner@larkspur.example' }).first('name');
    const inv = await db()('invitations as i').join('organizations as o', 'o.id', 'i.org_id')
      .where({ 'i.email': 'once@larkspur.example' }).orderBy('i.id', 'desc').first('i.expires_at', 'o.name as orgName');
    const org = { name: inv.orgName as string };
    expect(mail.subject).toContain(`${inviter.name} invited you to ${org.name}`);
    expect(mail.text_body).toMatch(new RegExp(`Invited by:\\s+${escapeRegExp(inviter.name)} \\(owner@larkspur\\.example\\)`));
    expect(mail.text_body).toMatch(new RegExp(`Organization:\\s+${escapeRegExp(org.name)}`));
    expect(mail.text_body).toMatch(/Role offered:\s+viewer/);
    expect(mail.text_body).toContain(ROLE_SENTENCE.viewer);
    expect(mail.text_body).toMatch(new RegExp(`Link expires:\\s+${escapeRegExp(formatInTimeZone(new Date(inv.expires_at), 'UTC', TIME_PATTERNS.record))}`));
    expect(mail.text_body).toMatch(/If you weren't expecting this invitation, ignore this e-mail/);
    expect((await accept(token)).status).toBe(201);
    expect((await accept(token)).status).toBe(404);
    expect((await signIn('once@larkspur.example', 'a long enough passphrase')).ok).toBe(true);
  });

  it('expire', async () => {
    const { token } = await invite('late@larkspur.example', 'viewer');
    await db()('invitations').where({ email: 'late@larkspur.example' }).update({ expires_at: new Date(Date.now() - 1000) });
    expect((await accept(token)).status).toBe(404);
  });

  it('need a name and a password when they create the account, and stay usable until then', async () => {
    const { token } = await invite('no-password@larkspur.example', 'viewer');
    const res = await api().post('/api/v1/invitations/accept').set('origin', process.env.APP_URL!).send({ token });
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([{ pointer: '/name', detail: 'Enter your name.' }, { pointer: '/password', detail: 'Choose a password.' }]);
    expect(await db()('users').where({ email: 'no-password@larkspur.example' }).first('id')).toBeUndefined();
    expect((await accept(token)).status).toBe(201);
  });

  it('refuse a password under 10 characters, in the server words, by the field', async () => {
    const { token } = await invite('short@larkspur.example', 'viewer');
    const res = await accept(token, 'short');
    expect(res.status).toBe(422);
    expect(res.body.errors).toContainEqual({ pointer: '/password', detail: 'Use at least 10 characters.' });
  });
});

describe('role changes and removal take effect on the next request', () => {
  it('a demoted member loses the right with the same cookie; a removed one is signed out', async () => {
    const { owner, token } = await invite('temp-deployer@larkspur.example', 'deployer');
    expect((await accept(token)).status).toBe(201);
    const member = await signedIn('temp-deployer@larkspur.example', 'a long enough passphrase');
    const probe = () => member.agent.delete('/api/v1/nodes/99999999').set('origin', member.origin);
    expect((await probe()).status).toBe(404); // allowed: the node simply does not exist

    const id = await membershipIdOf('temp-deployer@larkspur.example');
    const demote = await owner.agent.patch(`/api/v1/team/members/${id}`).set('origin', owner.origin).send({ role: 'viewer' });
    expect(demote.status).toBe(200);
    expect((await probe()).status).toBe(403);

    const removed = await owner.agent.delete(`/api/v1/team/members/${id}`).set('origin', owner.origin);
    expect(removed.status).toBe(204);
    expect((await member.agent.get('/api/v1/nodes')).status).toBe(401);
  });

  it('never removes or demotes the last owner', async () => {
    const owner = await signedIn('owner@larkspur.example');
    const id = await membershipIdOf('owner@larkspur.example');
    const remove = await owner.agent.delete(`/api/v1/team/members/${id}`).set('origin', owner.origin);
    expect(remove.status).toBe(409);
    const demote = await owner.agent.patch(`/api/v1/team/members/${id}`).set('origin', owner.origin).send({ role: 'viewer' });
    expect(demote.status).toBe(409);
    const audit = await db()('audit_log').where({ action: 'role_changed' }).count({ n: '*' });
    expect(Number(audit[0].n)).toBeGreaterThan(0);
  });

  it('keeps the team API to owners', async () => {
    const deployer = await signedIn('deployer@larkspur.example');
    expect((await deployer.agent.get('/api/v1/team')).status).toBe(403);
  });
});

describe('password reset', () => {
  // OWASP ASVS 5.0 V7 (from memory): a password change ends the sessions signed in before it.
  it('signs out every session from before the reset; a sign-in with the new password works', async () => {
    const email = `reset-ends-${Date.now()}@larkspur.example`;
    const { token } = await invite(email, 'viewer');
    expect((await accept(token, 'the first long passphrase')).status).toBe(201);
    const before = await signedIn(email, 'the first long passphrase');
    expect((await before.agent.get('/api/v1/fleet')).status).toBe(200);

    const origin = process.env.APP_URL!;
    expect((await api().post('/api/v1/password-resets').set('origin', origin).send({ email })).status).toBe(202);
    const mail = await db()('email_outbox').where({ to_address: email, purpose: 'password_reset' }).orderBy('id', 'desc').first();
    const resetToken = tokenFrom(/https?:\/\/\S+reset-password\/\S+/.exec(mail.text_body)![0]);
    expect((await api().post('/api/v1/password-resets/confirm').set('origin', origin).send({ token: resetToken, password: 'the second long passphrase' })).status).toBe(200);

    expect((await before.agent.get('/api/v1/fleet')).status).toBe(401); // the same cookie, now over
    expect((await signIn(email, 'the first long passphrase')).ok).toBe(false);
    const after = await signedIn(email, 'the second long passphrase');
    expect((await after.agent.get('/api/v1/fleet')).status).toBe(200);
  });

  it('answers the same for unknown e-mails, and its link works once and expires', async () => {
    const origin = process.env.APP_URL!;
    const unknown = await api().post('/api/v1/password-resets').set('origin', origin).send({ email: 'nobody@larkspur.example' });
    const known = await api().post('/api/v1/password-resets').set('origin', origin).send({ email: 'once@larkspur.example' });
    expect(unknown.status).toBe(202);
    expect(known.status).toBe(202);
    expect(unknown.body).toEqual(known.body);

    const mail = await db()('email_outbox').where({ to_address: 'once@larkspur.example', purpose: 'password_reset' }).orderBy('id', 'desc').first();
    const token = tokenFrom(/https?:\/\/\S+reset-password\/\S+/.exec(mail.text_body)![0]);
    const confirm = (password: string) => api().post('/api/v1/password-resets/confirm').set('origin', origin).send({ token, password });
    expect((await confirm('a brand new passphrase')).status).toBe(200);
    expect((await confirm('another new passphrase')).status).toBe(404);
    expect((await signIn('once@larkspur.example', 'a brand new passphrase')).ok).toBe(true);

    await api().post('/api/v1/password-resets').set('origin', origin).send({ email: 'once@larkspur.example' });
    const second = await db()('email_outbox').where({ to_address: 'once@larkspur.example', purpose: 'password_reset' }).orderBy('id', 'desc').first();
    const token2 = tokenFrom(/https?:\/\/\S+reset-password\/\S+/.exec(second.text_body)![0]);
    await db()('password_resets').whereNull('used_at').update({ expires_at: new Date(Date.now() - 1000) });
    const late = await api().post('/api/v1/password-resets/confirm').set('origin', origin).send({ token: token2, password: 'too late passphrase' });
    expect(late.status).toBe(404);
  });
});
