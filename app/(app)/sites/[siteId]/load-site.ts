import { notFound, redirect } from 'next/navigation';
import { cache } from 'react';
import { currentMember } from '@/lib/auth/guard';
import { getSiteWire } from '@/lib/db/queries/sites';
import { ProblemError } from '@/lib/errors';

/**
 * The signed-in member and the site, once per request (React cache): the segment's layout
 * calls it before anything streams, so a missing site — or another organization's, which
 * looks the same — answers a real 404 rather than a 200 page saying "not found".
 */
export const loadSitePage = cache(async (raw: string) => {
  const member = await currentMember();
  if (!member) redirect('/sign-in');
  const siteId = Number(raw);
  if (!Number.isSafeInteger(siteId) || siteId <= 0 || String(siteId) !== raw) notFound();
  try {
    return { member, site: await getSiteWire(member.orgId, siteId) };
  } catch (e) {
    if (e instanceof ProblemError && e.status === 404) notFound();
    throw e;
  }
});
