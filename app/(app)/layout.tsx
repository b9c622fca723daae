import { redirect } from 'next/navigation';
import type { ReactNode } from 'react';
import { Providers } from '@/components/providers';
import { AppShell } from '@/components/shell/app-shell';
import { currentMember } from '@/lib/auth/guard';

export const dynamic = 'force-dynamic';

export default async function AppLayout({ children }: { children: ReactNode }) {
  const member = await currentMember();
  if (!member) redirect('/sign-in');
  return (
    <Providers>
      <AppShell member={member}>{children}</AppShell>
    </Providers>
  );
}
