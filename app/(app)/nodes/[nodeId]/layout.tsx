import type { ReactNode } from 'react';
import { loadNodePage } from './load-node';

/** Checks the node exists (for this organization) before the pages below stream. */
export default async function NodeLayout({ children, params }: { children: ReactNode; params: Promise<{ nodeId: string }> }) {
  await loadNodePage((await params).nodeId);
  return children;
}
