import { verifyDeviceToken } from '../auth/device-token';
import { db } from '../db/knex';
import { requireSecret } from '../env';
import { ProblemError } from '../errors';
import type { NodeRow, SiteRow } from '../status/node-spec';

/**
 * The node comes from the token, never from the body. A token must be one we signed (HS256
 * only), its credential must exist and not be revoked, and its node must still exist: checked
 * on every request, so a revocation takes effect on the next one.
 */
function unauthorized(detail: string) {
  return new ProblemError(401, 'Device not authenticated', detail, { headers: { 'www-authenticate': 'Bearer realm="duskwatch-ingest"' } });
}

const lastTouched = new Map<string, number>();

export interface DeviceContext {
  nodeId: number;
  orgId: number;
  credentialId: string;
  /** Everything the status update needs, read in the same query as the credential check. */
  node: NodeRow;
  site: SiteRow;
  thresholds: { steady: number; thin: number };
  lastReadingAt: Date | null;
  state: string | null;
  nextReportSeconds: number | null;
}

export async function authenticateDevice(request: Request): Promise<DeviceContext> {
  const header = request.headers.get('authorization') ?? '';
  const match = /^Bearer\s+([A-Za-z0-9_\-.]+)\s*$/.exec(header);
  if (!match) throw unauthorized('Send Authorization: Bearer <device token>.');
  const claims = await verifyDeviceToken({ secret: requireSecret('DEVICE_TOKEN_SECRET'), token: match[1] });
  if (!claims) throw unauthorized('The device token is not valid.');
  const row = await db()('device_credentials as c')
    .join('nodes as n', 'n.id', 'c.node_id')
    .join('sites as s', 's.id', 'n.site_id')
    .join('organizations as o', 'o.id', 'n.org_id')
    .leftJoin('node_status as st', 'st.node_id', 'n.id')
    .where({ 'c.credential_id': claims.credentialId, 'c.node_id': claims.nodeId })
    .whereNull('c.revoked_at')
    .whereNull('n.deleted_at')
    .first('n.*', 'c.id as credential_row_id', 's.lat', 's.lon', 's.time_zone', 's.recharge_elevation_deg', 'o.steady_margin', 'o.thin_margin',
      'st.last_reading_at', 'st.state', 'st.next_report_s');
  if (!row) throw unauthorized('The device token was revoked or its node no longer exists.');
  touchCredential(row.credential_row_id, claims.credentialId);
  return {
    nodeId: claims.nodeId,
    orgId: row.org_id,
    credentialId: claims.credentialId,
    node: row as NodeRow,
    site: { id: row.site_id, lat: row.lat, lon: row.lon, time_zone: row.time_zone, recharge_elevation_deg: row.recharge_elevation_deg },
    thresholds: { steady: row.steady_margin, thin: row.thin_margin },
    lastReadingAt: row.last_reading_at ? new Date(row.last_reading_at) : null,
    state: row.state ?? null,
    nextReportSeconds: row.next_report_s ?? null,
  };
}

// last_used_at is kept to the minute: one write per credential per minute, not per post.
function touchCredential(id: number, credentialId: string) {
  const now = Date.now();
  if ((lastTouched.get(credentialId) ?? 0) > now - 60_000) return;
  lastTouched.set(credentialId, now);
  db()('device_credentials').where({ id }).update({ last_used_at: new Date(now) }).catch(() => lastTouched.delete(credentialId));
}
