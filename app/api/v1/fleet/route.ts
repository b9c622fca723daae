import { loadFleetView } from '@/lib/db/queries/fleet';
import { memberRoute } from '@/lib/http/route';

// The fleet's live status (any member): counts per state, the earliest projected brownout,
// and every node most at risk first. The fleet page polls this.
export const GET = memberRoute({ permission: 'fleet:read' }, async ({ member }) => {
  return Response.json(await loadFleetView(member.orgId), { headers: { 'cache-control': 'no-store' } });
});
