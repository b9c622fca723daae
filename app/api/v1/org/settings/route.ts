import { getOrgSettings, updateOrgSettings } from '@/lib/db/queries/org-settings';
import { memberRoute } from '@/lib/http/route';
import { orgSettingsBody } from '@/lib/schemas/org-settings';

// Organization settings: any member reads; only an owner changes them. The node states
// follow the new thresholds at the next margin pass.
export const GET = memberRoute({ permission: 'fleet:read' }, async ({ member }) => {
  return Response.json(await getOrgSettings(member.orgId), { headers: { 'cache-control': 'no-store' } });
});

export const PUT = memberRoute({ permission: 'org:settings', body: orgSettingsBody }, async ({ member, body }) => {
  return Response.json(await updateOrgSettings(member.orgId, body));
});
