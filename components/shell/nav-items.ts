import type { Permission } from '@/lib/auth/roles';

export interface NavItem {
  href: string;
  label: string;
  glyph: 'fleet' | 'alerts' | 'planner' | 'bench' | 'sites' | 'team' | 'settings' | 'account';
  permission: Permission;
  /** Shown in the phone's bottom tabs (at most five); the rest is reached from Account. */
  phone?: boolean;
  /** Other path prefixes that belong to this section (a node page is reached from tonight's fleet). */
  also?: string[];
}

export const NAV_ITEMS: NavItem[] = [
  { href: '/fleet', label: 'Tonight', glyph: 'fleet', permission: 'fleet:read', phone: true, also: ['/nodes'] },
  { href: '/alerts', label: 'Alerts', glyph: 'alerts', permission: 'fleet:read', phone: true },
  { href: '/planner', label: 'Planner', glyph: 'planner', permission: 'planner:use', phone: true },
  { href: '/bench', label: 'Bench', glyph: 'bench', permission: 'fleet:read', phone: true },
  { href: '/sites', label: 'Sites', glyph: 'sites', permission: 'fleet:read', phone: true },
  { href: '/team', label: 'Team', glyph: 'team', permission: 'team:manage' },
  { href: '/settings', label: 'Settings', glyph: 'settings', permission: 'fleet:read' },
  { href: '/account', label: 'Account', glyph: 'account', permission: 'fleet:read' },
];

/** Whole path segments only: /sites/3 is under /sites, /sitesmap is not. */
function isUnder(pathname: string, prefix: string) {
  return pathname === prefix || pathname.startsWith(`${prefix}/`);
}

/** The href of the section the pathname belongs to, or null when it belongs to none. */
export function currentSectionHref(pathname: string, items: NavItem[] = NAV_ITEMS): string | null {
  const item = items.find((i) => [i.href, ...(i.also ?? [])].some((p) => isUnder(pathname, p)));
  return item ? item.href : null;
}
