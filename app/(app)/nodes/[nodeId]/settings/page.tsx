import type { Metadata } from 'next';
import { NodeForm } from '@/components/settings/node-form';
import { NodePageHeader, loadNodeForPage } from '@/components/settings/node-page';
import { NodeReadonly } from '@/components/settings/node-readonly';
import { RetireNode } from '@/components/settings/retire-node';
import { can } from '@/lib/auth/roles';
import { nodeToWire } from '@/lib/db/queries/nodes';
import { listSites } from '@/lib/db/queries/sites';
import type { NodeBody } from '@/lib/schemas/node';

export const metadata: Metadata = { title: 'Node settings' };

export default async function NodeSettingsPage({ params }: { params: Promise<{ nodeId: string }> }) {
  const { member, node } = await loadNodeForPage((await params).nodeId);
  const { id: _id, site_name: _site, ...wire } = nodeToWire(node);
  const body = wire as NodeBody;
  return (
    <section className="max-w-6xl">
      <NodePageHeader node={node} current="settings" />
      {can(member.role, 'nodes:write') ? (
        <>
          <NodeForm nodeId={node.id} initial={body} sites={(await listSites(member.orgId)).map((s) => ({ id: s.id, name: s.name }))} />
          <RetireNode nodeId={node.id} name={node.name} />
        </>
      ) : <NodeReadonly node={body} siteName={node.site_name} />}
    </section>
  );
}
