import { db } from '../knex';
import type { NodeState } from '../../config/node-states';

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
  reserveJoules: number | null;
  margin: number | null;
  rechargeAt: Date | null;
  brownoutAt: Date | null;
  lastReadingAt: Date | null;
  loadWatts: number | null;
  measuredWatts: number | null;
}

/** Every live node of the organization with its latest status. */
export async function listFleet(orgId: number): Promise<FleetRow[]> {
  const rows = await db()('nodes as n')
    .join('sites as s', 's.id', 'n.site_id')
    .leftJoin('node_status as st', 'st.node_id', 'n.id')
    .where('n.org_id', orgId)
    .whereNull('n.deleted_at')
    .select(
      'n.id as nodeId', 'n.name', 'n.purpose', 's.id as siteId', 's.name as siteName', 's.time_zone as timeZone',
      'st.state', 'st.volts', 'st.soc', 'st.reserve_joules as reserveJoules', 'st.margin',
      'st.recharge_at as rechargeAt', 'st.brownout_at as brownoutAt', 'st.last_reading_at as lastReadingAt',
      'st.load_watts as loadWatts', 'st.measured_watts as measuredWatts',
    );
  return rows.map((r) => ({ ...r, state: (r.state ?? 'new') as NodeState }));
}
