'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch, type Problem } from '@/lib/client/api';
import type { AlertWire, OutboxWire } from './alert-wire';
import { searchFromFilters, type AlertFilters } from './filter-params';

/** Live data after the server's first paint: alerts every 30 s, the outbox every minute. */
export const ALERTS_POLL_MS = 30_000;
export const OUTBOX_POLL_MS = 60_000;

async function getJson<T>(path: string): Promise<T> {
  const res = await apiFetch<T>(path);
  if (!res.ok) throw new Error(res.problem.detail ?? res.problem.title);
  return res.data;
}

/** The first paint belongs to the filters the server rendered with; other filters load fresh. */
export function useAlerts({ filters, initial }: { filters: AlertFilters; initial: { filters: AlertFilters; alerts: AlertWire[]; at: string } }) {
  const search = searchFromFilters(filters);
  const isInitial = search === searchFromFilters(initial.filters);
  return useQuery({
    queryKey: ['alerts', search],
    queryFn: () => getJson<{ alerts: AlertWire[] }>(`/api/v1/alerts?${search}`).then((b) => b.alerts),
    initialData: isInitial ? initial.alerts : undefined,
    initialDataUpdatedAt: isInitial ? Date.parse(initial.at) : undefined,
    refetchInterval: ALERTS_POLL_MS,
  });
}

export class AcknowledgeError extends Error {
  constructor(readonly problem: Problem) {
    super(problem.detail ?? problem.title);
  }
}

/** POST …/acknowledge, then every alert list (this page's and the node pages') refreshes. */
export function useAcknowledge() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (alert: Pick<AlertWire, 'id'>) => {
      const res = await apiFetch<AlertWire>(`/api/v1/alerts/${alert.id}/acknowledge`, { method: 'POST' });
      if (!res.ok) throw new AcknowledgeError(res.problem);
      return res.data;
    },
    onSettled: async () => {
      await Promise.all([client.invalidateQueries({ queryKey: ['alerts'] }), client.invalidateQueries({ queryKey: ['node-alerts'] })]);
    },
  });
}

export function useOutbox({ enabled }: { enabled: boolean }) {
  return useQuery({
    queryKey: ['alerts-outbox'],
    queryFn: () => getJson<{ messages: OutboxWire[] }>('/api/v1/alerts/outbox').then((b) => b.messages),
    refetchInterval: OUTBOX_POLL_MS,
    enabled,
  });
}
