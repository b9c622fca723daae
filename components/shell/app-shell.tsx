import Link from 'next/link';
import type { ReactNode } from 'react';
import type { Member } from '@/lib/auth/guard';
import { can } from '@/lib/auth/roles';
import { NavGlyph } from './nav-glyph';
import { NAV_ITEMS } from './nav-items';
import { OrgSwitcher, type OrgChoice } from './org-switcher';
import { SignOutButton } from './sign-out-button';
import { ThemeToggle } from './theme-toggle';

/** Desktop: a slim side rail. Phone (390 px): bottom tabs. */
export function AppShell({ member, organizations, children }: { member: Member; organizations: OrgChoice[]; children: ReactNode }) {
  const items = NAV_ITEMS.filter((i) => can(member.role, i.permission));
  return (
    <div className="min-h-screen md:pl-20">
      <nav aria-label="Main" className="fixed inset-y-0 left-0 z-20 hidden w-20 flex-col items-center gap-1 border-r border-dusk-800 bg-dusk-900 py-4 md:flex">
        <Link href="/fleet" className="mb-4" aria-label="Duskwatch, tonight">
          <svg width="26" height="26" viewBox="0 0 22 22" aria-hidden="true">
            <path d="M2 15 H20" stroke="rgb(var(--ink-faint))" strokeWidth="1.5" />
            <path d="M5 15 A6 6 0 0 1 17 15" fill="rgb(var(--ember))" />
          </svg>
        </Link>
        {items.map((i) => (
          <Link key={i.href} href={i.href} className="flex w-16 flex-col items-center gap-1 rounded-lg py-2 text-[11px] text-ink-muted hover:bg-dusk-800 hover:text-ink" data-testid={`nav-${i.glyph}`}>
            <NavGlyph glyph={i.glyph} />
            {i.label}
          </Link>
        ))}
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

      <div className="px-4 pb-24 pt-6 md:px-8 md:pb-10">{children}</div>

      <nav aria-label="Main" className="fixed inset-x-0 bottom-0 z-20 flex justify-around border-t border-dusk-800 bg-dusk-900 py-1.5 md:hidden">
        {items.filter((i) => i.phone).map((i) => (
          <Link key={i.href} href={i.href} className="flex flex-col items-center gap-0.5 px-2 py-1 text-[11px] text-ink-muted">
            <NavGlyph glyph={i.glyph} />
            {i.label}
          </Link>
        ))}
      </nav>
    </div>
  );
}
