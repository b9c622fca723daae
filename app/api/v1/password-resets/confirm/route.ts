import { confirmPasswordReset } from '@/lib/db/queries/team';
import { publicRoute } from '@/lib/http/route';
import { resetConfirmBody } from '@/lib/schemas/team';

export const POST = publicRoute({ body: resetConfirmBody }, async ({ body }) => {
  await confirmPasswordReset(body);
  return Response.json({ ok: true });
});
