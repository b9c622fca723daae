import { acceptInvitation } from '@/lib/db/queries/team';
import { publicRoute } from '@/lib/http/route';
import { acceptInvitationBody } from '@/lib/schemas/team';

export const POST = publicRoute({ body: acceptInvitationBody }, async ({ body }) => {
  const { email, existingAccount } = await acceptInvitation(body);
  return Response.json({ email, existing_account: existingAccount }, { status: 201 });
});
