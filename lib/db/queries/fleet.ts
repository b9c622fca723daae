import { db } from '../knex';
import { overVoltageFraction } from '../../alerts/kinds';
import { stateOfCharge } from '../../energy';
import { NODE_STATE_INFO, NODE_STATES, type NodeState } from '../../config/node-states';

export interface FleetRow {
  nodeId: number;
  name: string;
  purpose: string;
  siteId: number;
  siteName: string;
  timeZone: string;
  state: NodeState;
  volts: number | null;
  soc: number | null;
  energyJoules: number | null;
  reserveJoules: number | null;
  burstFloorVolts: number | null;
  margin: number | null;
  rechargeAt: Date | null;
  brownoutAt: Date | null;
  lastReadingAt: Date | null;
  loadWatts: number | null;
  measuredWatts: number | null;
  /** The draw the load profile predicts for the same night as measuredWatts. */
  modelledWatts: number | null;
  nextReportSeconds: number | null;
  evaluatedAt: Date | null;
  /** The bank's rated maximum, ns·Vr. */
  maxVolts: number;
}

/** Every live node of the organization with its latest status (volts calibrated, SoC energy-based). */
export async function listFleet(orgId: number): Promise<FleetRow[]> {
  const rows = await db()('nodes as n')
    .join('sites as s', 's.id', 'n.site_id')
    .leftJoin('node_status as st', 'st.node_id', 'n.id')
    .where('n.org_id', orgId)
    .whereNull('n.deleted_at')
    .select(
      'n.id as nodeId', 'n.name', 'n.purpose', 's.id as siteId', 's.name as siteName', 's.time_zone as timeZone',
      'st.state', 'st.volts', 'st.soc', 'st.energy_joules as energyJoules', 'st.reserve_joules as reserveJoules',
      'st.burst_floor_volts as burstFloorVolts', 'st.margin',
      'st.recharge_at as rechargeAt', 'st.brownout_at as brownoutAt', 'st.last_reading_at as lastReadingAt',
      'st.load_watts as loadWatts', 'st.measured_watts as measuredWatts', 'st.modelled_watts as modelledWatts', 'st.next_report_s as nextReportSeconds',
      'st.evaluated_at as evaluatedAt', 'n.cells_series as cellsSeries', 'n.cell_rated_volts as cellRatedVolts',
    );
  return rows.map(({ cellsSeries, cellRatedVolts, ...r }) => ({ ...r, state: (r.state ?? 'new') as NodeState, maxVolts: cellsSeries * cellRatedVolts }));
}

/** The fleet as GET /api/v1/fleet answers it: snake_case, RFC 3339 times, most at risk first. */
export interface FleetNodeWire {
  id: number;
  name: string;
  purpose: string;
  site_id: number;
  site_name: string;
  time_zone: string;
  state: NodeState;
  volts: number | null;
  /** The bank's rated maximum, ns·Vr (a reading above 98 % of it is over-voltage). */
  max_volts: number;
  soc: number | null;
  energy_joules: number | null;
  reserve_joules: number | null;
  burst_floor_volts: number | null;
  margin: number | null;
  recharge_at: string | null;
  brownout_at: string | null;
  last_reading_at: string | null;
  load_watts: number | null;
  measured_watts: number | null;
  /** The bank-side draw the settings predict for the night measured_watts was measured over. */
  modelled_watts: number | null;
  /** measured ÷ modelled bank-side draw; above 1 the node draws more than its settings say. */
  draw_ratio: number | null;
  next_report_s: number | null;
}

export interface FleetView {
  generated_at: string;
  counts: Record<NodeState, number>;
  earliest_brownout: { node_id: number; name: string; at: string; time_zone: string } | null;
  /** Short nodes whose projected brownout has passed with no report since (not yet called dark). */
  overdue_brownouts: { node_id: number; name: string; at: string; time_zone: string; last_reading_at: string | null }[];
  /** Nodes whose bank reads over 98 % of its rating: a hazard, whatever their margin. */
  over_voltage: { node_id: number; name: string; volts: number; max_volts: number }[];
  nodes: FleetNodeWire[];
}

