import type { Knex } from 'knex';
import { db } from '../knex';
import { problems } from '../../errors';
import type { VoltageSample } from '../../energy';
import { nightWindows } from '../../energy';
import { readingToFineRow, mergeIntoBuckets, type FineRow } from '../../series/aggregate';
import { bankFigures } from '../../series/bank-figures';
import { planBuckets, type BucketPlan } from '../../series/buckets';
import { buildSeriesColumns } from '../../series/build-series';
import { projectDischarge } from '../../series/projection';
import { buildStatusReply } from '../../series/status';
import type { SeriesReply, StatusReply } from '../../series/wire';
import { calibratedVolts, modelSpecFromRows, type NodeRow, type SiteRow } from '../../status/node-spec';

type Db = Knex | Knex.Transaction;
const toDate = (seconds: number) => new Date(seconds * 1000);
const toSeconds = (value: Date | string) => new Date(value).getTime() / 1000;

/**
 * A live node of the organization with its site, thresholds and last advised cadence; another
 * organization's node is 404. `includeRetired` also finds a retired node (its readings are kept
 * on record and can still be exported); everything else treats a retired node as gone.
 */
export async function loadNodeInOrg({ orgId, nodeId, knex = db(), includeRetired = false }: { orgId: number; nodeId: number; knex?: Db; includeRetired?: boolean }) {
  const query = knex('nodes as n')
    .join('sites as s', 's.id', 'n.site_id')
    .join('organizations as o', 'o.id', 'n.org_id')
    .leftJoin('node_status as st', 'st.node_id', 'n.id')
    .where({ 'n.id': nodeId, 'n.org_id': orgId });
  if (!includeRetired) query.whereNull('n.deleted_at');
  const row = await query
    .first('n.*', 's.name as site_name', 's.lat', 's.lon', 's.time_zone', 's.recharge_elevation_deg', 'o.steady_margin', 'o.thin_margin', 'st.next_report_s as advised_s');
  if (!row) throw problems.notFound('The node');
  const site: SiteRow = { id: row.site_id, lat: row.lat, lon: row.lon, time_zone: row.time_zone, recharge_elevation_deg: row.recharge_elevation_deg };
  const node = row as NodeRow & { purpose: string };
  return {
    node,
    site,
    siteName: row.site_name as string,
    spec: modelSpecFromRows(node, site),
    thresholds: { steady: row.steady_margin as number, thin: row.thin_margin as number },
    advisedSeconds: (row.advised_s as number | null) ?? null,
  };
}
export type LoadedNode = Awaited<ReturnType<typeof loadNodeInOrg>>;

/** Rollup rows of one width in [from, to): a range on the primary key (node_id, bucket_seconds, bucket_start). */
export function rollupRowsQuery({ knex = db(), nodeId, readSeconds, from, to }: { knex?: Db; nodeId: number; readSeconds: number; from: Date; to: Date }) {
  return knex('reading_rollups')
    .where({ node_id: nodeId, bucket_seconds: readSeconds })
    .andWhere('bucket_start', '>=', from)
    .andWhere('bucket_start', '<', to)
    .orderBy('bucket_start')
    .select('bucket_start', 'n', 'v_min', 'v_max', 'v_sum', 'v_last', 't_last', 'vp_max');
}

/** Raw readings in [from, to): a range on the primary key (node_id, t), pruned to the months it spans. */
export function readingRowsQuery({ knex = db(), nodeId, from, to }: { knex?: Db; nodeId: number; from: Date; to: Date }) {
  return knex('readings').where('node_id', nodeId).andWhere('t', '>=', from).andWhere('t', '<', to).orderBy('t');
}

/**
 * The rows of a plan. A raw range with no raw readings may be one whose month partition the
 * retention pass dropped: it is then drawn from the 5-minute rollups, which are kept.
 */
async function readFineRows({ nodeId, plan }: { nodeId: number; plan: BucketPlan }): Promise<{ rows: FineRow[]; plan: BucketPlan }> {
  const from = toDate(plan.fromSeconds);
  const to = toDate(plan.toSeconds);
  if (plan.readSeconds === 0) {
    const rows = await readingRowsQuery({ nodeId, from, to }).select('t', 'v', 'vp');
    if (rows.length) return { plan, rows: rows.map((r) => readingToFineRow({ t: toSeconds(r.t), v: Number(r.v), vp: r.vp === null ? null : Number(r.vp) })) };
    const w = 300;
    const coarse: BucketPlan = { bucketSeconds: w, source: 'rollup-300', readSeconds: w, fromSeconds: Math.floor(plan.fromSeconds / w) * w, toSeconds: Math.ceil(plan.toSeconds / w) * w };
    return readFineRows({ nodeId, plan: coarse });
  }
  const rows = await rollupRowsQuery({ nodeId, readSeconds: plan.readSeconds, from, to });
  return { plan, rows: rows.map((r) => ({
    t: toSeconds(r.bucket_start), n: Number(r.n), vMin: Number(r.v_min), vMax: Number(r.v_max), vSum: Number(r.v_sum),
    vLast: Number(r.v_last), tLast: toSeconds(r.t_last), vpMax: r.vp_max === null ? null : Number(r.vp_max),
  })) };
}

