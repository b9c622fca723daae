import bcrypt from 'bcryptjs';
import type { Knex } from 'knex';
import { newCredentialId, signDeviceToken } from '@/lib/auth/device-token';

/** A benchmark organization: 1000 nodes with tokens, and an owner to sign in as. */
export const BENCH_OWNER = { email: 'owner@bench.example', password: 'bench-only-password' };

export async function createBenchFleet(knex: Knex, opts: { nodes: number; secret: string }) {
  const [orgId] = await knex('organizations').insert({ name: 'Benchmark Fleet', slug: `bench-${Date.now()}` });
  const [userId] = await knex('users').insert({ email: BENCH_OWNER.email, name: 'Bench Owner', password_hash: await bcrypt.hash(BENCH_OWNER.password, 10) });
  await knex('memberships').insert({ org_id: orgId, user_id: userId, role: 'owner' });
  const [siteId] = await knex('sites').insert({ org_id: orgId, name: 'Bench site', lat: 47.1, lon: -120.5, time_zone: 'America/Los_Angeles', recharge_elevation_deg: 3 });
  const template = await knex('nodes').orderBy('id').first();
  const { id: _id, org_id: _o, site_id: _s, name: _n, created_at: _c, updated_at: _u, ...spec } = template;
  const efficiency = typeof spec.efficiency === 'string' ? spec.efficiency : JSON.stringify(spec.efficiency);
  const rows = Array.from({ length: opts.nodes }, (_, i) => ({ ...spec, efficiency, org_id: orgId, site_id: siteId, name: `bench-${String(i).padStart(4, '0')}` }));
  for (let i = 0; i < rows.length; i += 200) await knex('nodes').insert(rows.slice(i, i + 200));
  const nodeIds: number[] = await knex('nodes').where({ org_id: orgId }).orderBy('id').pluck('id');
  const tokens: string[] = [];
  const creds = [];
  for (const nodeId of nodeIds) {
    const credentialId = newCredentialId();
    creds.push({ org_id: orgId, node_id: nodeId, credential_id: credentialId, label: 'bench' });
    tokens.push(await signDeviceToken({ secret: opts.secret, nodeId, credentialId }));
  }
  for (let i = 0; i < creds.length; i += 500) await knex('device_credentials').insert(creds.slice(i, i + 500));
  await knex('node_status').insert(nodeIds.map((node_id) => ({ node_id, org_id: orgId, state: 'new' })));
  return { orgId, siteId, nodeIds, tokens };
}
