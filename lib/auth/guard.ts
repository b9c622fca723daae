import 'server-only';
import { getServerSession } from 'next-auth';
import { cookies } from 'next/headers';
import { listMembershipsOfUser, type MemberRow } from '../db/queries/people';
import { problems } from '../errors';
import { authOptions } from './options';
import { can, type Permission } from './roles';

export type Member = MemberRow;

export const ORG_COOKIE = 'dw-org';

/**
 * The signed-in member of the current organization, re-read from the database on every
 * call: a demotion takes effect on the next request, and a removed member, or a session
 * signed in before the account's last password change, is signed out.
 * Throws 401 when signed out (or no longer a member anywhere), 403 when the role is too low.
 */
export async function requireMember(permission: Permission = 'fleet:read'): Promise<Member> {
  return (await requireMemberships(permission)).member;
}

/** requireMember, with every organization the person belongs to (one session decode, one query). */
export async function requireMemberships(permission: Permission = 'fleet:read'): Promise<Memberships> {
  const found = await currentMemberships();
  if (!found) throw problems.unauthorized();
  if (!can(found.member.role, permission)) throw problems.forbidden();
  return found;
}

export type OrgChoice = { id: number; name: string; role: Member['role'] };
export type Memberships = { member: Member; organizations: OrgChoice[] };

export async function currentMember(): Promise<Member | null> {
  return (await currentMemberships())?.member ?? null;
}

/**
 * The same, with every organization the person belongs to (for the organization switcher).
 * Which one is shown comes from the dw-org cookie (PUT /api/v1/org/current), honoured only
 * while the person is still a member there; otherwise their first membership.
 */
export async function currentMemberships(): Promise<Memberships | null> {
  const session = await getServerSession(authOptions());
  const user = session?.user as { id?: string; authAt?: number } | undefined;
  const userId = Number(user?.id);
  if (!Number.isSafeInteger(userId) || userId <= 0) return null;
  const memberships = await listMembershipsOfUser(userId);
  if (memberships.length === 0) return null;
  // A session from before the last password change is over (OWASP ASVS 5.0 V7, session termination
  // after a password change — from memory): the reset's purpose is to shut others out.
  const changedAt = memberships[0].passwordChangedAt;
  if (changedAt && new Date(changedAt).getTime() > (user?.authAt ?? 0)) return null;
  const chosen = Number((await cookies()).get(ORG_COOKIE)?.value);
  const { passwordChangedAt: _changed, ...member } = memberships.find((m) => m.orgId === chosen) ?? memberships[0];
  return { member, organizations: memberships.map((m) => ({ id: m.orgId, name: m.orgName, role: m.role })) };
}

/**
 * CSRF defence for cookie-authenticated writes (OWASP ASVS 5.0 V3.5): the browser's Origin
 * must be our own host. Browsers always send Origin on cross-site POST, PUT, PATCH, DELETE.
 */
export function assertSameOrigin(request: Request): void {
  if (['GET', 'HEAD', 'OPTIONS'].includes(request.method)) return;
  const origin = request.headers.get('origin');
  const host = request.headers.get('x-forwarded-host') ?? request.headers.get('host');
  if (!origin || !host) throw problems.forbidden('Cross-site request refused: the Origin header is missing.');
  let originHost: string;
  try {
    originHost = new URL(origin).host;
  } catch {
    throw problems.forbidden('Cross-site request refused: the Origin header is malformed.');
  }
  if (originHost !== host) throw problems.forbidden('Cross-site request refused.');
}
