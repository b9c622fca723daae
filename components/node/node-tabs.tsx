import Link from 'next/link';
import { can, type Permission, type Role } from '@/lib/auth/roles';

/**
 * The node's sub-pages as a row of tabs (a scrolling strip on a phone). Credentials are only for
 * roles that may manage them; the pages check again on the server.
 */
export type NodeTab = 'overview' | 'settings' | 'credentials' | 'imports' | 'visits';

const TABS: { key: NodeTab; label: string; path: string; permission: Permission }[] = [
  { key: 'overview', label: 'Overview', path: '', permission: 'fleet:read' },
  { key: 'settings', label: 'Settings', path: '/settings', permission: 'fleet:read' },
  { key: 'credentials', label: 'Credentials', path: '/credentials', permission: 'credentials:manage' },
  { key: 'imports', label: 'Imports', path: '/imports', permission: 'fleet:read' },
  { key: 'visits', label: 'Field visits', path: '/visits', permission: 'fleet:read' },
];

export function NodeTabs({ nodeId, current, role }: { nodeId: number; current: NodeTab; role: Role }) {
  return (
    <nav aria-label="Node pages" className="-mx-4 overflow-x-auto px-4 md:mx-0 md:px-0">
      <ul className="flex min-w-max gap-1 border-b border-dusk-800">
        {TABS.filter((t) => can(role, t.permission)).map((t) => {
          const active = t.key === current;
          return (
            <li key={t.key}>
              <Link
                href={`/nodes/${nodeId}${t.path}`}
                aria-current={active ? 'page' : undefined}
                data-testid={`node-tab-${t.key}`}
                className={`relative block px-3 py-2 text-sm ${active ? 'font-bold text-ink' : 'text-ink-muted hover:text-ink'}`}
              >
                {t.label}
                {/* the active tab sits on a short ember horizon line */}
                {active ? <span aria-hidden="true" className="absolute inset-x-2 -bottom-px h-0.5 rounded-full bg-ember" /> : null}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
