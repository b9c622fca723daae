import type { Knex } from 'knex';
import { db } from '../knex';
import { problems } from '../../errors';
import type { NodeBody } from '../../schemas/node';
import type { NodeRow, SiteRow } from '../../status/node-spec';

/** Another organization's node is "not found", exactly like a missing one. */
export async function getNodeInOrg(orgId: number, nodeId: number, trx: Knex | Knex.Transaction = db()): Promise<NodeRow & { site_name: string; time_zone: string; purpose: string; panel_watts: number | null }> {
  const row = await trx('nodes as n').join('sites as s', 's.id', 'n.site_id')
    .where({ 'n.id': nodeId, 'n.org_id': orgId }).whereNull('n.deleted_at')
    .first('n.*', 's.name as site_name', 's.time_zone');
  if (!row) throw problems.notFound('The node');
  return row;
}

export async function getSiteInOrg(orgId: number, siteId: number, trx: Knex | Knex.Transaction = db()): Promise<SiteRow & { name: string; org_id: number }> {
  const row = await trx('sites').where({ id: siteId, org_id: orgId }).first();
  if (!row) throw problems.notFound('The site');
  return row;
}

function columnsFromBody(body: NodeBody) {
  return {
    name: body.name, site_id: body.site_id, purpose: body.purpose,
    cells_series: body.bank.cells_series, cells_parallel: body.bank.cells_parallel, cell_farads: body.bank.cell_farads,
    cell_rated_volts: body.bank.cell_rated_volts, cell_esr_ohms: body.bank.cell_esr_ohms, cell_leakage_amps: body.bank.cell_leakage_amps,
    start_volts: body.converter.start_volts, cutoff_volts: body.converter.cutoff_volts, output_volts: body.converter.output_volts,
    efficiency: JSON.stringify(body.converter.efficiency), input_limit_amps: body.converter.input_limit_amps,
    sleep_amps: body.load.sleep_amps, awake_seconds: body.load.awake_seconds, awake_amps: body.load.awake_amps,
    burst_seconds: body.load.burst_seconds, burst_amps: body.load.burst_amps, interval_seconds: body.load.interval_seconds,
    max_interval_seconds: body.load.max_interval_seconds, cal_gain: body.calibration.gain, cal_offset_volts: body.calibration.offset_volts,
    panel_watts: body.panel_watts,
  };
}

async function assertNameFree(trx: Knex.Transaction, orgId: number, name: string, exceptId?: number) {
  const q = trx('nodes').where({ org_id: orgId, name });
  if (exceptId) q.whereNot({ id: exceptId });
  if (await q.first('id')) throw problems.invalid([{ pointer: '/name', detail: 'Another node already has this name.' }]);
}

export async function createNode(orgId: number, body: NodeBody): Promise<number> {
  return db().transaction(async (trx) => {
    await getSiteInOrg(orgId, body.site_id, trx).catch(() => {
      throw problems.invalid([{ pointer: '/site_id', detail: 'Choose one of your sites.' }]);
    });
    await assertNameFree(trx, orgId, body.name);
    const [id] = await trx('nodes').insert({ org_id: orgId, ...columnsFromBody(body) });
    await trx('node_status').insert({ node_id: id, org_id: orgId, state: 'new' });
    return id;
  });
}

export async function updateNode(orgId: number, nodeId: number, body: NodeBody): Promise<void> {
  await db().transaction(async (trx) => {
    await getNodeInOrg(orgId, nodeId, trx);
    await getSiteInOrg(orgId, body.site_id, trx).catch(() => {
      throw problems.invalid([{ pointer: '/site_id', detail: 'Choose one of your sites.' }]);
    });
    await assertNameFree(trx, orgId, body.name, nodeId);
    await trx('nodes').where({ id: nodeId, org_id: orgId }).update({ ...columnsFromBody(body), updated_at: new Date() });
  });
}

/** Soft delete: readings stay for the record; its credentials stop working at once. */
export async function deleteNode(orgId: number, nodeId: number): Promise<void> {
  await db().transaction(async (trx) => {
    await getNodeInOrg(orgId, nodeId, trx);
    // The name is freed for a replacement node; the old one keeps a unique, dated name.
    await trx('nodes').where({ id: nodeId, org_id: orgId }).update({ deleted_at: new Date(), name: trx.raw("CONCAT(LEFT(name, 90), ' (deleted ', id, ')')") });
    await trx('device_credentials').where({ node_id: nodeId }).whereNull('revoked_at').update({ revoked_at: new Date() });
    // A retired node's alerts end with it: no pass looks at it again to resolve them, and
    // its mail still waiting would warn about a node nobody runs.
    const now = new Date();
    const unresolved = await trx('alerts').where({ node_id: nodeId }).whereNot('status', 'resolved').pluck('id');
    if (unresolved.length > 0) {
      await trx('alerts').whereIn('id', unresolved).update({ status: 'resolved', resolved_at: now, updated_at: now });
      await trx('email_outbox').whereIn('alert_id', unresolved).where('status', 'pending').update({ status: 'dead', last_error: 'node retired' });
    }
  });
}

export function nodeToWire(row: NodeRow & { site_name?: string; purpose?: string; panel_watts?: number | null }) {
  return {
    id: row.id, name: row.name, site_id: row.site_id, site_name: row.site_name, purpose: row.purpose ?? '',
    bank: { cells_series: row.cells_series, cells_parallel: row.cells_parallel, cell_farads: row.cell_farads, cell_rated_volts: row.cell_rated_volts, cell_esr_ohms: row.cell_esr_ohms, cell_leakage_amps: row.cell_leakage_amps },
    converter: { start_volts: row.start_volts, cutoff_volts: row.cutoff_volts, output_volts: row.output_volts, efficiency: typeof row.efficiency === 'string' ? JSON.parse(row.efficiency) : row.efficiency, input_limit_amps: row.input_limit_amps },
    load: { sleep_amps: row.sleep_amps, awake_seconds: row.awake_seconds, awake_amps: row.awake_amps, burst_seconds: row.burst_seconds, burst_amps: row.burst_amps, interval_seconds: row.interval_seconds, max_interval_seconds: row.max_interval_seconds },
    calibration: { gain: row.cal_gain, offset_volts: row.cal_offset_volts },
    panel_watts: row.panel_watts ?? null,
  };
}
