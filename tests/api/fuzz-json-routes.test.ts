import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { signedIn } from './helpers/session';

/**
 * Bad input against every JSON write route (OWASP API8:2023; ASVS 5.0 V2 validation): as an
 * owner (who passes every role check), random and hostile bodies must never produce a 5xx,
 * every refusal is problem+json, and nothing is stored for a refused body.
 */
const ROUTES: { method: 'post' | 'put' | 'patch'; path: string }[] = [
  { method: 'post', path: '/api/v1/nodes' },
  { method: 'put', path: '/api/v1/nodes/{node}' },
  { method: 'post', path: '/api/v1/sites' },
  { method: 'put', path: '/api/v1/sites/{site}' },
  { method: 'post', path: '/api/v1/model/evaluate' },
  { method: 'post', path: '/api/v1/planner' },
  { method: 'post', path: '/api/v1/bench/characterize' },
  { method: 'post', path: '/api/v1/bench/runs' },
  { method: 'put', path: '/api/v1/org/settings' },
  { method: 'put', path: '/api/v1/subscriptions' },
  { method: 'post', path: '/api/v1/team/invitations' },
  { method: 'patch', path: '/api/v1/team/members/{member}' },
  { method: 'post', path: '/api/v1/nodes/{node}/credentials' },
  { method: 'post', path: '/api/v1/invitations/accept' },
  { method: 'post', path: '/api/v1/password-resets' },
  { method: 'post', path: '/api/v1/password-resets/confirm' },
];

const hostile = fc.oneof(
  fc.constantFrom('NaN', 'Infinity', '-Infinity', '1e309', '', '\u0000', "'; DROP TABLE nodes; --", 'Robert\r\nBcc: x@y', '__proto__', '\uFFFF'),
  fc.double(), fc.integer(), fc.boolean(), fc.constant(null), fc.string({ maxLength: 40 }),
);
const body = fc.oneof(
  fc.json({ maxDepth: 3 }),
  fc.dictionary(fc.constantFrom('name', 'email', 'role', 'bank', 'converter', 'load', 'site', 'volts', 'at', 'site_id', 'lat', 'lon', 'time_zone', 'token', 'password', '__proto__', 'constructor', 'steady_margin', 'thin_margin', 'samples', 'rated_volts', 'current_amps', 'label', 'subscriptions'), fc.oneof(hostile, fc.dictionary(fc.string({ maxLength: 12 }), hostile, { maxKeys: 4 }), fc.array(hostile, { maxLength: 4 })), { maxKeys: 8 }).map((o) => JSON.stringify(o)),
  fc.nat(60).map((d) => '{"a":'.repeat(d * 20) + '1' + '}'.repeat(d * 20)),
  fc.string({ maxLength: 200 }),
);

let owner: Awaited<ReturnType<typeof signedIn>>;
let ids: Record<string, number>;
beforeAll(async () => {
  owner = await signedIn('owner@larkspur.example');
  const org = await db()('organizations').where({ slug: 'larkspur-hollow' }).first('id');
  const node = await db()('nodes').where({ org_id: org.id }).whereNull('deleted_at').orderBy('id').first('id', 'site_id');
  const member = await db()('memberships as m').join('users as u', 'u.id', 'm.user_id').where('u.email', 'viewer@larkspur.example').first('m.id');
  ids = { node: node.id, site: node.site_id, member: member.id };
});
afterAll(closeDb);

const counts = async () => {
  const out: Record<string, number> = {};
  for (const t of ['nodes', 'sites', 'invitations', 'device_credentials', 'bench_runs', 'users', 'memberships']) out[t] = Number((await db()(t).count({ n: '*' }))[0].n);
  return out;
};

describe('hostile bodies against every JSON route', () => {
  it('never a 5xx, always problem+json, nothing stored when refused', async () => {
    const before = await counts();
    let accepted = 0;
    for (const route of ROUTES) {
      const url = route.path.replace(/\{(\w+)\}/g, (_, k: string) => String(ids[k]));
      await fc.assert(
        fc.asyncProperty(body, async (b) => {
          const res = await owner.agent[route.method](url).set('origin', owner.origin).set('content-type', 'application/json').send(b);
          expect(res.status, `${route.method} ${url} ${b.slice(0, 80)}`).toBeLessThan(500);
          if (res.status >= 400) {
            expect(res.headers['content-type']).toContain('application/problem+json');
            expect(res.body.status).toBe(res.status);
          } else accepted++;
        }),
        { numRuns: 60 },
      );
    }
    const after = await counts();
    // Random bodies essentially never form a valid node, site, invitation … : nothing new stored.
    if (accepted === 0) expect(after).toEqual(before);
    // A role change on the viewer would be a valid PATCH only with a real role name; restore it.
    await db()('memberships').where({ id: ids.member }).update({ role: 'viewer' });
  }, 600_000);
});
