'use client';

import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import type { NightsReply, SeriesReply, StatusReply } from '@/lib/series/wire';
import { fetchJson } from './fetch-json';

/** Live data of the node page: TanStack Query against our API, polling while the tab is open. */
const STATUS_POLL_MS = 30_000;
const SERIES_POLL_MS = 60_000;

export function useNodeStatus({ nodeId, initial }: { nodeId: number; initial: StatusReply }) {
  return useQuery({
    queryKey: ['node-status', nodeId],
    queryFn: ({ signal }) => fetchJson<StatusReply>(`/api/v1/nodes/${nodeId}/status`, signal),
    initialData: initial,
    initialDataUpdatedAt: initial.evaluated_at * 1000,
    refetchInterval: STATUS_POLL_MS,
  });
}

/** A preset is a span ending now (refreshed while polling); a zoom is a fixed range. */
export type ChartRange = { kind: 'preset'; seconds: number } | { kind: 'zoom'; from: number; to: number };

export function seriesPath({ nodeId, range, buckets, nowSeconds }: { nodeId: number; range: ChartRange; buckets: number; nowSeconds: number }): string {
  const to = range.kind === 'preset' ? Math.round(nowSeconds) : Math.round(range.to);
  const from = range.kind === 'preset' ? to - range.seconds : Math.round(range.from);
  return `/api/v1/nodes/${nodeId}/series?from=${from}&to=${to}&buckets=${buckets}`;
}

export function useNodeSeries({ nodeId, range, buckets }: { nodeId: number; range: ChartRange; buckets: number }) {
  return useQuery({
    queryKey: ['node-series', nodeId, range, buckets],
    queryFn: ({ signal }) => fetchJson<SeriesReply>(seriesPath({ nodeId, range, buckets, nowSeconds: Date.now() / 1000 }), signal),
    placeholderData: keepPreviousData,
    refetchInterval: range.kind === 'preset' ? SERIES_POLL_MS : false,
  });
}

export function useNightTable({ nodeId }: { nodeId: number }) {
  return useQuery({
    queryKey: ['node-nights', nodeId],
    queryFn: ({ signal }) => fetchJson<NightsReply>(`/api/v1/nodes/${nodeId}/nights`, signal),
    refetchInterval: 5 * 60_000,
  });
}

/** "Now" for ages: starts at the server's instant (so the first render matches it), then ticks. */
export function useNow({ startMs, everyMs = 15_000 }: { startMs: number; everyMs?: number }): number {
  const [now, setNow] = useState(startMs);
  useEffect(() => {
    setNow(Date.now());
    const id = setInterval(() => setNow(Date.now()), everyMs);
    return () => clearInterval(id);
  }, [everyMs]);
  return now;
}
