import Link from 'next/link';
import type { SiteWire } from '@/lib/schemas/site';

/** One site in the list: where it is, its zone, its recharge elevation, how many nodes stand on it. */
export function SiteCard({ site, canEdit }: { site: SiteWire; canEdit: boolean }) {
  return (
    <li className="min-w-0 rounded-xl border border-dusk-700 bg-dusk-900 p-4 [overflow-wrap:anywhere]" data-testid="site-row">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <Link href={`/sites/${site.id}`} className="font-bold text-ink underline-offset-2 hover:underline">{site.name}</Link>
        <span className="text-xs text-ink-muted">{site.live_nodes} node{site.live_nodes === 1 ? '' : 's'}</span>
      </div>
      <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-sm">
        <dt className="text-ink-faint">Position</dt><dd className="figures">{fmtLat(site.lat)}, {fmtLon(site.lon)}</dd>
        <dt className="text-ink-faint">Time zone</dt><dd>{site.time_zone}</dd>
        <dt className="text-ink-faint">Recharge at</dt><dd className="figures">{fmtDeg(site.recharge_elevation_deg)} sun elevation</dd>
      </dl>
      {canEdit ? <Link href={`/sites/${site.id}`} className="mt-3 inline-block rounded-md border border-dusk-600 px-3 py-1.5 text-sm hover:bg-dusk-800" data-testid="site-edit">Edit</Link> : null}
    </li>
  );
}

/** Positions as the site screens write them: 47.062° N, 120.541° W; an elevation as 3° or −0.833°. */
export const fmtLat = (d: number) => `${Math.abs(d).toFixed(3)}° ${d >= 0 ? 'N' : 'S'}`;
export const fmtLon = (d: number) => `${Math.abs(d).toFixed(3)}° ${d >= 0 ? 'E' : 'W'}`;
export const fmtDeg = (d: number) => `${Number(d.toFixed(3)).toString().replace('-', '−')}°`;
