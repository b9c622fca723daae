import type { Knex } from 'knex';
import { drawScaleFrom } from '../../energy';
import { db } from '../knex';
import { deriveNodeStatus, type DerivedStatus } from '../../status/derive-status';
import { calibratedVolts, modelSpecFromRows, type NodeRow, type SiteRow } from '../../status/node-spec';
import { guardedStatusUpsert } from '../../ingest/status-upsert';
import { latestReading } from './readings';
import { measureNightOf } from '../../alerts/night-draw-of';

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

/**
 * Recomputes and stores a node's latest status from its latest reading. With `remeasure` (after
 * its settings or site change) the latest night's draw is measured again, as the margin pass
 * does, so its modelled draw, the ratio of the two and the draw scale follow the new settings
 * at once instead of at the next pass.
 */
export async function refreshNodeStatus(
  nodeId: number,
  now = new Date(),
  knex: Knex | Knex.Transaction = db(),
  { remeasure = false }: { remeasure?: boolean } = {},
): Promise<DerivedStatus | null> {
  const loaded = await loadNodeForModel(nodeId, knex);
  if (!loaded) return null;
  const spec = modelSpecFromRows(loaded.node, loaded.site);
  const last = await latestReading(nodeId, knex);
  const night = remeasure ? await measureNightOf({ knex, node: loaded.node, spec, now }) : undefined;
  const status = deriveNodeStatus({
    spec,
    latest: last ? { t: new Date(last.t), volts: calibratedVolts(loaded.node, last.v), panelVolts: last.vp } : null,
    now,
    thresholds: loaded.thresholds,
    // As the ingest does: the last measured night's excess draw, until the next pass measures again.
    drawScale: night === undefined ? loaded.drawScale : drawScaleFrom({ measuredWatts: night?.measuredWatts, modelledWatts: night?.modelledWatts }),
  });
  const draw = night === undefined ? {} : { measured_watts: night?.measuredWatts ?? null, modelled_watts: night?.modelledWatts ?? null };
  // Guarded like the ingest's write: a reading stored meanwhile keeps its own, newer status.
  const { sql, bindings } = guardedStatusUpsert({ node_id: nodeId, org_id: loaded.node.org_id, ...status, ...draw });
  await knex.raw(sql, bindings as never[]);
  return status;
}

/**
 * After a node's settings or its site change: the status is recomputed at once from the latest
 * reading with the new bank, converter, load or sun, and last night's draw is measured again
 * against them, so the fleet never shows a state, charge, margin or draw ratio worked out for
 * settings the node no longer has (until its next report or pass).
 */
export async function refreshStatusOfNodes(nodeIds: number[], now = new Date()): Promise<void> {
  for (const nodeId of nodeIds) await refreshNodeStatus(nodeId, now, db(), { remeasure: true });
}

export async function nodeIdsOfSite(orgId: number, siteId: number, knex: Knex | Knex.Transaction = db()): Promise<number[]> {
  return knex('nodes').where({ org_id: orgId, site_id: siteId }).whereNull('deleted_at').orderBy('id').pluck('id');
}
