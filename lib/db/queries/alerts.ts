import type { Knex } from 'knex';
import type { AlertKind, AlertStatus } from '../../alerts/kinds';
import type { UnresolvedAlert } from '../../alerts/hysteresis';
import type { NodeState } from '../../config/node-states';
import type { DerivedStatus } from '../../status/derive-status';
import type { NodeRow, SiteRow } from '../../status/node-spec';
import { guardedStatusUpsert } from '../../ingest/status-upsert';

type Db = Knex | Knex.Transaction;

/** A live node with its site and its organization's policy, as the margin pass needs them. */
export interface PassNode {
  node: NodeRow;
  site: SiteRow & { name: string };
  org: { id: number; steady: number; thin: number; alertOnThin: boolean; resendShortHours: number };
  lastAdvisedIntervalSeconds: number | null;
}

export async function listPassNodes(knex: Db, opts: { orgIds?: number[] } = {}): Promise<PassNode[]> {
  const q = knex('nodes as n')
    .join('sites as s', 's.id', 'n.site_id')
    .join('organizations as o', 'o.id', 'n.org_id')
    .leftJoin('node_status as st', 'st.node_id', 'n.id')
    .whereNull('n.deleted_at')
    .select('n.*', 's.name as site_name', 's.lat', 's.lon', 's.time_zone', 's.recharge_elevation_deg',
      'o.steady_margin', 'o.thin_margin', 'o.alert_on_thin', 'o.resend_short_hours', 'st.next_report_s as advised_s')
    .orderBy('n.id');
  if (opts.orgIds) q.whereIn('n.org_id', opts.orgIds);
  const rows = await q;
  return rows.map((r) => ({
    node: r as NodeRow,
    site: { id: r.site_id, name: r.site_name, lat: r.lat, lon: r.lon, time_zone: r.time_zone, recharge_elevation_deg: r.recharge_elevation_deg },
    org: { id: r.org_id, steady: r.steady_margin, thin: r.thin_margin, alertOnThin: Boolean(r.alert_on_thin), resendShortHours: r.resend_short_hours },
    lastAdvisedIntervalSeconds: r.advised_s ?? null,
  }));
}

export interface ReadingRow {
  t: Date;
  v: number;
  vp: number | null;
}

/** The latest reading at or before `now` (a reading stamped in the future is not "latest" yet). */
export async function latestReadingAt(knex: Db, nodeId: number, now: Date): Promise<ReadingRow | null> {
  const row = await knex('readings').where('node_id', nodeId).andWhere('t', '<=', now).orderBy('t', 'desc').first('t', 'v', 'vp');
  return row ? { t: new Date(row.t), v: row.v, vp: row.vp } : null;
}

export async function readingsBetween(knex: Db, nodeId: number, from: Date, to: Date): Promise<ReadingRow[]> {
  const rows = await knex('readings').where('node_id', nodeId).andWhere('t', '>=', from).andWhere('t', '<=', to).orderBy('t').select('t', 'v', 'vp');
  return rows.map((r) => ({ t: new Date(r.t), v: r.v, vp: r.vp }));
}

export async function upsertNodeStatus(trx: Db, row: { nodeId: number; orgId: number; status: DerivedStatus; measuredWatts: number | null; modelledWatts: number | null }) {
  const values = { node_id: row.nodeId, org_id: row.orgId, ...row.status, measured_watts: row.measuredWatts, modelled_watts: row.modelledWatts };
  const { sql, bindings } = guardedStatusUpsert(values);
  await trx.raw(sql, bindings as never[]);
}

export interface AlertRow {
  id: number;
  org_id: number;
  node_id: number;
  kind: AlertKind;
  status: AlertStatus;
  detail: unknown;
  clear_passes: number;
  last_notified_at: Date | null;
}

/** The unresolved alert of a node and kind, locked for this transaction (open_key is unique). */
export async function lockUnresolvedAlert(trx: Knex.Transaction, nodeId: number, kind: AlertKind): Promise<(AlertRow & UnresolvedAlert) | null> {
  const row = await trx('alerts').where('open_key', `${nodeId}:${kind}`).forUpdate().first();
  if (!row) return null;
  return { ...row, clearPasses: row.clear_passes, lastNotifiedAt: row.last_notified_at ? new Date(row.last_notified_at) : null };
}

export async function insertAlert(trx: Knex.Transaction, row: { orgId: number; nodeId: number; kind: AlertKind; detail: unknown; now: Date }): Promise<number> {
  const [id] = await trx('alerts').insert({
    org_id: row.orgId, node_id: row.nodeId, kind: row.kind, status: 'open', detail: JSON.stringify(row.detail),
    clear_passes: 0, opened_at: row.now, updated_at: row.now, last_notified_at: row.now,
  });
  return id;
}

export async function updateAlert(
  trx: Knex.Transaction,
  id: number,
  changes: { detail?: unknown; clearPasses?: number; notifiedAt?: Date; resolvedAt?: Date; now: Date },
): Promise<void> {
  await trx('alerts').where({ id }).update({
    updated_at: changes.now,
    ...(changes.detail !== undefined ? { detail: JSON.stringify(changes.detail) } : {}),
    ...(changes.clearPasses !== undefined ? { clear_passes: changes.clearPasses } : {}),
    ...(changes.notifiedAt ? { last_notified_at: changes.notifiedAt } : {}),
    ...(changes.resolvedAt ? { status: 'resolved', resolved_at: changes.resolvedAt } : {}),
  });
}

