import { deleteSite, getSiteWire, updateSite } from '@/lib/db/queries/sites';
import { nodeIdsOfSite, refreshStatusOfNodes } from '@/lib/db/queries/status';
import { idParam, memberRoute } from '@/lib/http/route';
import { siteBody } from '@/lib/schemas/site';

type P = { siteId: string };

export const GET = memberRoute<undefined, P>({ permission: 'fleet:read' }, async ({ member, params }) => {
  return Response.json(await getSiteWire(member.orgId, idParam(params.siteId, 'The site')));
});

export const PUT = memberRoute<typeof siteBody, P>({ permission: 'sites:write', body: siteBody }, async ({ member, params, body }) => {
  const siteId = idParam(params.siteId, 'The site');
  await updateSite(member.orgId, siteId, body);
  // Its nodes' recharge times and margins follow the new place, zone or recharge elevation.
  await refreshStatusOfNodes(await nodeIdsOfSite(member.orgId, siteId));
  return Response.json(await getSiteWire(member.orgId, siteId));
});

// 409 while nodes stand on the site (lib/db/queries/sites.ts says why deleted ones count).
export const DELETE = memberRoute<undefined, P>({ permission: 'sites:write' }, async ({ member, params }) => {
  await deleteSite(member.orgId, idParam(params.siteId, 'The site'));
  return new Response(null, { status: 204 });
});
