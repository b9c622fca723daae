import Link from 'next/link';
import type { ReactNode } from 'react';
import type { Member } from '@/lib/auth/guard';
import { can } from '@/lib/auth/roles';
import { NAV_ITEMS } from './nav-items';
import { NavLinks } from './nav-links';
import { OrgSwitcher, type OrgChoice } from './org-switcher';
import { SignOutButton } from './sign-out-button';
import { ThemeToggle } from './theme-toggle';

/** Desktop: a slim side rail. Phone (390 px): bottom tabs. */
export function AppShell({ member, organizations, children }: { member: Member; organizations: OrgChoice[]; children: ReactNode }) {
  const items = NAV_ITEMS.filter((i) => can(member.role, i.permission));
  return (
    <div className="min-h-screen md:pl-20">
      {/* The first stop of the Tab key: past the rail and the header, straight to the page. */}
      <a href="#main" className="sr-only rounded-md border border-dusk-700 bg-dusk-900 px-4 py-2 text-sm font-bold text-ink focus:not-sr-only focus:fixed focus:left-3 focus:top-3 focus:z-50" data-testid="skip-link">
        Skip to content
      </a>
      <nav aria-label="Main" className="fixed inset-y-0 left-0 z-20 hidden w-20 flex-col items-center gap-1 border-r border-dusk-800 bg-dusk-900 py-4 md:flex">
        <Link href="/fleet" className="mb-4" aria-label="Duskwatch, tonight">
          <svg width="26" height="26" viewBox="0 0 22 22" aria-hidden="true">
            <path d="M2 15 H20" stroke="rgb(var(--ink-faint))" strokeWidth="1.5" />
            <path d="M5 15 A6 6 0 0 1 17 15" fill="rgb(var(--ember))" />
          </svg>
        </Link>
        <NavLinks items={items} variant="rail" />
        <div className="mt-auto"><SignOutButton compact /></div>
      </nav>

      <header className="flex items-center justify-between border-b border-dusk-800 px-4 py-3 md:px-8">
        <div>
          <p className="text-xs uppercase tracking-[0.18em] text-ink-faint">Organization</p>
          <OrgSwitcher current={{ id: member.orgId, name: member.orgName, role: member.role }} organizations={organizations} />
        </div>
        <div className="flex items-center gap-3">
        <ThemeToggle />
        <Link href="/account" className="text-right text-sm hover:underline" aria-label={`Account of ${member.email}`}>
          <p className="text-ink-muted">{member.email}</p>
          <p className="text-xs text-ink-faint" data-testid="member-role">{member.role}</p>
        </Link>
        </div>
      </header>

      {/* tabIndex -1: the skip link moves focus here, not only the scroll position. */}
      <main id="main" tabIndex={-1} className="px-4 pb-24 pt-6 focus:outline-none md:px-8 md:pb-10">{children}</main>

      <nav aria-label="Main" className="fixed inset-x-0 bottom-0 z-20 flex justify-around border-t border-dusk-800 bg-dusk-900 py-1.5 md:hidden">
        <NavLinks items={items.filter((i) => i.phone)} variant="tabs" />
      </nav>
    </div>
  );
}