// ---- the alerts page and API ----

export interface AlertFilters {
  alertId?: number;
  siteId?: number;
  nodeId?: number;
  kind?: AlertKind;
  status?: AlertStatus;
  nodeState?: NodeState;
  limit?: number;
}

function parseJson(value: unknown): unknown {
  if (typeof value !== 'string') return value;
  try {
    return JSON.parse(value);
  } catch {
    return null;
  }
}

/** Alerts of one organization, newest first, each with the state of its e-mails. */
export async function listAlerts(knex: Db, orgId: number, filters: AlertFilters = {}) {
  const q = knex('alerts as a')
    .join('nodes as n', 'n.id', 'a.node_id')
    .join('sites as s', 's.id', 'n.site_id')
    .leftJoin('users as u', 'u.id', 'a.acknowledged_by')
    .leftJoin('node_status as st', 'st.node_id', 'n.id')
    .where('a.org_id', orgId)
    .select('a.id', 'a.node_id', 'n.name as node_name', knex.raw("COALESCE(st.state, 'new') AS node_state"), 's.id as site_id', 's.name as site_name', 's.time_zone', 'a.kind', 'a.status', 'a.detail',
      'a.opened_at', 'a.updated_at', 'a.last_notified_at', 'a.acknowledged_at', 'u.name as acknowledged_by_name', 'a.resolved_at')
    .orderBy('a.opened_at', 'desc').orderBy('a.id', 'desc')
    .limit(filters.limit ?? 200);
  if (filters.alertId) q.andWhere('a.id', filters.alertId);
  if (filters.siteId) q.andWhere('s.id', filters.siteId);
  // Scoped by a.org_id above: another organization's node id matches nothing.
  if (filters.nodeId) q.andWhere('a.node_id', filters.nodeId);
  if (filters.kind) q.andWhere('a.kind', filters.kind);
  if (filters.status) q.andWhere('a.status', filters.status);
  if (filters.nodeState) q.andWhereRaw("COALESCE(st.state, 'new') = ?", [filters.nodeState]);
  const alerts = await q;
  const ids = alerts.map((a) => a.id);
  // Held mail is pending with a "held: …" note (lib/mail/sender.ts): counted apart, with when it goes.
  const mail = ids.length
    ? await knex('email_outbox').whereIn('alert_id', ids).groupBy('alert_id', 'status')
      .select('alert_id', 'status', knex.raw('COUNT(*) AS n'), knex.raw('MAX(last_error) AS last_error'),
        knex.raw("SUM(last_error LIKE 'held%') AS held"), knex.raw("MIN(CASE WHEN last_error LIKE 'held%' THEN next_attempt_at END) AS held_until"))
    : [];
  return alerts.map((a) => {
    const own = mail.filter((m) => m.alert_id === a.id);
    const count = (status: string) => Number(own.find((m) => m.status === status)?.n ?? 0);
    const pending = own.find((m) => m.status === 'pending');
    return {
      ...a,
      detail: parseJson(a.detail),
      mail: {
        pending: count('pending'), sent: count('sent'), dead: count('dead'),
        held: Number(pending?.held ?? 0), held_until: pending?.held_until ?? null,
        // A dead letter's error matters most; else a retry's (or the hold's note).
        last_error: own.find((m) => m.status === 'dead')?.last_error ?? pending?.last_error ?? null,
      },
    };
  });
}

/** Acknowledging stops reminders; the alert still resolves by itself when the condition clears. */
export async function acknowledgeAlert(knex: Knex, opts: { orgId: number; alertId: number; userId: number; now?: Date }) {
  return knex.transaction(async (trx) => {
    const row = await trx('alerts').where({ id: opts.alertId, org_id: opts.orgId }).forUpdate().first('id', 'status', 'kind', 'node_id');
    if (!row) return { found: false as const };
    if (row.status === 'open') {
      const at = opts.now ?? new Date();
      await trx('alerts').where({ id: row.id }).update({ status: 'acknowledged', acknowledged_at: at, acknowledged_by: opts.userId, updated_at: at });
      await trx('audit_log').insert({ org_id: opts.orgId, user_id: opts.userId, action: 'alert_acknowledged', target: `alert ${row.id}`, detail: JSON.stringify({ kind: row.kind, node_id: row.node_id }) });
    }
    return { found: true as const, previous: row.status as AlertStatus };
  });
}

/** The organization's outbox without bodies (invitation and reset bodies carry one-time links). */
export async function listOutbox(knex: Db, orgId: number, opts: { status?: 'pending' | 'sent' | 'dead'; limit?: number } = {}) {
  const q = knex('email_outbox').where('org_id', orgId)
    .select('id', 'alert_id', 'purpose', 'to_address', 'subject', 'status', 'attempts', 'next_attempt_at', 'last_error', 'created_at', 'sent_at')
    .orderBy('id', 'desc').limit(opts.limit ?? 200);
  if (opts.status) q.andWhere('status', opts.status);
  const rows = await q;
  return rows.map((r) => ({ ...r, held: r.status === 'pending' && typeof r.last_error === 'string' && r.last_error.startsWith('held') }));
}
