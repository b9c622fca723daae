'use client';

import { RouteError } from '@/components/fleet/route-error';

export default function AlertsErrorPage({ reset }: { error: Error; reset: () => void }) {
  return <RouteError title="Alerts" what="The alerts" reset={reset} />;
}
