import { nightWindows } from '@/lib/energy';
import { problems } from '@/lib/errors';
import { listOrgSites, listSocSeries } from '@/lib/db/queries/fleet';
import { memberRoute } from '@/lib/http/route';

/**
 * GET /api/v1/fleet/soc-series?hours=48 (1–168): every node's energy-based state of charge
 * from the 5-minute rollups, at most 3000 points in all, with the nights of the site holding
 * most nodes (the chart shades one set of nights; the demo's sites share a valley).
 * Reply: {from, to, bucket_seconds, time_zone, nights: [{from, to}], nodes: [{id, name,
 * state, site_id}], t: [unix s], soc: [[0..1 | null per t] per node]}.
 */
const MAX_POINTS = 3000;

export const GET = memberRoute({ permission: 'fleet:read' }, async ({ member, request }) => {
  const raw = new URL(request.url).searchParams.get('hours') ?? '48';
  const hours = Number(raw);
  if (!Number.isInteger(hours) || hours < 1 || hours > 168) {
    throw problems.invalid([{ pointer: '/hours', detail: 'Give whole hours from 1 to 168.' }]);
  }
  const to = new Date();
  const from = new Date(to.getTime() - hours * 3_600_000);
  const [series, sites] = await Promise.all([listSocSeries({ orgId: member.orgId, from, to, maxPoints: MAX_POINTS }), listOrgSites(member.orgId)]);
  const main = [...sites].sort((a, b) => b.node_count - a.node_count)[0];
  const nights = main
    ? nightWindows({ site: { lat: main.lat, lon: main.lon, rechargeElevationDeg: main.recharge_elevation_deg }, from, to }).map((w) => ({
        from: Math.floor(w.start.getTime() / 1000),
        to: Math.ceil(w.end.getTime() / 1000),
      }))
    : [];
  return Response.json(
    {
      from: from.toISOString(),
      to: to.toISOString(),
      bucket_seconds: series.bucketSeconds,
      time_zone: main?.time_zone ?? 'UTC',
      nights,
      nodes: series.nodes.map((n) => ({ id: n.id, name: n.name, state: n.state, site_id: n.siteId })),
      t: series.t,
      soc: series.soc,
    },
    { headers: { 'cache-control': 'no-store' } },
  );
});
