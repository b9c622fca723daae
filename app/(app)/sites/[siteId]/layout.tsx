import type { ReactNode } from 'react';
import { loadSitePage } from './load-site';

/** Checks the site exists (for this organization) before the page below streams. */
export default async function SiteLayout({ children, params }: { children: ReactNode; params: Promise<{ siteId: string }> }) {
  await loadSitePage((await params).siteId);
  return children;
}
