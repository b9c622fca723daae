import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { api } from './helpers/stack';
import { signIn, signedIn } from './helpers/session';

afterAll(closeDb);

/**
 * A person in two organizations (an existing account accepting a second invitation) sees one
 * at a time, chooses which, and has in each exactly the role given there.
 */
const email = `two-orgs-${Date.now()}@larkspur.example`;
const password = 'a long enough passphrase';
let larkspur: number;
let cinder: number;

async function inviteAndAccept(ownerEmail: string, role: 'deployer' | 'viewer', chosenPassword: string) {
  const owner = await signedIn(ownerEmail);
  const invited = await owner.agent.post('/api/v1/team/invitations').set('origin', owner.origin).send({ email, role });
  expect(invited.status).toBe(201);
  const token = (invited.body.link as string).split('/').pop()!;
  const accepted = await api().post('/api/v1/invitations/accept').set('origin', process.env.APP_URL!).send({ token, name: 'Two Orgs', password: chosenPassword });
  expect(accepted.status).toBe(201);
  return { owner, accepted };
}

const nodeNamesOf = async (orgId: number) =>
  (await db()('nodes').where({ org_id: orgId }).whereNull('deleted_at').pluck('name')).sort();

let cinderOwner: Awaited<ReturnType<typeof signedIn>>;

beforeAll(async () => {
  larkspur = (await db()('organizations').where({ slug: 'larkspur-hollow' }).first('id')).id;
  cinder = (await db()('organizations').where({ slug: 'cinder-flats' }).first('id')).id;
  const first = await inviteAndAccept('owner@larkspur.example', 'viewer', password);
  expect(first.accepted.body).toEqual({ email, existing_account: false });
  // The second invitation finds the account: it adds the membership and leaves the password alone.
  const second = await inviteAndAccept('owner@cinderflats.example', 'deployer', 'a different passphrase');
  expect(second.accepted.body).toEqual({ email, existing_account: true });
  cinderOwner = second.owner;
}, 60_000);

describe('an invitation for an existing account', () => {
  it('keeps the password, and its e-mail says so', async () => {
    expect((await signIn(email, 'a different passphrase')).ok).toBe(false);
    expect((await signIn(email, password)).ok).toBe(true);
    const mails = await db()('email_outbox').where({ to_address: email, purpose: 'invitation' }).orderBy('id').pluck('text_body');
    expect(mails).toHaveLength(2);
    expect(mails[0]).toContain('Set your password here');
    expect(mails[1]).toContain('You keep your present password');
    expect(mails[1]).not.toContain('Set your password');
  });
});

describe('choosing the organization shown', () => {
  it('lists both, shows the first membership until another is chosen, then that one with its own role', async () => {
    const me = await signedIn(email, password);
    const listed = await me.agent.get('/api/v1/org/current');
    expect(listed.status).toBe(200);
    expect(listed.body.current).toBe(larkspur);
    expect(listed.body.organizations.map((o: { id: number; role: string }) => [o.id, o.role])).toEqual([[larkspur, 'viewer'], [cinder, 'deployer']]);

    const fleetNames = async () => (await me.agent.get('/api/v1/fleet')).body.nodes.map((n: { name: string }) => n.name).sort();
    const createNode = () => me.agent.post('/api/v1/nodes').set('origin', me.origin).send({});
    expect(await fleetNames()).toEqual(await nodeNamesOf(larkspur));
    expect((await createNode()).status).toBe(403); // a viewer in Larkspur

    const chose = await me.agent.put('/api/v1/org/current').set('origin', me.origin).send({ org_id: cinder });
    expect(chose.status).toBe(200);
    expect(chose.body).toMatchObject({ id: cinder, role: 'deployer' });
    expect(([] as string[]).concat(chose.headers['set-cookie'] ?? []).join()).toMatch(/dw-org=\d+;.*HttpOnly/i);

    expect((await me.agent.get('/api/v1/org/current')).body.current).toBe(cinder);
    expect(await fleetNames()).toEqual(await nodeNamesOf(cinder));
    expect((await createNode()).status).toBe(422); // a deployer in Cinder Flats: allowed, the empty body is refused
  });

  it('refuses an organization the caller is not in exactly as one that does not exist', async () => {
    const me = await signedIn(email, password);
    const [other] = await db()('organizations').insert({ name: 'Switch test outsiders', slug: `switch-outsiders-${Date.now()}` });
    const theirs = await me.agent.put('/api/v1/org/current').set('origin', me.origin).send({ org_id: other });
    const missing = await me.agent.put('/api/v1/org/current').set('origin', me.origin).send({ org_id: 99_999_999 });
    expect(theirs.status).toBe(404);
    expect(theirs.body).toEqual(missing.body);
    expect(theirs.headers['set-cookie']).toBeUndefined();

    // A cookie set by hand to that organization is not honoured either.
    const forged = await me.agent.get('/api/v1/org/current').set('cookie', `${me.cookies.map((c) => c.split(';')[0]).join('; ')}; dw-org=${other}`);
    expect(forged.body.current).toBe(larkspur);
  });

  it('checks the body, and falls back to the remaining organization when a membership ends', async () => {
    const me = await signedIn(email, password);
    const bad = await me.agent.put('/api/v1/org/current').set('origin', me.origin).send({ org_id: 'cinder' });
    expect(bad.status).toBe(422);
    expect(bad.body.errors).toContainEqual({ pointer: '/org_id', detail: 'Choose one of your organizations.' });

    expect((await me.agent.put('/api/v1/org/current').set('origin', me.origin).send({ org_id: cinder })).status).toBe(200);
    const membership = await db()('memberships as m').join('users as u', 'u.id', 'm.user_id').where({ 'u.email': email, 'm.org_id': cinder }).first('m.id');
    expect((await cinderOwner.agent.delete(`/api/v1/team/members/${membership.id}`).set('origin', cinderOwner.origin)).status).toBe(204);

    const after = await me.agent.get('/api/v1/org/current');
    expect(after.status).toBe(200);
    expect(after.body.current).toBe(larkspur);
    expect(after.body.organizations).toHaveLength(1);
    expect((await me.agent.get('/api/v1/fleet')).body.nodes.map((n: { name: string }) => n.name).sort()).toEqual(await nodeNamesOf(larkspur));
  });
});
