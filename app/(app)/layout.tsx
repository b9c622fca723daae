import { redirect } from 'next/navigation';
import type { ReactNode } from 'react';
import { AppShell } from '@/components/shell/app-shell';
import { currentMember } from '@/lib/auth/guard';

export const dynamic = 'force-dynamic';

export default async function AppLayout({ children }: { children: ReactNode }) {
  const member = await currentMember();
  if (!member) redirect('/sign-in');
  return <AppShell member={member}>{children}</AppShell>;
}
