import type { Metadata } from 'next';
import Link from 'next/link';
import { AlertsPanel } from '@/components/node/alerts-panel';
import { ExportPanel } from '@/components/node/export-panel';
import { NightTable } from '@/components/node/night-table';
import { NodeCharts } from '@/components/node/node-charts';
import { NodeOverview } from '@/components/node/node-overview';
import { NodeTabs } from '@/components/node/node-tabs';
import { loadNodePage } from './load-node';

/**
 * One node's story: first paint from the server (status as of now), then the client keeps it
 * live — /status polled for the figures, /series for the charts, /nights for the table.
 */
export async function generateMetadata({ params }: { params: Promise<{ nodeId: string }> }): Promise<Metadata> {
  const { status } = await loadNodePage((await params).nodeId);
  return { title: status.node.name };
}

export default async function NodePage({ params }: { params: Promise<{ nodeId: string }> }) {
  const { member, status } = await loadNodePage((await params).nodeId);
  const { node } = status;
  return (
    <article data-testid="node-page" data-node-id={node.id}>
      <nav aria-label="Breadcrumb" className="text-xs text-ink-faint">
        <Link href="/fleet" className="hover:text-ink">Tonight</Link>
        <span aria-hidden="true"> / </span>
        <span>{node.site_name}</span>
      </nav>
      <header className="mt-1 flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <h1 className="text-2xl font-bold" data-testid="node-name">{node.name}</h1>
        <p className="text-sm text-ink-muted">{[node.purpose, node.site_name].filter(Boolean).join(' · ')}</p>
      </header>
      <div className="mt-3">
        <NodeTabs nodeId={node.id} current="overview" role={member.role} />
      </div>

      <NodeOverview nodeId={node.id} initial={status} />
      <NodeCharts nodeId={node.id} timeZone={node.time_zone} />

      <div className="mt-10 grid gap-6 lg:grid-cols-[minmax(0,1fr)_18rem]">
        <NightTable nodeId={node.id} timeZone={node.time_zone} />
        {/* on a phone the alerts come before fourteen night cards; beside the table on a wide screen */}
        <aside className="order-first grid content-start gap-4 lg:order-none" aria-label="Alerts and export">
          <AlertsPanel nodeId={node.id} timeZone={node.time_zone} />
          <ExportPanel nodeId={node.id} timeZone={node.time_zone} nowMs={status.evaluated_at * 1000} />
        </aside>
      </div>
    </article>
  );
}
