import { listFleet } from '@/lib/db/queries/fleet';
import { createNode } from '@/lib/db/queries/nodes';
import { problems } from '@/lib/errors';
import { memberRoute } from '@/lib/http/route';
import { bankFromWire, converterFromWire, crossFieldProblems, loadFromWire } from '@/lib/schemas/model';
import { nodeBody } from '@/lib/schemas/node';

export const GET = memberRoute({ permission: 'fleet:read' }, async ({ member }) => {
  return Response.json({ nodes: await listFleet(member.orgId) });
});

export const POST = memberRoute({ permission: 'nodes:write', body: nodeBody }, async ({ member, body }) => {
  const cross = crossFieldProblems({ bank: bankFromWire(body.bank), converter: converterFromWire(body.converter), load: loadFromWire(body.load) });
  if (cross.length) throw problems.invalid(cross);
  const id = await createNode(member.orgId, body);
  return Response.json({ id }, { status: 201, headers: { location: `/api/v1/nodes/${id}` } });
});
