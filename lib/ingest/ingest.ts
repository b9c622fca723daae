import { refreshNodeStatus } from '../db/queries/status';
import { storeReadings } from '../db/queries/readings';
import { rebuildRollups } from '../db/queries/rollups';
import { db } from '../db/knex';
import { ProblemError, problems } from '../errors';
import { parseIngestBody } from './body';
import { authenticateDevice } from './device-auth';
import { takeToken } from './rate-limit';

/**
 * POST /api/v1/readings (DESIGN.md §5). The fixed order: authenticate the device → rate limit
 * → parse and validate the whole post → store it in one transaction → only after the commit
 * returned, answer 200. Storage down or uncertain → 503 with Retry-After; nothing half stored.
 */
export async function ingest(request: Request): Promise<Response> {
  const receivedAt = new Date();
  const device = await storage(() => authenticateDevice(request));
  const limit = takeToken(device.nodeId);
  if (!limit.ok) throw problems.tooMany(limit.retryAfterSeconds);
  const readings = await parseIngestBody(request, receivedAt);
  const result = await storage(() => storeReadings(device.nodeId, readings));

  // The readings are durable now. Status and rollups follow; if they fail, the job runner
  // recomputes them on its next pass, so the device still gets its 200.
  let state = 'new';
  let nextReportSeconds = 0;
  try {
    if (result.stored.length) {
      const times = result.stored.map((r) => r.t.getTime());
      await rebuildRollups(db(), device.nodeId, new Date(Math.min(...times)), new Date(Math.max(...times)));
    }
    const status = await refreshNodeStatus(device.nodeId, receivedAt);
    state = status?.state ?? 'new';
    nextReportSeconds = status?.next_report_s ?? 0;
  } catch (e) {
    console.error('[ingest] status refresh failed after commit', e);
    const row = await db()('node_status').where({ node_id: device.nodeId }).first('state', 'next_report_s').catch(() => null);
    state = row?.state ?? 'new';
    nextReportSeconds = row?.next_report_s ?? 0;
  }
  if (!nextReportSeconds) nextReportSeconds = (await db()('nodes').where({ id: device.nodeId }).first('interval_seconds').catch(() => null))?.interval_seconds ?? 300;
  return Response.json({ accepted: result.accepted, duplicates: result.duplicates, state, next_report_s: nextReportSeconds });
}

/** Any failure to reach or commit to storage: the device should simply retry later. */
async function storage<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (e) {
    if (e instanceof ProblemError) throw e;
    console.error('[ingest] storage unavailable', (e as Error).message);
    throw problems.unavailable(5);
  }
}
