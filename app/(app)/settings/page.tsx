import type { Metadata } from 'next';
import { OrgSettingsForm } from '@/components/org-settings/org-settings-form';
import { OrgSettingsView } from '@/components/org-settings/org-settings-view';
import { requireMember } from '@/lib/auth/guard';
import { can } from '@/lib/auth/roles';
import { getOrgSettings } from '@/lib/db/queries/org-settings';

export const metadata: Metadata = { title: 'Organization settings' };

export default async function OrgSettingsPage() {
  const member = await requireMember('fleet:read');
  const settings = await getOrgSettings(member.orgId);
  const canEdit = can(member.role, 'org:settings');
  return (
    <section>
      <h1 className="text-2xl font-bold">Settings of {settings.name}</h1>
      <p className="mt-1 max-w-2xl text-sm text-ink-muted">
        The night margin decides each node&apos;s state: reserve above the burst floor ÷ the energy the node draws until the panel recharges it.
        {canEdit ? '' : ' Only an owner changes these.'}
      </p>
      <div className="mt-6">{canEdit ? <OrgSettingsForm initial={settings} /> : <OrgSettingsView settings={settings} />}</div>
    </section>
  );
}
