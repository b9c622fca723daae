import { loadNodeStatus } from '@/lib/db/queries/series';
import { idParam, memberRoute } from '@/lib/http/route';

type P = { nodeId: string };

/**
 * GET /api/v1/nodes/{id}/status — the node's status as of now from its latest reading (state,
 * calibrated volts, energy-based state of charge, reserve, margin, recharge, brownout), the draw
 * measured over the latest night against the model, and the projection to recharge.
 * Reply: lib/series/wire.ts StatusReply; instants in Unix seconds (time_unit "s").
 */
export const GET = memberRoute<undefined, P>({ permission: 'fleet:read' }, async ({ member, params }) => {
  const reply = await loadNodeStatus({ orgId: member.orgId, nodeId: idParam(params.nodeId, 'The node') });
  return Response.json(reply, { headers: { 'cache-control': 'private, no-store' } });
});
