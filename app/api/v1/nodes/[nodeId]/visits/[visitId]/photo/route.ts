import { readVisitPhoto } from '@/lib/db/queries/visits';
import { idParam, memberRoute } from '@/lib/http/route';

type P = { nodeId: string; visitId: string };

// Photos never sit in a public folder: each request is a signed-in member of the node's organization.
export const GET = memberRoute<undefined, P>({ permission: 'fleet:read' }, async ({ member, params }) => {
  const photo = await readVisitPhoto(member.orgId, idParam(params.nodeId, 'The node'), idParam(params.visitId, 'The visit'));
  return new Response(new Uint8Array(photo.bytes), {
    headers: { 'content-type': photo.type, 'x-content-type-options': 'nosniff', 'cache-control': 'private, max-age=3600', 'content-security-policy': "default-src 'none'" },
  });
});
