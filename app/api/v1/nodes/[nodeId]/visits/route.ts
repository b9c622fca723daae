import { createVisit, getVisitWire, listVisits } from '@/lib/db/queries/visits';
import { pointersFromZod, problems } from '@/lib/errors';
import { idParam, memberRoute } from '@/lib/http/route';
import { visitFields } from '@/lib/schemas/visit';
import { readVisitForm } from './read-visit-form';

type P = { nodeId: string };

export const GET = memberRoute<undefined, P>({ permission: 'fleet:read' }, async ({ member, params }) => {
  return Response.json({ visits: await listVisits(member.orgId, idParam(params.nodeId, 'The node')) });
});

// multipart/form-data: visited_on, work_done, and an optional `photo` (JPEG or PNG, ≤ 5 MB).
export const POST = memberRoute<undefined, P>({ permission: 'visits:write' }, async ({ member, params, request }) => {
  const nodeId = idParam(params.nodeId, 'The node');
  const { fields, photo } = await readVisitForm(request);
  const parsed = visitFields.safeParse(fields);
  if (!parsed.success) throw problems.invalid(pointersFromZod(parsed.error));
  const id = await createVisit({ orgId: member.orgId, nodeId, userId: member.userId, fields: parsed.data, photo });
  return Response.json(await getVisitWire(member.orgId, nodeId, id), { status: 201 });
});
