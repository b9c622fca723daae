import Link from 'next/link';
import { StateGlyph } from '@/components/state-glyph';
import type { FleetNodeWire } from '@/lib/db/queries/fleet';
import { AgeValue, BankValue, DrawValue, isQuiet, LocalTime, MarginValue, QuietValue, ReserveValue, SocValue } from './fleet-values';
import type { SortDirection, SortKey } from './sort-fleet';

const COLUMNS: { label: string; unit?: string; sort?: SortKey; right?: boolean }[] = [
  { label: 'Node', sort: 'name' },
  { label: 'State', sort: 'risk' },
  { label: 'Bank', unit: 'V', sort: 'volts', right: true },
  { label: 'Charge', unit: 'energy', sort: 'soc' },
  { label: 'Reserve', unit: 'J, Wh', sort: 'reserve', right: true },
  { label: 'Margin', sort: 'margin', right: true },
  { label: 'Recharge', unit: 'site time' },
  { label: 'Brownout', unit: 'site time', sort: 'brownout' },
  { label: 'Last reading', sort: 'age' },
  { label: 'Draw', unit: 'measured / model', sort: 'draw', right: true },
];

/** The desktop table (hidden on phones, where the cards stand in). */
export function FleetTable({ nodes, now, sortKey, direction, onSort }: { nodes: FleetNodeWire[]; now: string; sortKey: SortKey; direction: SortDirection; onSort: (k: SortKey, d: SortDirection) => void }) {
  return (
    <div className="mt-4 hidden overflow-x-auto md:block">
      <table className="w-full min-w-[1040px] text-left text-sm" data-testid="fleet-table">
        <caption className="sr-only">Nodes, most at risk first unless sorted otherwise</caption>
        <thead className="text-xs text-ink-muted">
          <tr>
            {COLUMNS.map((c) => {
              const active = c.sort === sortKey;
              return (
                <th key={c.label} scope="col" className={`py-2 pr-3 align-bottom font-bold ${c.right ? 'text-right' : ''}`}
                  aria-sort={active ? (direction === 'asc' ? 'ascending' : 'descending') : undefined}>
                  {c.sort ? (
                    <button type="button" className="inline-flex items-center gap-1 rounded hover:text-ink" data-testid={`sort-${c.sort}`}
                      onClick={() => onSort(c.sort!, active && direction === 'asc' ? 'desc' : 'asc')}>
                      {c.label}
                      <span aria-hidden="true" className={active ? 'text-tide' : 'text-dusk-600'}>{active ? (direction === 'asc' ? '▲' : '▼') : '↕'}</span>
                    </button>
                  ) : c.label}
                  {c.unit ? <span className="block font-normal text-ink-faint">{c.unit}</span> : null}
                </th>
              );
            })}
          </tr>
        </thead>
        <tbody>
          {nodes.map((n) => (
            <tr key={n.id} className="border-t border-dusk-800 align-top hover:bg-dusk-900" data-testid="fleet-row" data-state={n.state}>
              <td className="py-2.5 pr-3">
                <Link href={`/nodes/${n.id}`} className="font-bold text-ink underline-offset-2 hover:underline">{n.name}</Link>
                <span className="block text-xs text-ink-muted">{n.site_name}{n.purpose ? ` · ${n.purpose}` : ''}</span>
              </td>
              <td className="whitespace-nowrap py-2.5 pr-3"><StateGlyph state={n.state} /></td>
              <td className="whitespace-nowrap py-2.5 pr-3 text-right"><BankValue volts={n.volts} maxVolts={n.max_volts} /></td>
              <td className="whitespace-nowrap py-2.5 pr-3"><SocValue soc={n.soc} /></td>
              <td className="whitespace-nowrap py-2.5 pr-3 text-right"><ReserveValue joules={n.reserve_joules} /></td>
              <td className="whitespace-nowrap py-2.5 pr-3 text-right">{isQuiet(n.state) ? <QuietValue /> : <MarginValue margin={n.margin} node={n} />}</td>
              <td className="whitespace-nowrap py-2.5 pr-3">{isQuiet(n.state) ? <QuietValue /> : <LocalTime at={n.recharge_at} timeZone={n.time_zone} now={now} />}</td>
              <td className="whitespace-nowrap py-2.5 pr-3">{isQuiet(n.state) ? <QuietValue /> : <LocalTime at={n.brownout_at} timeZone={n.time_zone} now={now} empty="none projected" />}</td>
              <td className="whitespace-nowrap py-2.5 pr-3"><AgeValue at={n.last_reading_at} now={now} /></td>
              <td className="whitespace-nowrap py-2.5 text-right"><DrawValue node={n} /></td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
