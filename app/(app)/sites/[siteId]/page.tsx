import type { Metadata } from 'next';
import Link from 'next/link';
import { DeleteSite } from '@/components/sites/delete-site';
import { fmtDeg, fmtLat, fmtLon } from '@/components/sites/site-card';
import { SiteForm } from '@/components/sites/site-form';
import { SiteLiveNodes } from '@/components/sites/site-live-nodes';
import { describeZoneNow } from '@/components/sites/zone-offset';
import { can } from '@/lib/auth/roles';
import { listLiveNodes, listRetiredNodes } from '@/lib/db/queries/sites';
import { formatInTimeZone, TIME_PATTERNS } from '@/lib/format/time';
import { loadSitePage } from './load-site';

export const metadata: Metadata = { title: 'Site' };

/** Every reading the node sent: from its first to one second past its last (the range is [from, to)). */
function exportHref(nodeId: number, firstIso: string, lastIso: string): string {
  const from = Math.floor(Date.parse(firstIso) / 1000);
  const to = Math.floor(Date.parse(lastIso) / 1000) + 1;
  return `/api/v1/nodes/${nodeId}/export?from=${from}&to=${to}`;
}

export default async function SitePage({ params }: { params: Promise<{ siteId: string }> }) {
  const { member, site } = await loadSitePage((await params).siteId);
  const { id: _id, live_nodes: nodes, ...body } = site;
  const [live, retired] = await Promise.all([listLiveNodes(member.orgId, site.id), listRetiredNodes(member.orgId, site.id)]);
  const now = new Date();
  const local = (iso: string) => formatInTimeZone(new Date(iso), site.time_zone, TIME_PATTERNS.record);
  return (
    <section className="flex flex-col gap-4">
      <div>
        <Link href="/sites" className="text-sm text-tide underline-offset-2 hover:underline">← Sites</Link>
        <h1 className="mt-1 text-2xl font-bold [overflow-wrap:anywhere]" data-testid="site-name">{site.name}</h1>
        <p className="text-sm text-ink-muted">{nodes} node{nodes === 1 ? '' : 's'} on this site.</p>
      </div>
      <SiteLiveNodes siteId={site.id} nodes={live} timeZone={site.time_zone} now={now} canAddNodes={can(member.role, 'nodes:write')} />
      {can(member.role, 'sites:write') ? (
        <>
          <SiteForm siteId={site.id} initial={body} />
          <DeleteSite siteId={site.id} name={site.name} />
        </>
      ) : (
        <dl className="grid max-w-2xl grid-cols-[auto_1fr] gap-x-4 gap-y-1 rounded-xl border border-dusk-700 bg-dusk-900 p-4 text-sm" data-testid="site-readonly">
          <dt className="text-ink-faint">Latitude</dt><dd className="figures">{fmtLat(site.lat)}</dd>
          <dt className="text-ink-faint">Longitude</dt><dd className="figures">{fmtLon(site.lon)}</dd>
          <dt className="text-ink-faint">Time zone</dt><dd>{site.time_zone} <span className="figures text-ink-muted" data-testid="site-zone-offset">({describeZoneNow(site.time_zone, now).text})</span></dd>
          <dt className="text-ink-faint">Recharge elevation</dt><dd className="figures">{fmtDeg(site.recharge_elevation_deg)}</dd>
          <dt className="text-ink-faint">Notes</dt><dd className="whitespace-pre-line">{site.notes || '—'}</dd>
        </dl>
      )}
      {retired.length ? (
        <section aria-labelledby="retired-heading" className="max-w-2xl rounded-xl border border-dusk-700 p-4" data-testid="retired-nodes">
          <h2 id="retired-heading" className="font-bold">Retired nodes, kept on record</h2>
          <p className="mt-1 text-sm text-ink-muted">Their readings are kept, so the site stays while it holds them. Times in {site.time_zone}.</p>
          <ul className="mt-2 text-sm">
            {retired.map((n) => (
              <li key={n.id} className="border-t border-dusk-800 py-2 first:border-t-0" data-testid="retired-node">
                <span className="font-bold">{n.name}</span>{n.purpose ? <span className="text-ink-muted"> · {n.purpose}</span> : null}
                <span className="block text-ink-muted">
                  retired <span className="figures">{local(n.retired_at)}</span>
                  {n.last_reading_at ? <> · last reading <span className="figures">{local(n.last_reading_at)}</span></> : ' · never reported'}
                </span>
                {n.first_reading_at && n.last_reading_at ? (
                  <a href={exportHref(n.id, n.first_reading_at, n.last_reading_at)} download className="text-tide underline-offset-2 hover:underline" data-testid="retired-node-export">
                    Download all its readings (CSV)
                  </a>
                ) : null}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </section>
  );
}
