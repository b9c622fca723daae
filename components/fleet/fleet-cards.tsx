import Link from 'next/link';
import type { ReactNode } from 'react';
import { StateGlyph } from '@/components/state-glyph';
import type { FleetNodeWire } from '@/lib/db/queries/fleet';
import { formatVolts } from '@/lib/format/units';
import { AgeValue, DrawValue, LocalTime, MarginValue, ReserveValue, SocValue } from './fleet-values';

/** Phone (below md): one card per node instead of the wide table; the whole card links to the node. */
export function FleetCards({ nodes, now }: { nodes: FleetNodeWire[]; now: string }) {
  return (
    <ul className="mt-4 flex flex-col gap-3 md:hidden" aria-label="Nodes">
      {nodes.map((n) => (
        <li key={n.id} data-testid="fleet-card" data-state={n.state}>
          <Link href={`/nodes/${n.id}`} className={`block rounded-xl border bg-dusk-900 p-4 hover:bg-dusk-800 ${n.state === 'short' ? 'border-hazard/70' : 'border-dusk-700'}`}>
            <div className="flex items-start justify-between gap-3">
              <div className="min-w-0">
                <p className="truncate font-bold">{n.name}</p>
                <p className="truncate text-xs text-ink-muted">{n.site_name}{n.purpose ? ` · ${n.purpose}` : ''}</p>
              </div>
              <StateGlyph state={n.state} size={20} />
            </div>
            <dl className="mt-3 grid grid-cols-2 gap-x-4 gap-y-2 text-sm">
              <Item term="Bank"><span className="figures">{formatVolts(n.volts)}</span></Item>
              <Item term="Charge"><SocValue soc={n.soc} /></Item>
              <Item term="Reserve"><ReserveValue joules={n.reserve_joules} /></Item>
              <Item term="Margin"><MarginValue margin={n.margin} /></Item>
              <Item term="Recharge"><LocalTime at={n.recharge_at} timeZone={n.time_zone} now={now} /></Item>
              <Item term="Brownout"><LocalTime at={n.brownout_at} timeZone={n.time_zone} now={now} empty="none projected" /></Item>
              <Item term="Last reading"><AgeValue at={n.last_reading_at} now={now} /></Item>
              <Item term="Draw (measured / model)"><DrawValue node={n} /></Item>
            </dl>
          </Link>
        </li>
      ))}
    </ul>
  );
}

function Item({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-xs text-ink-muted">{term}</dt>
      <dd>{children}</dd>
    </div>
  );
}
