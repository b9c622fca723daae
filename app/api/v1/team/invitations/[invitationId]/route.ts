import { cancelInvitation } from '@/lib/db/queries/team';
import { idParam, memberRoute } from '@/lib/http/route';

type P = { invitationId: string };

// Cancelling is the same capability as inviting; another organization's invitation is 404.
export const DELETE = memberRoute<undefined, P>({ permission: 'team:manage' }, async ({ member, params }) => {
  await cancelInvitation({ orgId: member.orgId, invitationId: idParam(params.invitationId, 'The invitation'), byUserId: member.userId });
  return new Response(null, { status: 204 });
});
