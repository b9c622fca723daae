/** Roles and what each may do (DESIGN.md §2). Checked on the server; the UI only mirrors it. */
export const ROLES = ['viewer', 'deployer', 'owner'] as const;
export type Role = (typeof ROLES)[number];

const RANK: Record<Role, number> = { viewer: 0, deployer: 1, owner: 2 };

export function roleAtLeast(role: Role, needed: Role): boolean {
  return RANK[role] >= RANK[needed];
}

/** Each capability names the lowest role that has it. */
export const PERMISSIONS = {
  'fleet:read': 'viewer',
  'model:evaluate': 'viewer',
  'planner:use': 'viewer',
  'sites:write': 'deployer',
  'nodes:write': 'deployer',
  'credentials:manage': 'deployer',
  'imports:create': 'deployer',
  'bench:write': 'deployer',
  'visits:write': 'deployer',
  'alerts:acknowledge': 'deployer',
  'subscriptions:own': 'viewer',
  'team:manage': 'owner',
  'org:settings': 'owner',
} as const satisfies Record<string, Role>;

export type Permission = keyof typeof PERMISSIONS;

export function can(role: Role, permission: Permission): boolean {
  return roleAtLeast(role, PERMISSIONS[permission]);
}
