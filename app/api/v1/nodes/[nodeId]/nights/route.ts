import { DEFAULT_NIGHT_COUNT, loadNightTable } from '@/lib/db/queries/nights';
import { idParam, memberRoute } from '@/lib/http/route';
import { nightsCsv } from '@/lib/series/csv';
import { downloadName } from '@/lib/series/csv-stream';
import { parseRangeQuery } from '@/lib/series/parse-query';

type P = { nodeId: string };

/**
 * GET /api/v1/nodes/{id}/nights?count=14[&format=csv] — the night-by-night table, newest first.
 * JSON: lib/series/wire.ts NightsReply (instants in Unix seconds). CSV: one line per night with
 * UTC and site-local times, as a download.
 */
export const GET = memberRoute<undefined, P>({ permission: 'fleet:read' }, async ({ member, params, request }) => {
  const nodeId = idParam(params.nodeId, 'The node');
  const query = parseRangeQuery({ request, defaultSeconds: 86_400 });
  const reply = await loadNightTable({ orgId: member.orgId, nodeId, count: query.count ?? DEFAULT_NIGHT_COUNT });
  if (query.format !== 'csv') return Response.json(reply, { headers: { 'cache-control': 'private, no-store' } });
  return new Response(nightsCsv({ nights: reply.nights, timeZone: reply.time_zone }), {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="${downloadName({ nodeName: reply.node_name, suffix: 'nights' })}"`,
      'cache-control': 'private, no-store',
    },
  });
});

