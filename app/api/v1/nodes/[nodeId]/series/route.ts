import { loadNodeSeries } from '@/lib/db/queries/series';
import { idParam, memberRoute } from '@/lib/http/route';
import { parseRangeQuery } from '@/lib/series/parse-query';

type P = { nodeId: string };
const DEFAULT_SPAN_SECONDS = 3 * 86_400;

/**
 * GET /api/v1/nodes/{id}/series?from=&to=&buckets= — the node's charts, downsampled on the server.
 * from/to: Unix seconds, Unix ms or RFC 3339 (default: the last 3 days); buckets: 10…2000
 * (default 1000). Reply: lib/series/wire.ts SeriesReply — every instant in Unix seconds
 * (time_unit "s"), calibrated volts, energy and reserve in joules, the nights of the range,
 * the bank's floor and cutoff, and the projection from the latest reading to recharge.
 */
export const GET = memberRoute<undefined, P>({ permission: 'fleet:read' }, async ({ member, params, request }) => {
  const nodeId = idParam(params.nodeId, 'The node');
  const range = parseRangeQuery({ request, defaultSeconds: DEFAULT_SPAN_SECONDS });
  const reply = await loadNodeSeries({ orgId: member.orgId, nodeId, fromSeconds: range.fromSeconds, toSeconds: range.toSeconds, buckets: range.buckets });
  return Response.json(reply, { headers: { 'cache-control': 'private, no-store' } });
});
