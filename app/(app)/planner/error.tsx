'use client';

import { RouteError } from '@/components/fleet/route-error';

export default function ErrorPage({ reset }: { error: Error; reset: () => void }) {
  return <RouteError title="Planner" what="The planner" reset={reset} />;
}
