import Link from 'next/link';
import { StateGlyph } from '@/components/state-glyph';
import { Term } from '@/components/ui/term';
import type { FleetNodeWire } from '@/lib/db/queries/fleet';
import { AgeValue, BankValue, DrawValue, isQuiet, LocalTime, MarginValue, QuietValue, ReserveValue, SocValue } from './fleet-values';

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
              <Term term="Bank"><BankValue volts={n.volts} maxVolts={n.max_volts} /></Term>
              <Term term="Charge"><SocValue soc={n.soc} /></Term>
              <Term term="Reserve"><ReserveValue joules={n.reserve_joules} /></Term>
              <Term term="Margin">{isQuiet(n.state) ? <QuietValue /> : <MarginValue margin={n.margin} node={n} />}</Term>
              <Term term="Recharge">{isQuiet(n.state) ? <QuietValue /> : <LocalTime at={n.recharge_at} timeZone={n.time_zone} now={now} />}</Term>
              <Term term="Brownout">{isQuiet(n.state) ? <QuietValue /> : <LocalTime at={n.brownout_at} timeZone={n.time_zone} now={now} empty="none projected" />}</Term>
              <Term term="Last reading"><AgeValue at={n.last_reading_at} now={now} /></Term>
              <Term term="Draw (measured / model)"><DrawValue node={n} /></Term>
            </dl>
          </Link>
        </li>
      ))}
    </ul>
  );
}
