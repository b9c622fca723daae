import { acknowledgeAlert, listAlerts } from '@/lib/db/queries/alerts';
import { db } from '@/lib/db/knex';
import { problems } from '@/lib/errors';
import { idParam, memberRoute } from '@/lib/http/route';

type P = { alertId: string };

// Deployers and owners. Idempotent on an acknowledged alert; a resolved one has nothing to stop.
export const POST = memberRoute<undefined, P>({ permission: 'alerts:acknowledge' }, async ({ member, params }) => {
  const alertId = idParam(params.alertId, 'The alert');
  const result = await acknowledgeAlert(db(), { orgId: member.orgId, alertId, userId: member.userId });
  if (!result.found) throw problems.notFound('The alert');
  if (result.previous === 'resolved') throw problems.conflict('The alert is already resolved.');
  const [alert] = await listAlerts(db(), member.orgId, { alertId });
  return Response.json(alert);
});
