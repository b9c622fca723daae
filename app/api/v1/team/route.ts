import { listMembersOfOrg } from '@/lib/db/queries/people';
import { listInvitations } from '@/lib/db/queries/team';
import { memberRoute } from '@/lib/http/route';

export const GET = memberRoute({ permission: 'team:manage' }, async ({ member }) => {
  const [members, invitations] = await Promise.all([listMembersOfOrg(member.orgId), listInvitations(member.orgId)]);
  return Response.json({
    members: members.map((m) => ({ membershipId: m.membershipId, email: m.email, name: m.name, role: m.role })),
    invitations,
  });
});
