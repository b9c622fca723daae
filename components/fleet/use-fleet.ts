'use client';

import { useQuery } from '@tanstack/react-query';
import type { FleetView } from '@/lib/db/queries/fleet';
import { apiFetch } from '@/lib/client/api';

/** Live data after the server's first paint: the fleet every 30 s, the chart every 5 min. */
export const FLEET_POLL_MS = 30_000;

async function getJson<T>(path: string): Promise<T> {
  const res = await apiFetch<T>(path);
  if (!res.ok) throw new Error(res.problem.detail ?? res.problem.title);
  return res.data;
}

export function useFleet(initial: FleetView) {
  return useQuery({
    queryKey: ['fleet'],
    queryFn: () => getJson<FleetView>('/api/v1/fleet'),
    initialData: initial,
    initialDataUpdatedAt: Date.parse(initial.generated_at),
    refetchInterval: FLEET_POLL_MS,
  });
}

export interface SocSeriesWire {
  from: string;
  to: string;
  bucket_seconds: number;
  time_zone: string;
  nights: { from: number; to: number }[];
  nodes: { id: number; name: string; state: string; site_id: number }[];
  t: number[];
  soc: (number | null)[][];
}

export function useSocSeries(hours = 48) {
  return useQuery({
    queryKey: ['fleet', 'soc-series', hours],
    queryFn: () => getJson<SocSeriesWire>(`/api/v1/fleet/soc-series?hours=${hours}`),
    refetchInterval: 300_000,
  });
}
