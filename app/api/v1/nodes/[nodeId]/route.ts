import { deleteNode, getNodeInOrg, nodeToWire, updateNode } from '@/lib/db/queries/nodes';
import { refreshStatusOfNodes } from '@/lib/db/queries/status';
import { problems } from '@/lib/errors';
import { idParam, memberRoute } from '@/lib/http/route';
import { bankFromWire, converterFromWire, crossFieldProblems, loadFromWire } from '@/lib/schemas/model';
import { nodeBody } from '@/lib/schemas/node';

type P = { nodeId: string };

export const GET = memberRoute<undefined, P>({ permission: 'fleet:read' }, async ({ member, params }) => {
  const node = await getNodeInOrg(member.orgId, idParam(params.nodeId, 'The node'));
  return Response.json(nodeToWire(node));
});

export const PUT = memberRoute<typeof nodeBody, P>({ permission: 'nodes:write', body: nodeBody }, async ({ member, body, params }) => {
  const nodeId = idParam(params.nodeId, 'The node');
  const cross = crossFieldProblems({ bank: bankFromWire(body.bank), converter: converterFromWire(body.converter), load: loadFromWire(body.load) });
  if (cross.length) throw problems.invalid(cross);
  await updateNode(member.orgId, nodeId, body);
  await refreshStatusOfNodes([nodeId]);
  return Response.json(nodeToWire(await getNodeInOrg(member.orgId, nodeId)));
});

export const DELETE = memberRoute<undefined, P>({ permission: 'nodes:write' }, async ({ member, params }) => {
  await deleteNode(member.orgId, idParam(params.nodeId, 'The node'));
  return new Response(null, { status: 204 });
});
