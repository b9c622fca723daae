import type { Metadata } from 'next';
import { CreateCredential } from '@/components/credentials/create-credential';
import { CredentialList } from '@/components/credentials/credential-list';
import { NodePageHeader, loadNodeForPage } from '@/components/settings/node-page';
import { can } from '@/lib/auth/roles';
import { listCredentials } from '@/lib/db/queries/credentials';

export const metadata: Metadata = { title: 'Device credentials' };

export default async function CredentialsPage({ params, searchParams }: { params: Promise<{ nodeId: string }>; searchParams: Promise<{ created?: string }> }) {
  const { member, node } = await loadNodeForPage((await params).nodeId);
  const canManage = can(member.role, 'credentials:manage');
  // Everyone in the organization reads the list (metadata only; tokens are never kept).
  const rows = await listCredentials(member.orgId, node.id);
  const justCreated = (await searchParams).created === '1';
  return (
    <section className="max-w-5xl">
      <NodePageHeader node={node} current="credentials" />
      {!canManage ? (
        <>
          <p className="mb-4 rounded-xl border border-dusk-700 bg-dusk-900 p-4 text-sm text-ink-muted" data-testid="read-only-notice">Device credentials are made and revoked by deployers and owners; you see the list only.</p>
          <CredentialList nodeId={node.id} rows={rows} timeZone={node.time_zone} canManage={false} />
        </>
      ) : (
        <>
          {justCreated ? <p className="mb-4 rounded-lg border border-tide p-3 text-sm" role="status" data-testid="node-created">Node created. Next: create its device credential, so it can post readings.</p> : null}
          <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
            <div>
              <h2 className="mb-2 font-bold">Credentials</h2>
              <CredentialList nodeId={node.id} rows={rows} timeZone={node.time_zone} canManage={canManage} />
            </div>
            <CreateCredential nodeId={node.id} />
          </div>
        </>
      )}
    </section>
  );
}
