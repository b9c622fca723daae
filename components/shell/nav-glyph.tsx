import type { NavItem } from './nav-items';

// Line glyphs of our own for the rail and the phone tabs.
const paths: Record<NavItem['glyph'], string> = {
  fleet: 'M3 15h14M6 15a4 4 0 0 1 8 0M10 5v2M4.5 8.5l1.4 1.4M15.5 8.5l-1.4 1.4',
  alerts: 'M10 3v9M10 15.5v.5M4 17h12L10 3z',
  planner: 'M4 16V6M8 16V9M12 16V4M16 16v-5M3 16h14',
  bench: 'M7 3h6M8 3v5l-4 8h12l-4-8V3',
  sites: 'M10 17s-5-5-5-9a5 5 0 0 1 10 0c0 4-5 9-5 9zM10 9.5a1.5 1.5 0 1 0 0-3 1.5 1.5 0 0 0 0 3z',
  team: 'M7 9a2.5 2.5 0 1 0 0-5 2.5 2.5 0 0 0 0 5zM2.5 16a4.5 4.5 0 0 1 9 0M13.5 8.5a2 2 0 1 0 0-4M14 12a4 4 0 0 1 3.5 4',
  settings: 'M4 6h12M4 10h12M4 14h12M7 4v4M13 8v4M9 12v4',
  account: 'M10 10a3 3 0 1 0 0-6 3 3 0 0 0 0 6zM4 17a6 6 0 0 1 12 0',
};

export function NavGlyph({ glyph }: { glyph: NavItem['glyph'] }) {
  return (
    <svg width="20" height="20" viewBox="0 0 20 20" fill="none" stroke="currentColor" strokeWidth="1.5" strokeLinecap="round" strokeLinejoin="round" aria-hidden="true">
      <path d={paths[glyph]} />
    </svg>
  );
}
