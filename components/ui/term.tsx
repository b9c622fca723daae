import type { ReactNode } from 'react';

/** One labelled figure of a description list (a card's "Bank 4.61 V", "Reserve 128 J"). */
export function Term({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-xs text-ink-muted">{term}</dt>
      <dd>{children}</dd>
    </div>
  );
}
