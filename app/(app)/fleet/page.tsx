import type { Metadata } from 'next';
import { StateGlyph } from '@/components/state-glyph';
import { requireMember } from '@/lib/auth/guard';
import { NODE_STATE_INFO, NODE_STATES } from '@/lib/config/node-states';
import { listFleet } from '@/lib/db/queries/fleet';
import { formatInTimeZone } from '@/lib/format/time';

export const metadata: Metadata = { title: 'Tonight' };

export default async function FleetPage() {
  const member = await requireMember('fleet:read');
  const fleet = (await listFleet(member.orgId)).sort(
    (a, b) => NODE_STATE_INFO[a.state].riskRank - NODE_STATE_INFO[b.state].riskRank || (a.margin ?? 99) - (b.margin ?? 99),
  );
  const counts = Object.fromEntries(NODE_STATES.map((s) => [s, fleet.filter((n) => n.state === s).length]));
  // Only nodes still reporting: a dark node's projected brownout is already behind it.
  const earliest = fleet.filter((n) => n.brownoutAt && (n.state === 'short' || n.state === 'thin')).sort((a, b) => +a.brownoutAt! - +b.brownoutAt!)[0];

  return (
    <section>
      <h1 className="text-2xl font-bold">Who makes it through tonight?</h1>
      <ul className="mt-4 flex flex-wrap gap-3" aria-label="Nodes per state" data-testid="state-counts">
        {NODE_STATES.map((s) => (
          <li key={s} className="flex items-center gap-2 rounded-lg border border-dusk-700 bg-dusk-900 px-3 py-2">
            <StateGlyph state={s} />
            <span className="figures text-lg">{counts[s]}</span>
          </li>
        ))}
      </ul>
      {earliest ? (
        <p className="mt-4 text-ink-muted" data-testid="earliest-brownout">
          Earliest projected brownout: <strong className="text-hazard">{earliest.name}</strong> at{' '}
          <span className="figures">{formatInTimeZone(earliest.brownoutAt!, earliest.timeZone)}</span>
        </p>
      ) : (
        <p className="mt-4 text-ink-muted">No node is projected to brown out before its next recharge.</p>
      )}
      <table className="mt-6 w-full text-left text-sm" data-testid="fleet-table">
        <thead className="text-xs uppercase tracking-wider text-ink-faint">
          <tr><th className="py-2">Node</th><th>State</th><th>Site</th><th className="text-right">Bank (V)</th><th className="text-right">Margin</th></tr>
        </thead>
        <tbody>
          {fleet.map((n) => (
            <tr key={n.nodeId} className="border-t border-dusk-800" data-testid="fleet-row">
              <td className="py-2 font-bold">{n.name}</td>
              <td><StateGlyph state={n.state} /></td>
              <td className="text-ink-muted">{n.siteName}</td>
              <td className="figures text-right">{n.volts?.toFixed(3) ?? '—'}</td>
              <td className="figures text-right">{n.margin != null ? n.margin.toFixed(2) : '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}
