import type { Metadata } from 'next';
import { formatInTimeZone } from '@/lib/format/time';
import { NodePageHeader, loadNodeForPage } from '@/components/settings/node-page';
import { VisitForm } from '@/components/visits/visit-form';
import { VisitList } from '@/components/visits/visit-list';
import { can } from '@/lib/auth/roles';
import { listVisits } from '@/lib/db/queries/visits';

export const metadata: Metadata = { title: 'Field visits' };

export default async function VisitsPage({ params }: { params: Promise<{ nodeId: string }> }) {
  const { member, node } = await loadNodeForPage((await params).nodeId);
  const visits = await listVisits(member.orgId, node.id);
  // "Today" at the site, where the visit happens.
  const today = formatInTimeZone(new Date(), node.time_zone, 'yyyy-MM-dd').slice(0, 10);
  return (
    <section className="max-w-5xl">
      <NodePageHeader node={node} current="visits" />
      <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
        <div>
          <h2 className="mb-2 font-bold">Visits</h2>
          <VisitList nodeId={node.id} visits={visits} />
        </div>
        {can(member.role, 'visits:write') ? <VisitForm nodeId={node.id} today={today} /> : null}
      </div>
    </section>
  );
}
