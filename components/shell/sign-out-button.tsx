'use client';

import { signOut } from 'next-auth/react';

export function SignOutButton({ compact = false }: { compact?: boolean }) {
  return (
    <button
      type="button"
      onClick={() => signOut({ callbackUrl: '/sign-in' })}
      className={compact ? 'w-16 rounded-lg py-2 text-[11px] text-ink-muted hover:bg-dusk-800 hover:text-ink' : 'rounded-md border border-dusk-600 px-4 py-2 text-sm font-bold hover:bg-dusk-800'}
      data-testid="sign-out"
    >
      Sign out
    </button>
  );
}
