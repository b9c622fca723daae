import { revokeCredential } from '@/lib/db/queries/credentials';
import { idParam, memberRoute } from '@/lib/http/route';

type P = { nodeId: string; credentialId: string };

export const DELETE = memberRoute<undefined, P>({ permission: 'credentials:manage' }, async ({ member, params }) => {
  await revokeCredential({ orgId: member.orgId, nodeId: idParam(params.nodeId, 'The node'), id: idParam(params.credentialId, 'The credential'), userId: member.userId });
  return new Response(null, { status: 204 });
});
