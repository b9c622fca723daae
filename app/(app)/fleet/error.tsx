'use client';

import { RouteError } from '@/components/fleet/route-error';

export default function ErrorPage({ reset }: { error: Error; reset: () => void }) {
  return <RouteError title="Who makes it through tonight?" what="The fleet" reset={reset} />;
}
