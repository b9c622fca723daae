import mysql from 'mysql2';
import { verifyDeviceToken } from '../auth/device-token';
import type { IngestRequest } from './body';
import { fastPool } from '../db/fast-pool';
import { Coalescer } from './coalesce';
import { db } from '../db/knex';
import { requireSecret } from '../env';
import { ProblemError } from '../errors';
import type { NodeRow, SiteRow } from '../status/node-spec';
import { drawScaleFrom } from '../energy/evaluate';

/**
 * The node comes from the token, never from the body. A token must be one we signed (HS256
 * only), its credential must exist and not be revoked, and its node must still exist: checked
 * on every request, so a revocation takes effect on the next one.
 */
function unauthorized(detail: string) {
  return new ProblemError(401, 'Device not authenticated', detail, { headers: { 'www-authenticate': 'Bearer realm="duskwatch-ingest"' } });
}

type Lookup = { credentialId: string; nodeId: number };

// Lookups that arrive while others are out go together in the next query (lib/ingest/coalesce.ts).
const contexts = new Coalescer<Lookup, ContextRow | undefined>(loadContexts, { maxInFlight: 8, maxWeight: 200 });

async function loadContexts(lookups: Lookup[]): Promise<(ContextRow | undefined)[]> {
  // The credential ids are escaped one by one into the statement's tail, rather than mysql2
  // scanning the whole long statement for its placeholder on every post.
  const ids = [...new Set(lookups.map((l) => l.credentialId))].map((id) => mysql.escape(id)).join(', ');
  const [rows] = await fastPool().query(`${CONTEXT_SQL} WHERE c.credential_id IN (${ids}) ${CONTEXT_WHERE}`);
  const byCredential = new Map((rows as ContextRow[]).map((row) => [row.credential_key, row]));
  return lookups.map(({ credentialId, nodeId }) => {
    const row = byCredential.get(credentialId);
    return row && row.id === nodeId ? row : undefined;
  });
}

const lastTouched = new Map<string, number>();

// One statement on the ingest pool for all the posts that arrived together (plain SQL: this
// runs for every post, and building it with the query builder each time was a measurable part
// of the route's CPU). Each post's credential must also belong to the node its token names.
const CONTEXT_SQL = `SELECT n.*, c.id AS credential_row_id, c.credential_id AS credential_key, s.lat, s.lon, s.time_zone, s.recharge_elevation_deg,
    o.steady_margin, o.thin_margin, st.last_reading_at, st.state, st.next_report_s, st.measured_watts, st.modelled_watts
  FROM device_credentials c
  JOIN nodes n ON n.id = c.node_id
  JOIN sites s ON s.id = n.site_id
  JOIN organizations o ON o.id = n.org_id
  LEFT JOIN node_status st ON st.node_id = n.id`;
const CONTEXT_WHERE = 'AND c.revoked_at IS NULL AND n.deleted_at IS NULL';

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
  /** The measured ÷ modelled draw the margin pass last found (drawScaleFrom), for the projection. */
  drawScale: number;
}

type ContextRow = NodeRow & Omit<SiteRow, 'id'> & {
  credential_row_id: number; credential_key: string; steady_margin: number; thin_margin: number;
  last_reading_at: Date | null; state: string | null; next_report_s: number | null;
  measured_watts: number | null; modelled_watts: number | null;
};

export async function authenticateDevice(request: IngestRequest): Promise<DeviceContext> {
  const header = request.headers.get('authorization') ?? '';
  const match = /^Bearer\s+([A-Za-z0-9_\-.]+)\s*$/.exec(header);
  if (!match) throw unauthorized('Send Authorization: Bearer <device token>.');
  const claims = await verifyDeviceToken({ secret: requireSecret('DEVICE_TOKEN_SECRET'), token: match[1] });
  if (!claims) throw unauthorized('The device token is not valid.');
  const row = await contexts.submit({ credentialId: claims.credentialId, nodeId: claims.nodeId });
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
    drawScale: drawScaleFrom({ measuredWatts: row.measured_watts, modelledWatts: row.modelled_watts }),
  };
}

// last_used_at is kept to the minute: one write per credential per minute, not per post.
function touchCredential(id: number, credentialId: string) {
  const now = Date.now();
  if ((lastTouched.get(credentialId) ?? 0) > now - 60_000) return;
  lastTouched.set(credentialId, now);
  db()('device_credentials').where({ id }).update({ last_used_at: new Date(now) }).catch(() => lastTouched.delete(credentialId));
}
