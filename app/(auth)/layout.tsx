import Link from 'next/link';
import type { ReactNode } from 'react';

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <main className="flex min-h-screen flex-col items-center justify-center px-4 py-10">
      <Link href="/" className="mb-8 flex items-center gap-2 text-lg font-bold tracking-wide">
        <svg width="22" height="22" viewBox="0 0 22 22" aria-hidden="true">
          <path d="M2 15 H20" stroke="rgb(var(--ink-faint))" strokeWidth="1.5" />
          <path d="M5 15 A6 6 0 0 1 17 15" fill="rgb(var(--ember))" />
        </svg>
        Duskwatch
      </Link>
      <div className="w-full max-w-sm rounded-xl border border-dusk-700 bg-dusk-900 p-6 shadow-lg">{children}</div>
    </main>
  );
}
