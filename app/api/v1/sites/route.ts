import { createSite, getSiteWire, listSites } from '@/lib/db/queries/sites';
import { memberRoute } from '@/lib/http/route';
import { siteBody } from '@/lib/schemas/site';

export const GET = memberRoute({ permission: 'fleet:read' }, async ({ member }) => {
  return Response.json({ sites: await listSites(member.orgId) });
});

export const POST = memberRoute({ permission: 'sites:write', body: siteBody }, async ({ member, body }) => {
  const id = await createSite(member.orgId, body);
  return Response.json(await getSiteWire(member.orgId, id), { status: 201, headers: { location: `/api/v1/sites/${id}` } });
});
