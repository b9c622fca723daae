import Link from 'next/link';
import { NAV_ITEMS } from '@/components/shell/nav-items';

// Any address the app does not know, signed in or out: no guard here, only the way back.
const tonight = NAV_ITEMS.find((i) => i.href === '/fleet')!;

export default function NotFound() {
  return (
    <main id="main" className="flex min-h-screen flex-col items-center justify-center px-4 py-10">
      <div className="w-full max-w-lg rounded-xl border border-dusk-700 bg-dusk-900 p-6 shadow-lg" data-testid="page-not-found">
        <svg width="26" height="26" viewBox="0 0 22 22" aria-hidden="true">
          <path d="M2 15 H20" stroke="rgb(var(--ink-faint))" strokeWidth="1.5" />
          <path d="M5 15 A6 6 0 0 1 17 15" fill="rgb(var(--ember))" />
        </svg>
        <h1 className="mt-3 text-lg font-bold">No such page</h1>
        <p className="mt-2 text-sm text-ink-muted">
          Nothing in Duskwatch lives at this address. The link may be mistyped, or the page has moved.
        </p>
        <div className="mt-5 flex flex-wrap gap-3">
          <Link href={tonight.href} className="rounded-md bg-ember px-4 py-2 text-sm font-bold text-dusk-950 hover:opacity-90" data-testid="not-found-fleet">
            {tonight.label}
          </Link>
          <Link href="/sign-in" className="rounded-md border border-dusk-600 px-4 py-2 text-sm font-bold hover:bg-dusk-800" data-testid="not-found-sign-in">
            Sign in
          </Link>
        </div>
      </div>
    </main>
  );
}
