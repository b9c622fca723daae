import { z } from 'zod';
import { createCredential, listCredentials } from '@/lib/db/queries/credentials';
import { idParam, memberRoute } from '@/lib/http/route';

type P = { nodeId: string };
const createBody = z.object({ label: z.string().trim().max(120).regex(/^[^\r\n]*$/, 'Use one line.').default('') }).strict();

export const GET = memberRoute<undefined, P>({ permission: 'fleet:read' }, async ({ member, params }) => {
  return Response.json({ credentials: await listCredentials(member.orgId, idParam(params.nodeId, 'The node')) });
});

// The token is in this reply and nowhere else, ever: the caller must store it now.
export const POST = memberRoute<typeof createBody, P>({ permission: 'credentials:manage', body: createBody }, async ({ member, params, body }) => {
  const made = await createCredential({ orgId: member.orgId, nodeId: idParam(params.nodeId, 'The node'), label: body.label, userId: member.userId });
  return Response.json(made, { status: 201, headers: { 'cache-control': 'no-store' } });
});
