import { db } from '../knex';
import { hashPassword } from '../../auth/password';
import { hashOneTimeToken, newOneTimeToken } from '../../auth/one-time-token';
import type { Role } from '../../auth/roles';
import { writeAudit } from '../../audit';
import { enqueueMail, escapeHtml } from '../../mail/outbox';
import { buildInvitationMail } from '../../mail/templates/invitation-mail';
import { problems } from '../../errors';
import { countOwners, findMembership, normalizeEmail } from './people';

const INVITATION_DAYS = 7;
const RESET_MINUTES = 60;

export async function changeRole(opts: { orgId: number; membershipId: number; role: Role; byUserId: number }) {
  await db().transaction(async (trx) => {
    const target = await findMembership(opts.orgId, opts.membershipId, trx);
    if (!target) throw problems.notFound('The member');
    if (target.role === 'owner' && opts.role !== 'owner' && (await countOwners(opts.orgId, trx)) <= 1) {
      throw problems.conflict('The last owner cannot be demoted: make someone else an owner first.');
    }
    await trx('memberships').where({ id: opts.membershipId, org_id: opts.orgId }).update({ role: opts.role });
    await writeAudit({ orgId: opts.orgId, userId: opts.byUserId, action: 'role_changed', target: target.email, detail: { from: target.role, to: opts.role } }, trx);
  });
}

export async function removeMember(opts: { orgId: number; membershipId: number; byUserId: number }) {
  await db().transaction(async (trx) => {
    const target = await findMembership(opts.orgId, opts.membershipId, trx);
    if (!target) throw problems.notFound('The member');
    if (target.role === 'owner' && (await countOwners(opts.orgId, trx)) <= 1) {
      throw problems.conflict('The last owner cannot be removed.');
    }
    await trx('memberships').where({ id: opts.membershipId, org_id: opts.orgId }).delete();
    await writeAudit({ orgId: opts.orgId, userId: opts.byUserId, action: 'member_removed', target: target.email }, trx);
  });
}

export async function listInvitations(orgId: number) {
  return db()('invitations').where({ org_id: orgId }).whereNull('used_at').andWhere('expires_at', '>', new Date())
    .select('id', 'email', 'role', 'expires_at as expiresAt', 'created_at as createdAt').orderBy('id', 'desc');
}

/**
 * Cancelling deletes the row, so the link's token matches nothing and the link page and accept
 * route answer as for an unknown link. The invitation mail, if still waiting in the outbox, is
 * dead-lettered unless another open invitation to the same address still needs it.
 */
export async function cancelInvitation(opts: { orgId: number; invitationId: number; byUserId: number }) {
  await db().transaction(async (trx) => {
    const inv = await trx('invitations').where({ id: opts.invitationId, org_id: opts.orgId }).forUpdate().first('id', 'email', 'used_at', 'expires_at');
    if (!inv) throw problems.notFound('The invitation');
    if (inv.used_at) throw problems.conflict('This invitation was accepted already. To take the access back, remove the member.');
    if (new Date(inv.expires_at) <= new Date()) throw problems.conflict('This invitation has expired already: its link no longer works.');
    await trx('invitations').where({ id: inv.id }).delete();
    await writeAudit({ orgId: opts.orgId, userId: opts.byUserId, action: 'invitation_cancelled', target: inv.email }, trx);
    const stillOpen = await trx('invitations').where({ org_id: opts.orgId, email: inv.email }).whereNull('used_at').andWhere('expires_at', '>', new Date()).first('id');
    if (!stillOpen) {
      await trx('email_outbox').where({ org_id: opts.orgId, purpose: 'invitation', to_address: inv.email, status: 'pending' }).update({ status: 'dead', last_error: 'invitation cancelled' });
    }
  });
}

export async function createInvitation(opts: { orgId: number; orgName: string; email: string; role: Role; byUserId: number; appUrl: string }) {
  const { token, sha256 } = newOneTimeToken();
  const email = normalizeEmail(opts.email);
  const link = `${opts.appUrl}/invitations/${token}`;
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 86_400_000);
  await db().transaction(async (trx) => {
    const already = await trx('memberships as m').join('users as u', 'u.id', 'm.user_id').where({ 'm.org_id': opts.orgId, 'u.email': email }).first('m.id');
    if (already) throw problems.conflict('That person is already a member.');
    await trx('invitations').insert({ org_id: opts.orgId, email, role: opts.role, token_sha256: sha256, invited_by: opts.byUserId, expires_at: expiresAt });
    // Someone who already has an account keeps their password: the link only adds the membership.
    const existing = await trx('users').where({ email }).first('id');
    const inviter = await trx('users').where({ id: opts.byUserId }).first('name', 'email');
    await enqueueMail(trx, {
      orgId: opts.orgId, purpose: 'invitation', to: email,
      ...buildInvitationMail({
        orgName: opts.orgName, role: opts.role, inviter: { name: inviter?.name ?? '', email: inviter?.email ?? '' },
        link, expiresAt, validDays: INVITATION_DAYS, existingAccount: Boolean(existing),
      }),
    });
    await writeAudit({ orgId: opts.orgId, userId: opts.byUserId, action: 'invitation_created', target: email, detail: { role: opts.role } }, trx);
  });
  return { link, expiresAt };
}

