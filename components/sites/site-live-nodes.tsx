import Link from 'next/link';
import { BankValue } from '@/components/fleet/fleet-values';
import { StateGlyph } from '@/components/state-glyph';
import { NODE_STATE_INFO } from '@/lib/config/node-states';
import type { SiteLiveNode } from '@/lib/db/queries/sites';
import { formatNearNow } from '@/lib/format/time';
import { formatAge } from '@/lib/format/units';

/**
 * The nodes standing on a site, most at risk first: state by glyph and word as on the fleet
 * page, the last reading in the site's zone, and the bank's volts at that reading (with the
 * over-voltage caution the fleet shows).
 */
export function SiteLiveNodes({ siteId, nodes, timeZone, now, canAddNodes }: { siteId: number; nodes: SiteLiveNode[]; timeZone: string; now: Date; canAddNodes: boolean }) {
  return (
    <section aria-labelledby="live-heading" className="max-w-2xl rounded-xl border border-dusk-700 p-4" data-testid="live-nodes">
      <h2 id="live-heading" className="font-bold">Nodes on this site</h2>
      {nodes.length === 0 ? (
        <p className="mt-1 text-sm text-ink-muted" data-testid="live-nodes-empty">
          No nodes stand on this site yet.{' '}
          {canAddNodes ? (
            <>Add one with <Link href={`/nodes/new?site=${siteId}`} className="text-tide underline-offset-2 hover:underline" data-testid="live-nodes-add">New node</Link> (this site is picked for it).</>
          ) : 'A deployer or owner adds them from New node, choosing this site.'}
        </p>
      ) : (
        <>
          <p className="mt-1 text-sm text-ink-muted">Most at risk first. Times in {timeZone}; bank volts as of the last reading.</p>
          <ul className="mt-2 text-sm">
            {nodes.map((n) => (
              <li key={n.id} className="border-t border-dusk-800 py-2 first:border-t-0" data-testid="live-node" data-state={n.state}>
                <div className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1">
                  <span className="min-w-0 [overflow-wrap:anywhere]">
                    <Link href={`/nodes/${n.id}`} className="font-bold text-ink underline-offset-2 hover:underline" data-testid="live-node-link">{n.name}</Link>
                    {n.purpose ? <span className="text-ink-muted"> · {n.purpose}</span> : null}
                  </span>
                  <span title={NODE_STATE_INFO[n.state].meaning}><StateGlyph state={n.state} /></span>
                </div>
                <span className="block text-ink-muted" data-testid="live-node-reading">
                  {n.last_reading_at ? (
                    <>
                      last reading <time dateTime={n.last_reading_at} className="figures">{formatNearNow(new Date(n.last_reading_at), timeZone, now.getTime())}</time>
                      {' '}(<span className="figures">{formatAge(n.last_reading_at, now)}</span>) · bank <BankValue volts={n.volts} maxVolts={n.max_volts} />
                    </>
                  ) : 'no reading yet'}
                </span>
              </li>
            ))}
          </ul>
        </>
      )}
    </section>
  );
}
