'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { NavGlyph } from './nav-glyph';
import { currentSectionHref, type NavItem } from './nav-items';

/**
 * The section links of the rail (desktop) or the bottom tabs (phone). The current section is
 * marked for screen readers (aria-current) and by sight: ember text on a short ember line,
 * at the rail's edge on the desktop and along the top of the tabs on the phone.
 */
export function NavLinks({ items, variant }: { items: NavItem[]; variant: 'rail' | 'tabs' }) {
  const current = currentSectionHref(usePathname() ?? '', items);
  return <>{items.map((i) => {
    const active = i.href === current;
    const tone = active ? 'font-bold text-ember' : 'text-ink-muted hover:text-ink';
    return variant === 'rail' ? (
      <Link key={i.href} href={i.href} aria-current={active ? 'page' : undefined} data-testid={`nav-${i.glyph}`}
        className={`relative flex w-16 flex-col items-center gap-1 rounded-lg py-2 text-[11px] hover:bg-dusk-800 ${active ? 'bg-dusk-800' : ''} ${tone}`}>
        {active ? <span aria-hidden="true" className="absolute -left-2 inset-y-2 w-0.5 rounded-full bg-ember" /> : null}
        <NavGlyph glyph={i.glyph} />
        {i.label}
      </Link>
    ) : (
      <Link key={i.href} href={i.href} aria-current={active ? 'page' : undefined} data-testid={`tab-${i.glyph}`}
        className={`relative flex flex-col items-center gap-0.5 px-2 py-1 text-[11px] ${tone}`}>
        {active ? <span aria-hidden="true" className="absolute inset-x-1 -top-1.5 h-0.5 rounded-full bg-ember" /> : null}
        <NavGlyph glyph={i.glyph} />
        {i.label}
      </Link>
    );
  })}</>;
}
