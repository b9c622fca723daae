import type { Knex } from 'knex';
import { applyRollupDeltas } from '../db/queries/rollups';
import { storeReadings } from '../db/queries/readings';
import { ProblemError, problems } from '../errors';
import { deriveNodeStatus } from '../status/derive-status';
import { calibratedVolts, modelSpecFromRows } from '../status/node-spec';
import { parseIngestBody, type IngestRequest } from './body';
import { authenticateDevice, type DeviceContext } from './device-auth';
import { distinctTimes, type NormalizedReading } from './normalize';
import { takeToken } from './rate-limit';
import { statusUpsert } from './status-upsert';
import { storeAllNewGrouped } from './store-fast';

/**
 * POST /api/v1/readings (DESIGN.md §5). The fixed order: authenticate the device (one query
 * that also loads the node's model) → rate limit → parse and validate the whole post → store
 * the readings, fold them into the chart rollups and update the node's status in ONE
 * transaction (sent as one packet when every reading is new, together with the other posts
 * that arrived meanwhile; the careful path sorts out duplicates) → only after the commit
 * returned, answer 200. Storage down or uncertain → 503 with Retry-After; nothing half stored.
 */
export interface IngestReply {
  accepted: number;
  duplicates: number;
  state: string;
  next_report_s: number;
}

/** As a web Response (Next's route handler). */
export async function ingest(request: IngestRequest): Promise<Response> {
  return Response.json(await ingestReply(request));
}

/** The 200 reply's body; any refusal is thrown as a ProblemError. */
export async function ingestReply(request: IngestRequest): Promise<IngestReply> {
  const receivedAt = new Date();
  const device = await storage(() => authenticateDevice(request));
  const limit = takeToken(device.nodeId);
  if (!limit.ok) throw problems.tooMany(limit.retryAfterSeconds);
  const readings = await parseIngestBody(request, receivedAt);
  let reply = { state: device.state ?? 'new', next_report_s: device.nextReportSeconds ?? device.node.interval_seconds };
  if (readings.length <= 500 && distinctTimes(readings)) {
    const status = statusAfter(device, readings, receivedAt);
    if (await storage(() => storeAllNewGrouped({ nodeId: device.nodeId, orgId: device.orgId, readings, status }))) {
      if (status) reply = { state: status.state, next_report_s: status.next_report_s ?? device.node.interval_seconds };
      return { accepted: readings.length, duplicates: 0, ...reply };
    }
  }
  const result = await storage(() =>
    storeReadings(device.nodeId, readings, {
      within: async (trx, fresh) => {
        await applyRollupDeltas(trx, device.nodeId, fresh);
        reply = (await updateStatus(trx, device, fresh, receivedAt)) ?? reply;
      },
    }),
  );
  return { accepted: result.accepted, duplicates: result.duplicates, ...reply };
}

/** The node's status from the newest reading, when this post brings a newer one. */
function statusAfter(device: DeviceContext, fresh: NormalizedReading[], now: Date) {
  if (!fresh.length) return null;
  const newest = fresh.reduce((a, b) => (b.t > a.t ? b : a));
  if (device.lastReadingAt && newest.t <= device.lastReadingAt) return null;
  return deriveNodeStatus({
    spec: modelSpecFromRows(device.node, device.site),
    latest: { t: newest.t, volts: calibratedVolts(device.node, newest.v), panelVolts: newest.vp },
    now,
    thresholds: device.thresholds,
    drawScale: device.drawScale,
  });
}

async function updateStatus(trx: Knex.Transaction, device: DeviceContext, fresh: NormalizedReading[], now: Date) {
  const status = statusAfter(device, fresh, now);
  if (!status) return null;
  const upsert = statusUpsert(device.nodeId, device.orgId, status);
  await trx.raw(upsert.sql, upsert.bindings as Knex.RawBinding[]);
  return { state: status.state, next_report_s: status.next_report_s ?? device.node.interval_seconds };
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
