import { changeRole, removeMember } from '@/lib/db/queries/team';
import { idParam, memberRoute } from '@/lib/http/route';
import { changeRoleBody } from '@/lib/schemas/team';

type P = { membershipId: string };

export const PATCH = memberRoute<typeof changeRoleBody, P>({ permission: 'team:manage', body: changeRoleBody }, async ({ member, body, params }) => {
  await changeRole({ orgId: member.orgId, membershipId: idParam(params.membershipId, 'The member'), role: body.role, byUserId: member.userId });
  return Response.json({ ok: true });
});

export const DELETE = memberRoute<undefined, P>({ permission: 'team:manage' }, async ({ member, params }) => {
  await removeMember({ orgId: member.orgId, membershipId: idParam(params.membershipId, 'The member'), byUserId: member.userId });
  return new Response(null, { status: 204 });
});
