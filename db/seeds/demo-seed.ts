import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import bcrypt from 'bcryptjs';
import type { Knex } from 'knex';
import { signDeviceToken, newCredentialId } from '../../lib/auth/device-token';
import { deriveNodeStatus } from '../../lib/status/derive-status';
import { calibratedVolts, modelSpecFromRows, type NodeRow, type SiteRow } from '../../lib/status/node-spec';
import { demoModelRow, productMarginOf } from './demo-status';
import {
  chosenCadences, demoNodes, demoOrganizations, demoSites, generateDemoHistory, secondDemoNodes, secondDemoSites, type DemoNode,
} from '../../simulator/fleet/demo-fleet';
import { loadSecrets, type Profile } from '../lifecycle/profile';
import { rootKnex } from '../lifecycle/stack';
import { rebuildRollups } from '../../lib/db/queries/rollups';

/**
 * The demo seed (DESIGN.md §8): two invented organizations, their sites and nodes, demo
 * sign-ins for each role, and 14 days of readings produced by the simulator's physics.
 * Demo-only passwords; they exist nowhere but here and in the README.
 */
export const DEMO_PASSWORD = 'duskwatch-demo';
export const DEMO_USERS = [
  { email: 'owner@larkspur.example', name: 'Ada Demo-Owner', org: 'larkspur-hollow', role: 'owner' },
  { email: 'deployer@larkspur.example', name: 'Bo Demo-Deployer', org: 'larkspur-hollow', role: 'deployer' },
  { email: 'viewer@larkspur.example', name: 'Cy Demo-Viewer', org: 'larkspur-hollow', role: 'viewer' },
  { email: 'owner@cinderflats.example', name: 'Di Demo-Owner', org: 'cinder-flats', role: 'owner' },
] as const;
const HISTORY_SEED = 1; // the seed the demo fleet was tuned with (simulator/fleet)

export async function seedDemoIfEmpty(profile: Profile, now = new Date()): Promise<void> {
  const knex = rootKnex(profile);
  try {
    const [{ n }] = await knex('organizations').count({ n: '*' });
    if (Number(n) > 0) {
      console.log('[seed] demo data already present');
      return;
    }
    console.log('[seed] generating 14 days of demo history from the simulator physics…');
    const history = generateDemoHistory({ now, days: 14, seed: HISTORY_SEED, marginOf: productMarginOf });
    const tokens: Record<string, string> = {};
    const slugs: Record<string, string> = {};
    await knex.transaction(async (trx) => {
      const orgIds = await insertOrganizations(trx);
      await insertUsers(trx, orgIds);
      const siteIds = await insertSites(trx, orgIds);
      const secret = loadSecrets(profile).deviceTokenSecret;
      for (const listed of [...demoNodes, ...secondDemoNodes]) {
        // The node as this run configured it (a tuned cadence, see DemoNode.cadenceFor).
        const { demo, readings } = history[listed.slug];
        const nodeId = await insertNode(trx, demo, orgIds, siteIds);
        await insertReadings(trx, nodeId, readings);
        await rebuildRollups(trx, nodeId);
        await writeStatus(trx, nodeId, now);
        const credentialId = newCredentialId();
        await trx('device_credentials').insert({ org_id: orgIds[demo.organizationSlug], node_id: nodeId, credential_id: credentialId, label: 'demo simulator' });
        tokens[nodeId] = await signDeviceToken({ secret, nodeId, credentialId });
        slugs[nodeId] = demo.slug;
      }
    });
    mkdirSync(profile.dataDir, { recursive: true });
    writeFileSync(path.join(profile.dataDir, 'device-tokens.json'), JSON.stringify(tokens, null, 2), { mode: 0o600 });
    writeFileSync(path.join(profile.dataDir, 'demo-fleet.json'), JSON.stringify({ now: now.toISOString(), seed: HISTORY_SEED, cadences: chosenCadences(history), slugs }, null, 2));
    console.log(`[seed] done: ${Object.keys(tokens).length} nodes; device tokens in ${path.join(profile.dataDir, 'device-tokens.json')}`);
  } finally {
    await knex.destroy();
  }
}

async function insertOrganizations(trx: Knex.Transaction): Promise<Record<string, number>> {
  const ids: Record<string, number> = {};
  for (const org of demoOrganizations) [ids[org.slug]] = await trx('organizations').insert({ name: org.name, slug: org.slug });
  return ids;
}

async function insertUsers(trx: Knex.Transaction, orgIds: Record<string, number>): Promise<void> {
  const hash = await bcrypt.hash(DEMO_PASSWORD, 11);
  for (const u of DEMO_USERS) {
    const [userId] = await trx('users').insert({ email: u.email, name: u.name, password_hash: hash });
    await trx('memberships').insert({ org_id: orgIds[u.org], user_id: userId, role: u.role });
  }
}

async function insertSites(trx: Knex.Transaction, orgIds: Record<string, number>): Promise<Record<string, number>> {
  const ids: Record<string, number> = {};
  for (const s of [...demoSites, ...secondDemoSites]) {
    [ids[s.slug]] = await trx('sites').insert({
      org_id: orgIds[s.organizationSlug], name: s.name, lat: s.latDeg, lon: s.lonDeg, time_zone: s.timeZone,
      recharge_elevation_deg: s.rechargeElevationDeg, notes: s.description,
    });
  }
  return ids;
}

async function insertNode(trx: Knex.Transaction, demo: DemoNode, orgIds: Record<string, number>, siteIds: Record<string, number>): Promise<number> {
  const [id] = await trx('nodes').insert({
    org_id: orgIds[demo.organizationSlug], site_id: siteIds[demo.siteSlug], name: demo.name, purpose: demo.kind,
    ...demoModelRow(demo), panel_watts: demo.config.panel.ratedWatts,
  });
  return id;
}

async function insertReadings(trx: Knex.Transaction, nodeId: number, readings: { t: Date; v: number; vp: number; temp: number; rssi: number; seq: number }[]) {
  const rows = readings.map((r) => ({ node_id: nodeId, t: r.t, v: r.v, vp: r.vp, temp_c: r.temp, rssi_dbm: r.rssi, seq: r.seq }));
  for (let i = 0; i < rows.length; i += 1000) await trx('readings').insert(rows.slice(i, i + 1000));
}

async function writeStatus(trx: Knex.Transaction, nodeId: number, now: Date): Promise<void> {
  const node = (await trx('nodes').where({ id: nodeId }).first()) as NodeRow;
  const site = (await trx('sites').where({ id: node.site_id }).first()) as SiteRow;
  const org = await trx('organizations').where({ id: node.org_id }).first('steady_margin', 'thin_margin');
  const last = await trx('readings').where({ node_id: nodeId }).orderBy('t', 'desc').first('t', 'v', 'vp');
  const status = deriveNodeStatus({
    spec: modelSpecFromRows(node, site),
    latest: last ? { t: new Date(last.t), volts: calibratedVolts(node, last.v), panelVolts: last.vp } : null,
    now,
    thresholds: { steady: org.steady_margin, thin: org.thin_margin },
  });
  await trx('node_status').insert({ node_id: nodeId, org_id: node.org_id, ...status });
}
