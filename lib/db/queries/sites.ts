import type { Knex } from 'knex';
import { db } from '../knex';
import { problems } from '../../errors';
import type { SiteBody, SiteWire } from '../../schemas/site';
import type { NodeState } from '../../config/node-states';
import { compareRisk } from './fleet';
import { getSiteInOrg } from './nodes';

/** Sites of an organization. Another organization's site is "not found", like a missing one. */
const liveNodes = (k: Knex) => k.raw('(SELECT COUNT(*) FROM nodes n WHERE n.site_id = s.id AND n.deleted_at IS NULL) AS live_nodes');

function siteToWire(row: Record<string, unknown>): SiteWire {
  return {
    id: Number(row.id), name: String(row.name), lat: Number(row.lat), lon: Number(row.lon), time_zone: String(row.time_zone),
    recharge_elevation_deg: Number(row.recharge_elevation_deg), notes: (row.notes as string | null) ?? '', live_nodes: Number(row.live_nodes ?? 0),
  };
}

export async function listSites(orgId: number): Promise<SiteWire[]> {
  const rows = await db()('sites as s').where('s.org_id', orgId).orderBy('s.name').select('s.*', liveNodes(db()));
  return rows.map(siteToWire);
}

export async function getSiteWire(orgId: number, siteId: number): Promise<SiteWire> {
  const row = await db()('sites as s').where({ 's.id': siteId, 's.org_id': orgId }).first('s.*', liveNodes(db()));
  if (!row) throw problems.notFound('The site');
  return siteToWire(row);
}

/** A live node of a site as the site page lists it: its state and its latest reading. */
export interface SiteLiveNode {
  id: number;
  name: string;
  purpose: string;
  state: NodeState;
  margin: number | null;
  /** Calibrated bank volts at the last reading (null before the first). */
  volts: number | null;
  /** The bank's rated maximum, ns·Vr, for the over-voltage caution. */
  max_volts: number;
  last_reading_at: string | null;
}

/** The site's live (not retired) nodes with their status, most at risk first as on the fleet page. */
export async function listLiveNodes(orgId: number, siteId: number): Promise<SiteLiveNode[]> {
  const rows = await db()('nodes as n')
    .leftJoin('node_status as st', 'st.node_id', 'n.id')
    .where({ 'n.org_id': orgId, 'n.site_id': siteId })
    .whereNull('n.deleted_at')
    .select('n.id', 'n.name', 'n.purpose', 'n.cells_series', 'n.cell_rated_volts', 'st.state', 'st.margin', 'st.volts', 'st.last_reading_at');
  return rows
    .map((r) => ({
      id: Number(r.id),
      name: String(r.name),
      purpose: (r.purpose as string | null) ?? '',
      state: (r.state ?? 'new') as NodeState,
      margin: r.margin == null ? null : Number(r.margin),
      volts: r.volts == null ? null : Number(r.volts),
      max_volts: Number(r.cells_series) * Number(r.cell_rated_volts),
      last_reading_at: r.last_reading_at ? new Date(r.last_reading_at).toISOString() : null,
    }))
    .sort(compareRisk);
}

/**
 * The site's retired nodes, kept on record (their readings stay; the site cannot be deleted
 * while it holds them): the name they had, when they were retired, their last reading.
 */
export async function listRetiredNodes(orgId: number, siteId: number) {
  const rows = await db()('nodes as n')
    .where({ 'n.org_id': orgId, 'n.site_id': siteId })
    .whereNotNull('n.deleted_at')
    .orderBy('n.deleted_at', 'desc')
    .select('n.id', 'n.name', 'n.purpose', 'n.deleted_at',
      db().raw('(SELECT MIN(r.t) FROM readings r WHERE r.node_id = n.id) AS first_reading_at'),
      db().raw('(SELECT MAX(r.t) FROM readings r WHERE r.node_id = n.id) AS last_reading_at'));
  return rows.map((r) => ({
    id: r.id as number,
    name: retiredName(String(r.name)),
    purpose: (r.purpose as string | null) ?? '',
    retired_at: new Date(r.deleted_at).toISOString(),
    first_reading_at: r.first_reading_at ? new Date(r.first_reading_at).toISOString() : null,
    last_reading_at: r.last_reading_at ? new Date(r.last_reading_at).toISOString() : null,
  }));
}

/** deleteNode frees a retired node's name by appending " (deleted <id>)"; the record shows the name it had. */
export function retiredName(name: string): string {
  return name.replace(/ \(deleted \d+\)$/, '');
}

async function assertNameFree(trx: Knex.Transaction, orgId: number, name: string, exceptId?: number) {
  const q = trx('sites').where({ org_id: orgId, name });
  if (exceptId) q.whereNot({ id: exceptId });
  if (await q.first('id')) throw problems.invalid([{ pointer: '/name', detail: 'Another site already has this name.' }]);
}

const columns = (body: SiteBody) => ({
  name: body.name, lat: body.lat, lon: body.lon, time_zone: body.time_zone, recharge_elevation_deg: body.recharge_elevation_deg, notes: body.notes || null,
});

export async function createSite(orgId: number, body: SiteBody): Promise<number> {
  return db().transaction(async (trx) => {
    await assertNameFree(trx, orgId, body.name);
    const [id] = await trx('sites').insert({ org_id: orgId, ...columns(body) });
    return id as number;
  });
}

export async function updateSite(orgId: number, siteId: number, body: SiteBody): Promise<void> {
  await db().transaction(async (trx) => {
    await getSiteInOrg(orgId, siteId, trx);
    await assertNameFree(trx, orgId, body.name, siteId);
    await trx('sites').where({ id: siteId, org_id: orgId }).update(columns(body));
  });
}

/**
 * A site goes only when no node stands on it. Deleted nodes keep their readings for the
 * record and still point at the site (the foreign key restricts), so they block it too.
 */
export async function deleteSite(orgId: number, siteId: number): Promise<void> {
  await db().transaction(async (trx) => {
    await trx('sites').where({ id: siteId, org_id: orgId }).forUpdate().first('id').then((row) => {
      if (!row) throw problems.notFound('The site');
    });
    const counts = await trx('nodes').where({ site_id: siteId }).select(trx.raw('SUM(deleted_at IS NULL) AS live, COUNT(*) AS total')).first();
    const live = Number(counts?.live ?? 0);
    if (live > 0) throw problems.conflict(`The site still has ${live} node${live === 1 ? '' : 's'}: move or delete ${live === 1 ? 'it' : 'them'} first.`);
    if (Number(counts?.total ?? 0) > 0) throw problems.conflict('The site keeps the records of deleted nodes, so it stays; rename it if it is no longer used.');
    await trx('sites').where({ id: siteId, org_id: orgId }).delete();
  });
}
