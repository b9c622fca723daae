import { randomBytes } from 'node:crypto';
import { readFileSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb, db } from '@/lib/db/knex';
import { currentTestProfile } from '@/db/lifecycle/profile';
import { api } from './helpers/stack';
import { signedIn } from './helpers/session';

/**
 * The authorization matrix (OWASP API1:2023 object level, API5:2023 function level; ASVS 5.0
 * V8). Generated from the inventory of every route handler under app/api/v1, so a new route
 * cannot be forgotten: it fails here until it is given its expected rule. The app has no
 * server actions; every write goes through these handlers.
 */
type Rule = 'public' | 'device' | 'viewer' | 'deployer' | 'owner';
const EXPECTED: Record<string, Rule> = {
  'POST /api/v1/alerts/[alertId]/acknowledge': 'deployer',
  'GET /api/v1/alerts/outbox': 'owner',
  'GET /api/v1/alerts': 'viewer',
  'POST /api/v1/bench/characterize': 'deployer',
  'GET /api/v1/bench/runs': 'viewer',
  'POST /api/v1/bench/runs': 'deployer',
  'GET /api/v1/fleet': 'viewer',
  'GET /api/v1/fleet/soc-series': 'viewer',
  'POST /api/v1/invitations/accept': 'public',
  'POST /api/v1/model/evaluate': 'viewer',
  'DELETE /api/v1/nodes/[nodeId]/credentials/[credentialId]': 'deployer',
  'GET /api/v1/nodes/[nodeId]/credentials': 'viewer',
  'POST /api/v1/nodes/[nodeId]/credentials': 'deployer',
  'GET /api/v1/nodes/[nodeId]/export': 'viewer',
  'GET /api/v1/nodes/[nodeId]/imports': 'viewer',
  'POST /api/v1/nodes/[nodeId]/imports': 'deployer',
  'GET /api/v1/nodes/[nodeId]/nights': 'viewer',
  'GET /api/v1/nodes/[nodeId]': 'viewer',
  'PUT /api/v1/nodes/[nodeId]': 'deployer',
  'DELETE /api/v1/nodes/[nodeId]': 'deployer',
  'GET /api/v1/nodes/[nodeId]/series': 'viewer',
  'GET /api/v1/nodes/[nodeId]/status': 'viewer',
  'GET /api/v1/nodes/[nodeId]/visits/[visitId]/photo': 'viewer',
  'GET /api/v1/nodes/[nodeId]/visits': 'viewer',
  'POST /api/v1/nodes/[nodeId]/visits': 'deployer',
  'GET /api/v1/nodes': 'viewer',
  'POST /api/v1/nodes': 'deployer',
  'GET /api/v1/openapi.json': 'public',
  'GET /api/v1/org/current': 'viewer',
  'PUT /api/v1/org/current': 'viewer',
  'GET /api/v1/org/settings': 'viewer',
  'PUT /api/v1/org/settings': 'owner',
  'POST /api/v1/password-resets/confirm': 'public',
  'POST /api/v1/password-resets': 'public',
  'POST /api/v1/planner': 'viewer',
  'POST /api/v1/readings': 'device',
  'GET /api/v1/sites/[siteId]': 'viewer',
  'PUT /api/v1/sites/[siteId]': 'deployer',
  'DELETE /api/v1/sites/[siteId]': 'deployer',
  'GET /api/v1/sites': 'viewer',
  'POST /api/v1/sites': 'deployer',
  'GET /api/v1/subscriptions': 'viewer',
  'PUT /api/v1/subscriptions': 'viewer',
  'POST /api/v1/team/invitations': 'owner',
  'DELETE /api/v1/team/invitations/[invitationId]': 'owner',
  'PATCH /api/v1/team/members/[membershipId]': 'owner',
  'DELETE /api/v1/team/members/[membershipId]': 'owner',
  'GET /api/v1/team': 'owner',
};

function inventory(): string[] {
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const full = path.join(dir, name);
      if (statSync(full).isDirectory()) walk(full);
      else if (name === 'route.ts') {
        const src = readFileSync(full, 'utf8');
        const route = '/' + path.relative('app', path.dirname(full)).split(path.sep).join('/');
        for (const m of src.matchAll(/export\s+(?:const|async function|function)\s+(GET|POST|PUT|PATCH|DELETE)\b/g)) out.push(`${m[1]} ${route}`);
      }
    }
  };
  walk('app/api/v1');
  return out.sort();
}

const RANK: Record<string, number> = { viewer: 0, deployer: 1, owner: 2 };
let ids: Record<string, number> = {};
let sessions: Record<'viewer' | 'deployer' | 'owner' | 'stranger', Awaited<ReturnType<typeof signedIn>>>;
let deviceTokens: string[] = [];

