import { verifyDeviceToken } from '../auth/device-token';
import { db } from '../db/knex';
import { requireSecret } from '../env';
import { ProblemError } from '../errors';

/**
 * The node comes from the token, never from the body. A token must be one we signed (HS256
 * only), its credential must exist and not be revoked, and its node must still exist: checked
 * on every request, so a revocation takes effect on the next one.
 */
function unauthorized(detail: string) {
  return new ProblemError(401, 'Device not authenticated', detail, { headers: { 'www-authenticate': 'Bearer realm="duskwatch-ingest"' } });
}

const lastTouched = new Map<string, number>();

export async function authenticateDevice(request: Request): Promise<{ nodeId: number; orgId: number; credentialId: string }> {
  const header = request.headers.get('authorization') ?? '';
  const match = /^Bearer\s+([A-Za-z0-9_\-.]+)\s*$/.exec(header);
  if (!match) throw unauthorized('Send Authorization: Bearer <device token>.');
  const claims = await verifyDeviceToken({ secret: requireSecret('DEVICE_TOKEN_SECRET'), token: match[1] });
  if (!claims) throw unauthorized('The device token is not valid.');
  const row = await db()('device_credentials as c')
    .join('nodes as n', 'n.id', 'c.node_id')
    .where({ 'c.credential_id': claims.credentialId, 'c.node_id': claims.nodeId })
    .whereNull('c.revoked_at')
    .whereNull('n.deleted_at')
    .first('c.id', 'c.org_id');
  if (!row) throw unauthorized('The device token was revoked or its node no longer exists.');
  touchCredential(row.id, claims.credentialId);
  return { nodeId: claims.nodeId, orgId: row.org_id, credentialId: claims.credentialId };
}

// last_used_at is kept to the minute: one write per credential per minute, not per post.
function touchCredential(id: number, credentialId: string) {
  const now = Date.now();
  if ((lastTouched.get(credentialId) ?? 0) > now - 60_000) return;
  lastTouched.set(credentialId, now);
  db()('device_credentials').where({ id }).update({ last_used_at: new Date(now) }).catch(() => lastTouched.delete(credentialId));
}