/** The latest reading at or before `now` (a reading stamped ahead of the clock is not "latest" yet). */
export async function latestReadingBefore({ nodeId, now, knex = db() }: { nodeId: number; now: Date; knex?: Db }) {
  const row = await knex('readings').where('node_id', nodeId).andWhere('t', '<=', now).orderBy('t', 'desc').first('t', 'v', 'vp');
  return row ? { t: new Date(row.t), v: Number(row.v), vp: row.vp === null ? null : Number(row.vp) } : null;
}

/** Calibrated samples in [from, to] for the fits (measured draw, night table). */
export async function readSamples({ loaded, from, to }: { loaded: LoadedNode; from: Date; to: Date }): Promise<VoltageSample[]> {
  const rows = await db()('readings').where('node_id', loaded.node.id).andWhere('t', '>=', from).andWhere('t', '<=', to).orderBy('t').select('t', 'v', 'vp');
  return rows.map((r) => ({ t: new Date(r.t), volts: calibratedVolts(loaded.node, Number(r.v)), ...(r.vp === null ? {} : { panelVolts: Number(r.vp) }) }));
}

export async function loadNodeSeries(opts: { orgId: number; nodeId: number; fromSeconds: number; toSeconds: number; buckets: number; now?: Date }): Promise<SeriesReply> {
  const now = opts.now ?? new Date();
  const loaded = await loadNodeInOrg({ orgId: opts.orgId, nodeId: opts.nodeId });
  const read = await readFineRows({ nodeId: opts.nodeId, plan: planBuckets({ fromSeconds: opts.fromSeconds, toSeconds: opts.toSeconds, maxBuckets: opts.buckets }) });
  const plan = read.plan;
  const bank = bankFigures({ spec: loaded.spec });
  const buckets = mergeIntoBuckets({ rows: read.rows, bucketSeconds: plan.bucketSeconds });
  const calibration = { gain: loaded.node.cal_gain, offsetVolts: loaded.node.cal_offset_volts };
  const columns = buildSeriesColumns({ buckets, calibration, bankFarads: bank.farads, burstFloorVolts: bank.burst_floor_volts });
  const latest = await latestReadingBefore({ nodeId: opts.nodeId, now });
  const projection = latest ? projectDischarge({ spec: loaded.spec, volts: calibratedVolts(loaded.node, latest.v), at: latest.t }) : null;
  // Nights reach past the range's end when the projection does, so its own night is shaded too.
  const nightsTo = Math.max(opts.toSeconds, projection?.recharge_at ?? 0, projection?.t.at(-1) ?? 0);
  const nights = nightWindows({ site: loaded.spec.site, from: toDate(opts.fromSeconds), to: toDate(nightsTo) });
  return {
    time_unit: 's',
    node_id: opts.nodeId,
    time_zone: loaded.site.time_zone,
    from: opts.fromSeconds,
    to: opts.toSeconds,
    bucket_seconds: plan.bucketSeconds,
    source: plan.source,
    count: columns.t.length,
    buckets: columns,
    has_panel: columns.vp_max.some((v) => v !== null),
    nights: nights.map((w) => ({ start: w.start.getTime() / 1000, end: w.end.getTime() / 1000 })),
    bank,
    projection,
  };
}

/** Readings of a range for the CSV export, as a stream: rows flow out as the database sends them. */
export function streamReadings({ nodeId, from, to }: { nodeId: number; from: Date; to: Date }) {
  return readingRowsQuery({ nodeId, from, to }).select('t', 'v', 'vp', 'temp_c', 'rssi_dbm', 'seq').stream();
}

const MEASURE_LOOKBACK_MS = 48 * 3_600_000; // the latest night, as the margin pass looks for it

/** Latest status of one node for the page's first paint and its polling. */
export async function loadNodeStatus({ orgId, nodeId, now = new Date() }: { orgId: number; nodeId: number; now?: Date }): Promise<StatusReply> {
  const loaded = await loadNodeInOrg({ orgId, nodeId });
  const last = await latestReadingBefore({ nodeId, now });
  const samples = last ? await readSamples({ loaded, from: new Date(now.getTime() - MEASURE_LOOKBACK_MS), to: now }) : [];
  const { node, site } = loaded;
  return buildStatusReply({
    node: { id: node.id, name: node.name, purpose: node.purpose ?? '', site_id: site.id, site_name: loaded.siteName, time_zone: site.time_zone },
    spec: loaded.spec,
    thresholds: loaded.thresholds,
    advisedSeconds: loaded.advisedSeconds,
    latest: last ? { t: last.t, volts: calibratedVolts(node, last.v), panelVolts: last.vp } : null,
    samples,
    now,
  });
}