beforeAll(async () => {
  const org = await db()('organizations').where({ slug: 'larkspur-hollow' }).first('id');
  const node = await db()('nodes').where({ org_id: org.id }).whereNull('deleted_at').orderBy('id').first('id', 'site_id');
  const cred = await db()('device_credentials').where({ node_id: node.id }).first('id');
  const member = await db()('memberships as m').join('users as u', 'u.id', 'm.user_id').where('u.email', 'viewer@larkspur.example').first('m.id');
  let alert = await db()('alerts').where({ org_id: org.id }).first('id');
  if (!alert) [alert] = await db()('alerts').insert({ org_id: org.id, node_id: node.id, kind: 'node_silent', detail: '{}' }).then((r) => r.map((id) => ({ id })));
  let visit = await db()('field_visits').where({ org_id: org.id }).first('id');
  if (!visit) [visit] = await db()('field_visits').insert({ org_id: org.id, node_id: node.id, visited_on: '2026-11-30', work_done: 'matrix fixture' }).then((r) => r.map((id) => ({ id })));
  // An open invitation of this organization, for the other organization's owner to try.
  const [invitationId] = await db()('invitations').insert({ org_id: org.id, email: 'matrix-invitee@larkspur.example', role: 'viewer', token_sha256: randomBytes(32), expires_at: new Date(Date.now() + 86_400_000) });
  ids = { nodeId: node.id, siteId: node.site_id, credentialId: cred.id, membershipId: member.id, alertId: alert.id, visitId: visit.id, invitationId };
  sessions = {
    viewer: await signedIn('viewer@larkspur.example'),
    deployer: await signedIn('deployer@larkspur.example'),
    owner: await signedIn('owner@larkspur.example'),
    stranger: await signedIn('owner@cinderflats.example'),
  };
  deviceTokens = Object.values(JSON.parse(readFileSync(path.join(currentTestProfile().dataDir, 'device-tokens.json'), 'utf8')));
}, 60_000);
afterAll(closeDb);

const fill = (route: string, real: boolean) => route.replace(/\[(\w+)\]/g, (_, name: string) => String(real ? ids[name] : 99_999_999));
const isObjectRoute = (route: string) => route.includes('[');
const destructive = (method: string) => method !== 'GET';

function call(agent: ReturnType<typeof api> | Awaited<ReturnType<typeof signedIn>>['agent'], method: string, url: string) {
  const m = method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
  const req = agent[m](url).set('origin', process.env.APP_URL!);
  return method === 'GET' ? req : req.set('content-type', 'application/json').send('{}');
}

describe('authorization matrix', () => {
  it('covers every route handler, and nothing that does not exist', () => {
    expect(inventory()).toEqual(Object.keys(EXPECTED).sort());
  });

  it.each(Object.entries(EXPECTED))('%s answers as its rule says for each caller', async (key, rule) => {
    const [method, route] = key.split(' ');
    const signedOut = await call(api(), method, fill(route, true));
    if (rule === 'public') expect([401, 403]).not.toContain(signedOut.status);
    else expect(signedOut.status, 'signed out').toBe(401);
    if (rule === 'public' || rule === 'device') return;

    for (const role of ['viewer', 'deployer', 'owner'] as const) {
      // Allowed callers get a missing id for writes, so the matrix never changes real data.
      const url = fill(route, !(destructive(method) && isObjectRoute(route)));
      const res = await call(sessions[role].agent, method, url);
      if (RANK[role] < RANK[rule]) expect(res.status, `${role}`).toBe(403);
      else {
        expect([401, 403], `${role} got ${res.status}`).not.toContain(res.status);
        expect(res.status, `${role}`).toBeLessThan(500);
        const text = res.text ?? '';
        expect(text).not.toMatch(/\$2[aby]\$\d\d\$/); // no bcrypt hash, ever
        for (const token of deviceTokens) expect(text).not.toContain(token);
      }
    }
    if (isObjectRoute(route)) {
      // Another organization's object answers exactly as a missing one: 404, or the same
      // 415/422 a missing id gets for an empty body (the body is checked before the lookup).
      const theirs = await call(sessions.stranger.agent, method, fill(route, true));
      const missing = await call(sessions.stranger.agent, method, fill(route, false));
      expect(theirs.status, 'owner of another organization').toBe(missing.status);
      expect(theirs.body?.title).toBe(missing.body?.title);
      if (method === 'GET' || method === 'DELETE') expect(theirs.status).toBe(404);
    }
  });

  it('a member cannot raise their own role', async () => {
    const me = await db()('memberships as m').join('users as u', 'u.id', 'm.user_id').where('u.email', 'deployer@larkspur.example').first('m.id');
    const res = await sessions.deployer.agent.patch(`/api/v1/team/members/${me.id}`).set('origin', process.env.APP_URL!).send({ role: 'owner' });
    expect(res.status).toBe(403);
    const after = await db()('memberships').where({ id: me.id }).first('role');
    expect(after.role).toBe('deployer');
  });
});
