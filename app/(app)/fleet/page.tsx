import type { Metadata } from 'next';
import { FleetBoard } from '@/components/fleet/fleet-board';
import { requireMember } from '@/lib/auth/guard';
import { can } from '@/lib/auth/roles';
import { listOrgSites, loadFleetView } from '@/lib/db/queries/fleet';

export const metadata: Metadata = { title: 'Tonight' };

// Server-rendered first paint; the board then polls GET /api/v1/fleet.
export default async function FleetPage() {
  const member = await requireMember('fleet:read');
  const [view, sites] = await Promise.all([loadFleetView(member.orgId), listOrgSites(member.orgId)]);
  return <FleetBoard initial={view} sites={sites.map((s) => ({ id: s.id, name: s.name }))} canAddNode={can(member.role, 'nodes:write')} />;
}
