import { ORG_COOKIE } from '@/lib/auth/guard';
import { getEnv } from '@/lib/env';
import { problems } from '@/lib/errors';
import { memberRoute } from '@/lib/http/route';
import { currentOrgBody } from '@/lib/schemas/org-current';

// The organizations the caller belongs to, and which one the app is showing. A person can be
// a member of several (an invitation accepted with an existing account adds one). The choice
// is kept in a cookie and checked against the memberships on every request (lib/auth/guard.ts),
// so a membership that ends simply falls back to another.
export const GET = memberRoute({ permission: 'fleet:read' }, async ({ member, organizations }) => {
  return Response.json({ current: member.orgId, organizations }, { headers: { 'cache-control': 'no-store' } });
});

export const PUT = memberRoute({ permission: 'fleet:read', body: currentOrgBody }, async ({ body, organizations }) => {
  const chosen = organizations.find((o) => o.id === body.org_id);
  // Where the caller is not a member, the answer is that of a missing organization: no hint that it exists.
  if (!chosen) throw problems.notFound('The organization');
  const secure = getEnv().APP_URL.startsWith('https://') ? '; Secure' : '';
  return Response.json(chosen, {
    headers: { 'set-cookie': `${ORG_COOKIE}=${chosen.id}; Path=/; HttpOnly; SameSite=Lax; Max-Age=31536000${secure}`, 'cache-control': 'no-store' },
  });
});