/** What an invitation link offers, for its page: null when it is used, expired or unknown. */
export async function describeInvitation(token: string) {
  const inv = await db()('invitations as i').join('organizations as o', 'o.id', 'i.org_id')
    .where({ 'i.token_sha256': hashOneTimeToken(token) }).whereNull('i.used_at').andWhere('i.expires_at', '>', new Date())
    .first('i.email', 'i.role', 'o.name as orgName');
  if (!inv) return null;
  const user = await db()('users').where({ email: inv.email }).first('id');
  return { email: inv.email as string, role: inv.role as Role, orgName: inv.orgName as string, existingAccount: Boolean(user) };
}

/**
 * Accepting creates the account (or adds the membership to an existing one) exactly once.
 * A new account needs a name and a password; an existing one keeps its own, and any name or
 * password sent with it is not used (the reply says so with `existing_account`).
 */
export async function acceptInvitation(opts: { token: string; name?: string; password?: string }) {
  // Hashed before the row lock is taken (bcrypt takes a noticeable fraction of a second).
  const hash = opts.password ? await hashPassword(opts.password) : null;
  return db().transaction(async (trx) => {
    const inv = await trx('invitations').where({ token_sha256: hashOneTimeToken(opts.token) }).forUpdate().first();
    if (!inv || inv.used_at || new Date(inv.expires_at) <= new Date()) throw problems.notFound('This invitation link (used, expired or unknown)');
    let user = await trx('users').where({ email: inv.email }).first('id');
    const existingAccount = Boolean(user);
    if (!user) {
      const missing = [
        ...(opts.name ? [] : [{ pointer: '/name', detail: 'Enter your name.' }]),
        ...(hash ? [] : [{ pointer: '/password', detail: 'Choose a password.' }]),
      ];
      if (missing.length) throw problems.invalid(missing);
      const [id] = await trx('users').insert({ email: inv.email, name: opts.name, password_hash: hash, password_changed_at: new Date() });
      user = { id };
    }
    await trx('memberships').insert({ org_id: inv.org_id, user_id: user.id, role: inv.role }).onConflict(['org_id', 'user_id']).merge({ role: inv.role });
    await trx('invitations').where({ id: inv.id }).update({ used_at: new Date() });
    await writeAudit({ orgId: inv.org_id, userId: user.id, action: 'invitation_accepted', target: inv.email }, trx);
    return { email: inv.email as string, existingAccount };
  });
}

/** Always the same answer to the caller, known e-mail or not. */
export async function requestPasswordReset(opts: { email: string; appUrl: string; ip: string }) {
  const user = await db()('users').where({ email: normalizeEmail(opts.email) }).first('id', 'email');
  if (!user) return;
  const { token, sha256 } = newOneTimeToken();
  const link = `${opts.appUrl}/reset-password/${token}`;
  await db().transaction(async (trx) => {
    await trx('password_resets').insert({ user_id: user.id, token_sha256: sha256, expires_at: new Date(Date.now() + RESET_MINUTES * 60_000) });
    await enqueueMail(trx, {
      orgId: null, purpose: 'password_reset', to: user.email, subject: 'Reset your Duskwatch password',
      text: `Someone asked to reset the password of this account. If it was you, set a new one here (the link works once, for ${RESET_MINUTES} minutes):\n${link}\n\nIf it was not you, ignore this message.\n`,
      html: `<p>Someone asked to reset the password of this account. If it was you, <a href="${escapeHtml(link)}">set a new password</a> (the link works once, for ${RESET_MINUTES} minutes).</p><p>If it was not you, ignore this message.</p>`,
    });
    await writeAudit({ userId: user.id, action: 'password_reset_requested', target: user.email, ip: opts.ip }, trx);
  });
}

export async function confirmPasswordReset(opts: { token: string; password: string }) {
  const hash = await hashPassword(opts.password);
  await db().transaction(async (trx) => {
    const reset = await trx('password_resets').where({ token_sha256: hashOneTimeToken(opts.token) }).forUpdate().first();
    if (!reset || reset.used_at || new Date(reset.expires_at) <= new Date()) throw problems.notFound('This reset link (used, expired or unknown)');
    await trx('users').where({ id: reset.user_id }).update({ password_hash: hash, password_changed_at: new Date() });
    await trx('password_resets').where({ id: reset.id }).update({ used_at: new Date() });
    await writeAudit({ userId: reset.user_id, action: 'password_changed' }, trx);
  });
}
