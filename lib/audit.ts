import type { Knex } from 'knex';
import { db } from './db/knex';

export type AuditAction =
  | 'signin'
  | 'signin_failed'
  | 'signout'
  | 'role_changed'
  | 'member_removed'
  | 'invitation_created'
  | 'invitation_accepted'
  | 'invitation_cancelled'
  | 'password_reset_requested'
  | 'password_changed'
  | 'credential_created'
  | 'credential_revoked'
  | 'alert_acknowledged';

export async function writeAudit(
  entry: { orgId?: number | null; userId?: number | null; action: AuditAction; target?: string; detail?: unknown; ip?: string | null },
  trx: Knex | Knex.Transaction = db(),
): Promise<void> {
  await trx('audit_log').insert({
    org_id: entry.orgId ?? null,
    user_id: entry.userId ?? null,
    action: entry.action,
    target: entry.target?.slice(0, 200) ?? null,
    detail: entry.detail === undefined ? null : JSON.stringify(entry.detail),
    ip: entry.ip?.slice(0, 64) ?? null,
  });
}
