import { afterAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { api } from './helpers/stack';
import { signedIn } from './helpers/session';

afterAll(async () => {
  // This file's invitation mail lives in the demo organization's outbox: take it out again, so
  // the outbox screen's test still finds the dead letter it planted first.
  await db()('email_outbox').where('to_address', 'like', 'cancel-%@larkspur.example').delete();
  await db()('invitations').where('email', 'like', 'cancel-%@larkspur.example').delete();
  await closeDb();
});

const tokenFrom = (link: string) => link.split('/').pop()!;

async function invite(email: string) {
  const owner = await signedIn('owner@larkspur.example');
  const res = await owner.agent.post('/api/v1/team/invitations').set('origin', owner.origin).send({ email, role: 'viewer' });
  expect(res.status).toBe(201);
  const { id } = await db()('invitations').where({ email }).orderBy('id', 'desc').first('id');
  return { owner, token: tokenFrom(res.body.link as string), id: id as number };
}

const cancel = (session: Awaited<ReturnType<typeof signedIn>>, id: number) =>
  session.agent.delete(`/api/v1/team/invitations/${id}`).set('origin', session.origin);

const accept = (token: string) =>
  api().post('/api/v1/invitations/accept').set('origin', process.env.APP_URL!).send({ token, name: 'Cancelled Invitee', password: 'a long enough passphrase' });

describe('cancelling an invitation', () => {
  it('an owner cancels: 204, the link page no longer offers it and accepting it is 404', async () => {
    const email = `cancel-${Date.now()}@larkspur.example`;
    const { owner, token, id } = await invite(email);
    expect((await cancel(owner, id)).status).toBe(204);

    const page = await api().get(`/invitations/${token}`);
    expect(page.text).toContain('data-testid="invitation-gone"');
    expect(page.text).not.toContain(email);
    expect((await accept(token)).status).toBe(404);
    expect(await db()('users').where({ email }).first('id')).toBeUndefined();

    const team = await owner.agent.get('/api/v1/team');
    expect(team.body.invitations.map((i: { id: number }) => i.id)).not.toContain(id);
    // The invitation mail, not yet sent in the usual case, is not sent any more.
    const mail = await db()('email_outbox').where({ to_address: email, purpose: 'invitation' }).first('status');
    expect(['dead', 'sent']).toContain(mail.status);
  });

  it('is refused to a deployer (403), and the invitation stays open', async () => {
    const { token, id } = await invite(`cancel-by-deployer-${Date.now()}@larkspur.example`);
    const deployer = await signedIn('deployer@larkspur.example');
    const res = await cancel(deployer, id);
    expect(res.status).toBe(403);
    expect(res.headers['content-type']).toContain('application/problem+json');
    expect(await db()('invitations').where({ id }).first('id')).toBeDefined();
    expect((await accept(token)).status).toBe(201);
  });

  it("answers 404 to another organization's owner, as for a missing one, and changes nothing", async () => {
    const { id } = await invite(`cancel-by-stranger-${Date.now()}@larkspur.example`);
    const stranger = await signedIn('owner@cinderflats.example');
    const theirs = await cancel(stranger, id);
    const missing = await cancel(stranger, 99_999_999);
    expect(theirs.status).toBe(404);
    expect(theirs.body).toEqual(missing.body);
    expect(await db()('invitations').where({ id }).first('id')).toBeDefined();
  });

  it('answers 404 the second time', async () => {
    const { owner, id } = await invite(`cancel-twice-${Date.now()}@larkspur.example`);
    expect((await cancel(owner, id)).status).toBe(204);
    const again = await cancel(owner, id);
    expect(again.status).toBe(404);
    expect(again.body.detail).toBe('The invitation does not exist.');
  });

  it('refuses an accepted invitation with 409 and says what to do instead', async () => {
    const { owner, token, id } = await invite(`cancel-accepted-${Date.now()}@larkspur.example`);
    expect((await accept(token)).status).toBe(201);
    const res = await cancel(owner, id);
    expect(res.status).toBe(409);
    expect(res.body.detail).toMatch(/accepted already.*remove the member/);
  });
});
