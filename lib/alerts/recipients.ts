import type { Role } from '../auth/roles';
import type { AlertKind } from './kinds';

/**
 * Who hears of an alert. A member's subscription rows each cover one site (or every site,
 * site null) with a list of kinds and a delivery (immediate or a daily digest); a row for the
 * alert's own site wins over the every-site row. A member with no row at all gets the default:
 * owners receive short, dark, silent and over-voltage alerts immediately, others nothing.
 */
export interface MemberContact {
  membershipId: number;
  role: Role;
  email: string;
  name: string;
}

export interface SubscriptionRow {
  membershipId: number;
  siteId: number | null;
  kinds: AlertKind[];
  delivery: 'immediate' | 'digest';
}

export type Delivery = SubscriptionRow['delivery'];

// Owners hear without subscribing of what needs someone to act: a short reserve, a node gone
// dark or silent (a visit, or the link), still dark after a day of sun (a visit), and
// over-voltage (a hazard: cells vent).
export const DEFAULT_OWNER_KINDS: AlertKind[] = ['reserve_short', 'node_dark', 'dark_through_day', 'node_silent', 'over_voltage'];

export function deliveryFor({
  member,
  subscriptions,
  siteId,
  kind,
}: {
  member: MemberContact;
  subscriptions: SubscriptionRow[];
  siteId: number;
  kind: AlertKind;
}): Delivery | null {
  const own = subscriptions.filter((s) => s.membershipId === member.membershipId);
  if (own.length === 0) return member.role === 'owner' && DEFAULT_OWNER_KINDS.includes(kind) ? 'immediate' : null;
  const row = own.find((s) => s.siteId === siteId) ?? own.find((s) => s.siteId === null);
  return row && row.kinds.includes(kind) ? row.delivery : null;
}

export function chooseRecipients(opts: {
  members: MemberContact[];
  subscriptions: SubscriptionRow[];
  siteId: number;
  kind: AlertKind;
  delivery: Delivery;
}): MemberContact[] {
  return opts.members.filter((member) => deliveryFor({ member, subscriptions: opts.subscriptions, siteId: opts.siteId, kind: opts.kind }) === opts.delivery);
}
