import { listOutbox } from '@/lib/db/queries/alerts';
import { db } from '@/lib/db/knex';
import { problems } from '@/lib/errors';
import { memberRoute } from '@/lib/http/route';

// Owners see every e-mail of the organization (never the bodies): pending, held, sent, dead.
export const GET = memberRoute({ permission: 'org:settings' }, async ({ member, request }) => {
  const status = new URL(request.url).searchParams.get('status') ?? undefined;
  if (status && !['pending', 'sent', 'dead'].includes(status)) throw problems.badRequest('status is pending, sent or dead.');
  return Response.json({ messages: await listOutbox(db(), member.orgId, { status: status as 'pending' | 'sent' | 'dead' | undefined }) });
});
