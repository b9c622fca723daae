import type { Permission } from '@/lib/auth/roles';

export interface NavItem {
  href: string;
  label: string;
  glyph: 'fleet' | 'alerts' | 'planner' | 'bench' | 'sites' | 'team' | 'account';
  permission: Permission;
}

export const NAV_ITEMS: NavItem[] = [
  { href: '/fleet', label: 'Tonight', glyph: 'fleet', permission: 'fleet:read' },
  { href: '/alerts', label: 'Alerts', glyph: 'alerts', permission: 'fleet:read' },
  { href: '/planner', label: 'Planner', glyph: 'planner', permission: 'planner:use' },
  { href: '/bench', label: 'Bench', glyph: 'bench', permission: 'fleet:read' },
  { href: '/sites', label: 'Sites', glyph: 'sites', permission: 'fleet:read' },
  { href: '/team', label: 'Team', glyph: 'team', permission: 'team:manage' },
  { href: '/account', label: 'Account', glyph: 'account', permission: 'fleet:read' },
];
