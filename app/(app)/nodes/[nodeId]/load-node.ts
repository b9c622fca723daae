import { notFound } from 'next/navigation';
import { cache } from 'react';
import { requireMember } from '@/lib/auth/guard';
import { loadNodeStatus } from '@/lib/db/queries/series';
import { ProblemError } from '@/lib/errors';

/**
 * The signed-in member and the node's status, once per request (React cache): the segment's
 * layout calls it before anything streams, so a missing node — or another organization's,
 * which looks the same — answers a real 404; the pages below reuse the same result.
 */
export const loadNodePage = cache(async (raw: string) => {
  const member = await requireMember('fleet:read');
  const nodeId = Number(raw);
  if (!Number.isSafeInteger(nodeId) || nodeId <= 0 || String(nodeId) !== raw) notFound();
  try {
    return { member, status: await loadNodeStatus({ orgId: member.orgId, nodeId }) };
  } catch (e) {
    if (e instanceof ProblemError && e.status === 404) notFound();
    throw e;
  }
});