const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);

/** Most at risk first: by state (NODE_STATE_INFO.riskRank), then by margin, then by name. */
export function compareRisk(a: { state: NodeState; margin: number | null; name: string }, b: typeof a): number {
  return (
    NODE_STATE_INFO[a.state].riskRank - NODE_STATE_INFO[b.state].riskRank ||
    (a.margin ?? Number.POSITIVE_INFINITY) - (b.margin ?? Number.POSITIVE_INFINITY) ||
    a.name.localeCompare(b.name)
  );
}

export function fleetRowToWire(r: FleetRow): FleetNodeWire {
  return {
    id: r.nodeId, name: r.name, purpose: r.purpose, site_id: r.siteId, site_name: r.siteName, time_zone: r.timeZone,
    state: r.state, volts: r.volts, max_volts: r.maxVolts, soc: r.soc, energy_joules: r.energyJoules, reserve_joules: r.reserveJoules,
    burst_floor_volts: r.burstFloorVolts, margin: r.margin, recharge_at: iso(r.rechargeAt), brownout_at: iso(r.brownoutAt),
    last_reading_at: iso(r.lastReadingAt), load_watts: r.loadWatts, measured_watts: r.measuredWatts, modelled_watts: r.modelledWatts,
    draw_ratio: r.measuredWatts != null && r.modelledWatts ? r.measuredWatts / r.modelledWatts : null,
    next_report_s: r.nextReportSeconds,
  };
}

export async function loadFleetView(orgId: number, now = new Date()): Promise<FleetView> {
  const nodes = (await listFleet(orgId)).map(fleetRowToWire).sort(compareRisk);
  const counts = Object.fromEntries(NODE_STATES.map((s) => [s, 0])) as Record<NodeState, number>;
  for (const n of nodes) counts[n.state] += 1;
  // Only nodes still reporting and short, and only brownouts still ahead: a brownout already
  // behind us belongs to a node that is (or is about to be called) dark.
  const shortBrownouts = nodes
    .filter((n) => n.state === 'short' && n.brownout_at)
    .sort((a, b) => Date.parse(a.brownout_at!) - Date.parse(b.brownout_at!));
  const earliest = shortBrownouts.find((n) => Date.parse(n.brownout_at!) > now.getTime());
  const overdue = shortBrownouts
    .filter((n) => Date.parse(n.brownout_at!) <= now.getTime())
    .map((n) => ({ node_id: n.id, name: n.name, at: n.brownout_at!, time_zone: n.time_zone, last_reading_at: n.last_reading_at }));
  const overVoltage = nodes
    .filter((n) => overVoltageFraction({ volts: n.volts, maxVolts: n.max_volts }) !== null)
    .map((n) => ({ node_id: n.id, name: n.name, volts: n.volts!, max_volts: n.max_volts }));
  return {
    generated_at: now.toISOString(),
    counts,
    earliest_brownout: earliest ? { node_id: earliest.id, name: earliest.name, at: earliest.brownout_at!, time_zone: earliest.time_zone } : null,
    overdue_brownouts: overdue,
    over_voltage: overVoltage,
    nodes,
  };
}

export interface OrgSite {
  id: number;
  name: string;
  lat: number;
  lon: number;
  time_zone: string;
  recharge_elevation_deg: number;
  node_count: number;
}

/** The organization's sites (for filters, the planner's site picker and the chart's nights). */
export async function listOrgSites(orgId: number): Promise<OrgSite[]> {
  const rows = await db()('sites as s')
    .leftJoin('nodes as n', function join() {
      this.on('n.site_id', 's.id').andOnNull('n.deleted_at');
    })
    .where('s.org_id', orgId)
    .groupBy('s.id', 's.name', 's.lat', 's.lon', 's.time_zone', 's.recharge_elevation_deg')
    .orderBy('s.name')
    .select('s.id', 's.name', 's.lat', 's.lon', 's.time_zone', 's.recharge_elevation_deg')
    .count({ node_count: 'n.id' });
  return rows.map((r) => ({ ...(r as unknown as OrgSite), node_count: Number(r.node_count) }));
}

