import { createInvitation } from '@/lib/db/queries/team';
import { getEnv } from '@/lib/env';
import { memberRoute } from '@/lib/http/route';
import { inviteBody } from '@/lib/schemas/team';

// The link goes out by e-mail through the outbox and is also shown once to the inviting owner.
export const POST = memberRoute({ permission: 'team:manage', body: inviteBody }, async ({ member, body }) => {
  const { link, expiresAt } = await createInvitation({ orgId: member.orgId, orgName: member.orgName, email: body.email, role: body.role, byUserId: member.userId, appUrl: getEnv().APP_URL });
  return Response.json({ link, expiresAt }, { status: 201 });
});
