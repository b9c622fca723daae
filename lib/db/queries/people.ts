import type { Knex } from 'knex';
import { db } from '../knex';
import type { Role } from '../../auth/roles';

export interface UserRow {
  id: number;
  email: string;
  name: string;
  password_hash: string | null;
}

export interface MemberRow {
  membershipId: number;
  userId: number;
  email: string;
  name: string;
  orgId: number;
  orgName: string;
  role: Role;
  /** When the user's password was last set (sessions from before it are over). */
  passwordChangedAt?: Date | null;
}

export function normalizeEmail(email: string): string {
  return email.trim().toLowerCase();
}

export async function findUserByEmail(email: string): Promise<UserRow | undefined> {
  return db()('users').where({ email: normalizeEmail(email) }).first('id', 'email', 'name', 'password_hash');
}

const memberColumns = [
  'm.id as membershipId',
  'u.id as userId',
  'u.email as email',
  'u.name as name',
  'o.id as orgId',
  'o.name as orgName',
  'm.role as role',
];

/** The caller's memberships, read fresh on every request so a demotion bites at once. */
export async function listMembershipsOfUser(userId: number): Promise<MemberRow[]> {
  return db()('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .join('organizations as o', 'o.id', 'm.org_id')
    .where('m.user_id', userId)
    .orderBy('m.id')
    .select([...memberColumns, 'u.password_changed_at as passwordChangedAt']);
}

export async function listMembersOfOrg(orgId: number): Promise<MemberRow[]> {
  return db()('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .join('organizations as o', 'o.id', 'm.org_id')
    .where('m.org_id', orgId)
    .orderBy(['m.role', 'u.email'])
    .select(memberColumns);
}

export async function findMembership(orgId: number, membershipId: number, trx: Knex | Knex.Transaction = db()): Promise<MemberRow | undefined> {
  return trx('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .join('organizations as o', 'o.id', 'm.org_id')
    .where({ 'm.org_id': orgId, 'm.id': membershipId })
    .first(memberColumns);
}

export async function countOwners(orgId: number, trx: Knex | Knex.Transaction = db()): Promise<number> {
  const [{ n }] = await trx('memberships').where({ org_id: orgId, role: 'owner' }).count({ n: '*' }).forUpdate();
  return Number(n);
}
