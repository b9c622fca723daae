import { redirect } from 'next/navigation';
import type { ReactNode } from 'react';
import { Providers } from '@/components/providers';
import { AppShell } from '@/components/shell/app-shell';
import { currentMemberships } from '@/lib/auth/guard';

export const dynamic = 'force-dynamic';

export default async function AppLayout({ children }: { children: ReactNode }) {
  const current = await currentMemberships();
  if (!current) redirect('/sign-in');
  const { member, organizations } = current;
  return (
    <Providers>
      <AppShell member={member} organizations={organizations}>{children}</AppShell>
    </Providers>
  );
}
