import { clientAddress } from '@/lib/auth/options';
import { requestPasswordReset } from '@/lib/db/queries/team';
import { getEnv } from '@/lib/env';
import { publicRoute } from '@/lib/http/route';
import { resetRequestBody } from '@/lib/schemas/team';

// The same 202 whether or not the address has an account.
export const POST = publicRoute({ body: resetRequestBody }, async ({ body, request }) => {
  await requestPasswordReset({ email: body.email, appUrl: getEnv().APP_URL, ip: clientAddress(request.headers) });
  return Response.json({ ok: true, detail: 'If that address has an account, a reset link is on its way.' }, { status: 202 });
});