/** The whole fleet's state of charge over a span, one line per node, for the fleet chart. */
export interface SocSeries {
  bucketSeconds: number;
  nodes: { id: number; name: string; state: NodeState; siteId: number }[];
  /** Bucket starts, Unix seconds. */
  t: number[];
  /** One array per node, aligned with `t`; null where the node sent nothing. */
  soc: (number | null)[][];
}

const ROLLUP_SECONDS = 300;

/**
 * From the 5-minute rollups, merged into wider buckets so that buckets × nodes stays within
 * `maxPoints` whatever the span. SoC is energy-based (lib/energy stateOfCharge) from the
 * calibrated bucket-average volts.
 */
export async function listSocSeries({ orgId, from, to, maxPoints = 3000 }: { orgId: number; from: Date; to: Date; maxPoints?: number }): Promise<SocSeries> {
  const nodes = await db()('nodes as n')
    .leftJoin('node_status as st', 'st.node_id', 'n.id')
    .where('n.org_id', orgId).whereNull('n.deleted_at').orderBy('n.name')
    .select('n.id', 'n.name', 'n.site_id as siteId', 'st.state', 'n.cells_series', 'n.cell_rated_volts', 'n.cutoff_volts', 'n.cal_gain', 'n.cal_offset_volts');
  const fromSeconds = Math.floor(from.getTime() / 1000);
  const spanSeconds = Math.max(ROLLUP_SECONDS, Math.ceil(to.getTime() / 1000) - fromSeconds);
  const bucketSeconds = Math.max(ROLLUP_SECONDS, Math.ceil((spanSeconds * Math.max(1, nodes.length)) / maxPoints / ROLLUP_SECONDS) * ROLLUP_SECONDS);
  const start = Math.floor(fromSeconds / bucketSeconds) * bucketSeconds;
  const slots = Math.max(1, Math.floor((fromSeconds + spanSeconds - start) / bucketSeconds));
  const t = Array.from({ length: slots }, (_, i) => start + i * bucketSeconds);
  const rows = nodes.length
    ? await db()('reading_rollups')
        .whereIn('node_id', nodes.map((n) => n.id))
        .where('bucket_seconds', ROLLUP_SECONDS)
        .where('bucket_start', '>=', new Date(start * 1000))
        .where('bucket_start', '<', new Date((start + slots * bucketSeconds) * 1000))
        .select('node_id', 'bucket_start', 'n', 'v_sum')
    : [];
  const sums = new Map<number, { v: Float64Array; n: Float64Array }>();
  for (const n of nodes) sums.set(n.id, { v: new Float64Array(slots), n: new Float64Array(slots) });
  for (const r of rows) {
    const slot = Math.floor((new Date(r.bucket_start).getTime() / 1000 - start) / bucketSeconds);
    const acc = sums.get(r.node_id);
    if (!acc || slot < 0 || slot >= slots) continue;
    acc.v[slot] += Number(r.v_sum);
    acc.n[slot] += Number(r.n);
  }
  const withData = nodes.filter((n) => sums.get(n.id)!.n.some((c) => c > 0));
  return {
    bucketSeconds,
    nodes: withData.map((n) => ({ id: n.id, name: n.name, state: (n.state ?? 'new') as NodeState, siteId: n.siteId })),
    t,
    soc: withData.map((n) => {
      const acc = sums.get(n.id)!;
      const maxVolts = n.cells_series * n.cell_rated_volts;
      return t.map((_, i) => {
        if (acc.n[i] === 0) return null;
        const volts = n.cal_gain * (acc.v[i] / acc.n[i]) + n.cal_offset_volts;
        return Math.round(stateOfCharge({ volts, cutoffVolts: n.cutoff_volts, maxVolts }) * 10_000) / 10_000;
      });
    }),
  };
}
