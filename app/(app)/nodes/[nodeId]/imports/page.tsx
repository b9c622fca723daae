import type { Metadata } from 'next';
import { ImportHistory, type ImportHistoryRow } from '@/components/imports/import-history';
import { ImportUpload } from '@/components/imports/import-upload';
import { NodePageHeader, loadNodeForPage } from '@/components/settings/node-page';
import { can } from '@/lib/auth/roles';
import { listImports } from '@/lib/ingest/import-csv';

export const metadata: Metadata = { title: 'Imports' };

export default async function ImportsPage({ params }: { params: Promise<{ nodeId: string }> }) {
  const { member, node } = await loadNodeForPage((await params).nodeId);
  const rows = (await listImports(member.orgId, node.id)) as ImportHistoryRow[];
  return (
    <section className="max-w-5xl">
      <NodePageHeader node={node} current="imports" />
      <div className="flex flex-col gap-6">
        {can(member.role, 'imports:create') ? <ImportUpload nodeId={node.id} /> : null}
        <div>
          <h2 className="mb-2 font-bold">History</h2>
          <ImportHistory rows={rows} timeZone={node.time_zone} />
        </div>
      </div>
    </section>
  );
}
