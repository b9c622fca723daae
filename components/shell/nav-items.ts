import type { Permission } from '@/lib/auth/roles';

export interface NavItem {
  href: string;
  label: string;
  glyph: 'fleet' | 'alerts' | 'planner' | 'bench' | 'sites' | 'team' | 'settings' | 'account';
  permission: Permission;
  /** Shown in the phone's bottom tabs (at most five); the rest is reached from Account. */
  phone?: boolean;
}

export const NAV_ITEMS: NavItem[] = [
  { href: '/fleet', label: 'Tonight', glyph: 'fleet', permission: 'fleet:read', phone: true },
  { href: '/alerts', label: 'Alerts', glyph: 'alerts', permission: 'fleet:read', phone: true },
  { href: '/planner', label: 'Planner', glyph: 'planner', permission: 'planner:use', phone: true },
  { href: '/bench', label: 'Bench', glyph: 'bench', permission: 'fleet:read', phone: true },
  { href: '/sites', label: 'Sites', glyph: 'sites', permission: 'fleet:read', phone: true },
  { href: '/team', label: 'Team', glyph: 'team', permission: 'team:manage' },
  { href: '/settings', label: 'Settings', glyph: 'settings', permission: 'fleet:read' },
  { href: '/account', label: 'Account', glyph: 'account', permission: 'fleet:read' },
];
