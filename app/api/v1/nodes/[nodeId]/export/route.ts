import { loadNodeInOrg, streamReadings } from '@/lib/db/queries/series';
import { retiredName } from '@/lib/db/queries/sites';
import { idParam, memberRoute } from '@/lib/http/route';
import { READINGS_CSV_HEADER, readingCsvLine, type ReadingCsvRow } from '@/lib/series/csv';
import { csvReadableStream, downloadName } from '@/lib/series/csv-stream';
import { parseRangeQuery } from '@/lib/series/parse-query';
import { calibratedVolts } from '@/lib/status/node-spec';

type P = { nodeId: string };
const DEFAULT_SPAN_SECONDS = 7 * 86_400;

/**
 * GET /api/v1/nodes/{id}/export?from=&to= — the node's readings in [from, to) as CSV (RFC 4180),
 * streamed from the database as the client reads (never built in memory), as a download.
 * Columns: t (RFC 3339 UTC), v_reported, v_calibrated, vp, temp_c, rssi_dbm, seq. A retired
 * node's readings are kept on record and export too (its site's page links to them).
 */
export const GET = memberRoute<undefined, P>({ permission: 'fleet:read' }, async ({ member, params, request }) => {
  const nodeId = idParam(params.nodeId, 'The node');
  const range = parseRangeQuery({ request, defaultSeconds: DEFAULT_SPAN_SECONDS });
  const { node } = await loadNodeInOrg({ orgId: member.orgId, nodeId, includeRetired: true });
  const from = new Date(range.fromSeconds * 1000);
  const to = new Date(range.toSeconds * 1000);
  const body = csvReadableStream<ReadingCsvRow>({
    header: READINGS_CSV_HEADER,
    rows: streamReadings({ nodeId, from, to }),
    toLine: (row) => readingCsvLine({ row, calibrate: (v) => calibratedVolts(node, v) }),
    onError: (error) => console.error('[export] stream failed', error),
  });
  const day = (d: Date) => d.toISOString().slice(0, 10);
  return new Response(body, {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="${downloadName({ nodeName: retiredName(node.name), suffix: `readings-${day(from)}-${day(to)}` })}"`,
      'cache-control': 'private, no-store',
    },
  });
});
