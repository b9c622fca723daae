'use client';

import { RouteError } from '@/components/fleet/route-error';

export default function ErrorPage({ reset }: { error: Error; reset: () => void }) {
  return <RouteError title="Organization settings" what="The settings" reset={reset} />;
}
