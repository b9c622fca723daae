import type { Knex } from 'knex';
import { drawScaleFrom } from '../../energy';
import { db } from '../knex';
import { deriveNodeStatus, type DerivedStatus } from '../../status/derive-status';
import { calibratedVolts, modelSpecFromRows, type NodeRow, type SiteRow } from '../../status/node-spec';
import { guardedStatusUpsert } from '../../ingest/status-upsert';
import { latestReading } from './readings';

/**
 * Loads what the model needs for one node: its row, its site, its organization's thresholds,
 * and the draw scale from the night the last margin pass measured (drawScaleFrom).
 */
export async function loadNodeForModel(nodeId: number, knex: Knex | Knex.Transaction = db()) {
  const row = await knex('nodes as n')
    .join('sites as s', 's.id', 'n.site_id')
    .join('organizations as o', 'o.id', 'n.org_id')
    .leftJoin('node_status as st', 'st.node_id', 'n.id')
    .where('n.id', nodeId)
    .first('n.*', 's.lat', 's.lon', 's.time_zone', 's.recharge_elevation_deg', 'o.steady_margin', 'o.thin_margin', 'st.measured_watts', 'st.modelled_watts');
  if (!row) return null;
  const site: SiteRow = { id: row.site_id, lat: row.lat, lon: row.lon, time_zone: row.time_zone, recharge_elevation_deg: row.recharge_elevation_deg };
  return {
    node: row as NodeRow,
    site,
    thresholds: { steady: row.steady_margin as number, thin: row.thin_margin as number },
    drawScale: drawScaleFrom({ measuredWatts: row.measured_watts, modelledWatts: row.modelled_watts }),
  };
}

/** Recomputes and stores a node's latest status from its latest reading. */
export async function refreshNodeStatus(nodeId: number, now = new Date(), knex: Knex | Knex.Transaction = db()): Promise<DerivedStatus | null> {
  const loaded = await loadNodeForModel(nodeId, knex);
  if (!loaded) return null;
  const last = await latestReading(nodeId, knex);
  const status = deriveNodeStatus({
    spec: modelSpecFromRows(loaded.node, loaded.site),
    latest: last ? { t: new Date(last.t), volts: calibratedVolts(loaded.node, last.v), panelVolts: last.vp } : null,
    now,
    thresholds: loaded.thresholds,
    // As the ingest does: the last measured night's excess draw, until the next pass measures again.
    drawScale: loaded.drawScale,
  });
  // Guarded like the ingest's write: a reading stored meanwhile keeps its own, newer status.
  const { sql, bindings } = guardedStatusUpsert({ node_id: nodeId, org_id: loaded.node.org_id, ...status });
  await knex.raw(sql, bindings as never[]);
  return status;
}

/**
 * After a node's settings or its site change: the status is recomputed at once from the latest
 * reading with the new bank, converter, load or sun, so the fleet never shows a state, charge
 * or margin worked out for settings the node no longer has (until its next report).
 */
export async function refreshStatusOfNodes(nodeIds: number[], now = new Date()): Promise<void> {
  for (const nodeId of nodeIds) await refreshNodeStatus(nodeId, now);
}

export async function nodeIdsOfSite(orgId: number, siteId: number, knex: Knex | Knex.Transaction = db()): Promise<number[]> {
  return knex('nodes').where({ org_id: orgId, site_id: siteId }).whereNull('deleted_at').orderBy('id').pluck('id');
}
