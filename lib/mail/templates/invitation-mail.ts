import { ROLE_SENTENCE } from '../../auth/role-words';
import type { Role } from '../../auth/roles';
import { escapeHtml, oneLine } from '../outbox';
import { formatInTimeZone, TIME_PATTERNS } from '../../format/time';
import { htmlRows, textRows } from './parts';

/**
 * The invitation e-mail: who invites, to which organization, with which role and what that role
 * may do, when the link stops working, and what to do with an invitation nobody expected.
 * Names come from users: the subject is flattened to one line and the HTML escapes every value.
 */
export interface InvitationMailInput {
  orgName: string;
  role: Role;
  inviter: { name: string; email: string };
  link: string;
  expiresAt: Date;
  /** Days the link lasts from sending, said beside its expiry. */
  validDays: number;
  /** The address has an account already: the link only adds the membership. */
  existingAccount: boolean;
}

export function buildInvitationMail(input: InvitationMailInput): { subject: string; text: string; html: string } {
  const org = oneLine(input.orgName);
  const inviterName = oneLine(input.inviter.name);
  const inviterEmail = oneLine(input.inviter.email);
  const inviter = inviterName ? `${inviterName} (${inviterEmail})` : inviterEmail;
  // The invitee's zone is unknown: UTC, as on the team screen's list of open invitations.
  const expires = `${formatInTimeZone(input.expiresAt, 'UTC', TIME_PATTERNS.record)} (${input.validDays} days after it was sent; it works once)`;
  const rows: [string, string][] = [
    ['Invited by', inviter],
    ['Organization', org],
    ['Role offered', input.role],
    ['Link expires', expires],
  ];
  const intro = `${inviter} has invited you to join ${org} on Duskwatch as ${input.role}.`;
  const roleSentence = ROLE_SENTENCE[input.role];
  const keep = input.existingAccount
    ? 'You keep your present password; the organization then appears in the list at the top of every page.'
    : null;
  const action = input.existingAccount ? 'Accept the invitation' : 'Set your password';
  const ignore = "If you weren't expecting this invitation, ignore this e-mail: nothing changes unless the link is used, and it stops working by itself.";
  const text = [
    intro,
    '',
    textRows(rows),
    '',
    roleSentence,
    ...(keep ? ['', keep] : []),
    '',
    `${action} here:`,
    input.link,
    '',
    ignore,
  ].join('\n');
  const html = [
    `<p>${escapeHtml(intro)}</p>`,
    htmlRows(rows),
    `<p>${escapeHtml(roleSentence)}</p>`,
    ...(keep ? [`<p>${escapeHtml(keep)}</p>`] : []),
    `<p><a href="${escapeHtml(input.link)}">${action}</a></p>`,
    `<p style="color:#666">${escapeHtml(ignore)}</p>`,
  ].join('\n');
  return { subject: oneLine(`${inviterName || inviterEmail} invited you to ${org} on Duskwatch`), text, html };
}
