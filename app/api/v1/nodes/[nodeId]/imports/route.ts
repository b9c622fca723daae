import { getNodeInOrg } from '@/lib/db/queries/nodes';
import { ProblemError } from '@/lib/errors';
import { idParam, memberRoute } from '@/lib/http/route';
import { withUploadedFile } from '@/lib/http/multipart';
import { importCsvStream, listImports } from '@/lib/ingest/import-csv';

type P = { nodeId: string };

export const GET = memberRoute<undefined, P>({ permission: 'fleet:read' }, async ({ member, params }) => {
  const nodeId = idParam(params.nodeId, 'The node');
  await getNodeInOrg(member.orgId, nodeId);
  return Response.json({ imports: await listImports(member.orgId, nodeId) });
});

// multipart/form-data with one CSV file (header line t,v[,seq,vp,temp,rssi]); streamed.
export const POST = memberRoute<undefined, P>({ permission: 'imports:create' }, async ({ member, params, request }) => {
  const nodeId = idParam(params.nodeId, 'The node');
  const node = await getNodeInOrg(member.orgId, nodeId);
  const report = await withUploadedFile(request, { maxBytes: 200 * 1_048_576 }, ({ filename, stream }) =>
    importCsvStream({ orgId: member.orgId, nodeId, userId: member.userId, filename, stream, bank: node }),
  );
  // Failed includes "nothing imported": every line refused, so nothing was stored.
  if (report.status === 'failed') {
    const title = report.accepted === 0 && report.duplicates === 0 ? 'Nothing imported' : 'Import failed';
    throw new ProblemError(422, title, report.reason ?? 'The file could not be imported.', { import: report });
  }
  return Response.json(report, { status: 201 });
});
