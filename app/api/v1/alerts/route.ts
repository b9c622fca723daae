import { listAlerts } from '@/lib/db/queries/alerts';
import { db } from '@/lib/db/knex';
import { pointersFromZod, problems } from '@/lib/errors';
import { memberRoute } from '@/lib/http/route';
import { alertQuery } from '@/lib/schemas/alerts';

// Filters by site, node, kind, status and node state; each alert carries the state of its e-mails.
export const GET = memberRoute({ permission: 'fleet:read' }, async ({ member, request }) => {
  const parsed = alertQuery.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!parsed.success) throw problems.invalid(pointersFromZod(parsed.error, '/query'), 'Some filters are not valid.');
  const { site, node, kind, status, node_state: nodeState } = parsed.data;
  return Response.json({ alerts: await listAlerts(db(), member.orgId, { siteId: site, nodeId: node, kind, status, nodeState }) });
});
