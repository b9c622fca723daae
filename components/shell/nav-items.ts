import type { Permission } from '@/lib/auth/roles';

export interface NavItem {
  href: string;
  label: string;
  glyph: 'fleet' | 'alerts' | 'planner' | 'bench' | 'sites' | 'team' | 'account';
  permission: Permission;
}

export const NAV_ITEMS: NavItem[] = [
  { href: '/fleet', label: 'Tonight', glyph: 'fleet', permission: 'fleet:read' },
  { href: '/sites', label: 'Sites', glyph: 'sites', permission: 'fleet:read' },
  // Alerts, Planner and Bench join the rail as their screens land (issue 7).
  { href: '/team', label: 'Team', glyph: 'team', permission: 'team:manage' },
  { href: '/account', label: 'Account', glyph: 'account', permission: 'fleet:read' },
];
