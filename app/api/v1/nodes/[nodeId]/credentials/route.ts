import { createCredential, listCredentials } from '@/lib/db/queries/credentials';
import { idParam, memberRoute } from '@/lib/http/route';
import { createCredentialBody as createBody } from '@/lib/schemas/credential';

type P = { nodeId: string };

export const GET = memberRoute<undefined, P>({ permission: 'fleet:read' }, async ({ member, params }) => {
  return Response.json({ credentials: await listCredentials(member.orgId, idParam(params.nodeId, 'The node')) });
});

// The token is in this reply and nowhere else, ever: the caller must store it now.
export const POST = memberRoute<typeof createBody, P>({ permission: 'credentials:manage', body: createBody }, async ({ member, params, body }) => {
  const made = await createCredential({ orgId: member.orgId, nodeId: idParam(params.nodeId, 'The node'), label: body.label, userId: member.userId });
  return Response.json(made, { status: 201, headers: { 'cache-control': 'no-store' } });
});
