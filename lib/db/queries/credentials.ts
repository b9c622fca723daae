import { db } from '../knex';
import { newCredentialId, signDeviceToken } from '../../auth/device-token';
import { writeAudit } from '../../audit';
import { requireSecret } from '../../env';
import { problems } from '../../errors';
import { getNodeInOrg } from './nodes';

/** Device credentials: the database keeps the credential id and metadata, never the token. */
export async function listCredentials(orgId: number, nodeId: number) {
  await getNodeInOrg(orgId, nodeId);
  return db()('device_credentials as c').leftJoin('users as u', 'u.id', 'c.created_by')
    .where({ 'c.org_id': orgId, 'c.node_id': nodeId }).orderBy('c.id', 'desc')
    .select('c.id', 'c.label', 'c.created_at as createdAt', 'c.last_used_at as lastUsedAt', 'c.revoked_at as revokedAt', 'u.email as createdBy');
}

export async function createCredential(opts: { orgId: number; nodeId: number; label: string; userId: number }) {
  await getNodeInOrg(opts.orgId, opts.nodeId);
  const credentialId = newCredentialId();
  const token = await signDeviceToken({ secret: requireSecret('DEVICE_TOKEN_SECRET'), nodeId: opts.nodeId, credentialId });
  const id = await db().transaction(async (trx) => {
    const [id] = await trx('device_credentials').insert({ org_id: opts.orgId, node_id: opts.nodeId, credential_id: credentialId, label: opts.label, created_by: opts.userId });
    await writeAudit({ orgId: opts.orgId, userId: opts.userId, action: 'credential_created', target: `node:${opts.nodeId}`, detail: { credential: id, label: opts.label } }, trx);
    return id as number;
  });
  return { id, token, label: opts.label, createdAt: new Date() };
}

export async function revokeCredential(opts: { orgId: number; nodeId: number; id: number; userId: number }) {
  await getNodeInOrg(opts.orgId, opts.nodeId);
  await db().transaction(async (trx) => {
    const row = await trx('device_credentials').where({ id: opts.id, org_id: opts.orgId, node_id: opts.nodeId }).forUpdate().first('id', 'revoked_at');
    if (!row) throw problems.notFound('The credential');
    if (!row.revoked_at) await trx('device_credentials').where({ id: opts.id }).update({ revoked_at: new Date() });
    await writeAudit({ orgId: opts.orgId, userId: opts.userId, action: 'credential_revoked', target: `node:${opts.nodeId}`, detail: { credential: opts.id } }, trx);
  });
}
