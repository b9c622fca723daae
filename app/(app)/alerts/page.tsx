import type { Metadata } from 'next';
import type { AlertWire } from '@/components/alerts/alert-wire';
import { AlertsBoard } from '@/components/alerts/alerts-board';
import { filtersFromSearch } from '@/components/alerts/filter-params';
import { requireMember } from '@/lib/auth/guard';
import { can } from '@/lib/auth/roles';
import { listAlerts } from '@/lib/db/queries/alerts';
import { listOrgSites } from '@/lib/db/queries/fleet';
import { db } from '@/lib/db/knex';

export const metadata: Metadata = { title: 'Alerts' };

// Server-rendered first paint for the filters in the address; the board then polls GET /api/v1/alerts.
export default async function AlertsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const member = await requireMember('fleet:read');
  const filters = filtersFromSearch(await searchParams);
  const [rows, sites] = await Promise.all([
    listAlerts(db(), member.orgId, { status: filters.status, siteId: filters.siteId ?? undefined, kind: filters.kind ?? undefined, nodeState: filters.nodeState ?? undefined, nodeId: filters.nodeId ?? undefined }),
    listOrgSites(member.orgId),
  ]);
  // The same JSON the API answers (dates as RFC 3339 strings), so the first paint and the polls agree.
  const alerts = JSON.parse(JSON.stringify(rows)) as AlertWire[];
  return (
    <AlertsBoard
      initial={{ filters, alerts, at: new Date().toISOString() }}
      sites={sites.map((s) => ({ id: s.id, name: s.name }))}
      canAcknowledge={can(member.role, 'alerts:acknowledge')}
      isOwner={can(member.role, 'org:settings')}
      orgTimeZone={sites[0]?.time_zone ?? 'UTC'}
    />
  );
}
