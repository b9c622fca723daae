'use client';

import { useMemo } from 'react';
import type uPlot from 'uplot';
import { TimeChart, type ChartAxis, type ChartSeries } from '@/components/charts/time-chart';
import { useSocSeries } from './use-fleet';

// Twelve hues far enough apart to tell lines apart on the dark surface; names are in the legend.
const PALETTE = ['#f4ac5c', '#68d0dc', '#ff7a6e', '#b8e07a', '#c9a6ff', '#f2d45c', '#5cb8ff', '#ff9ed2', '#8fe3b8', '#e0b58a', '#a0aec8', '#ffc48a'];
const AXES: ChartAxis[] = [{ scale: 'soc', label: 'state of charge (%)' }];
// Nodes report every few minutes to an hour (their cadence follows their energy), so a line
// runs on between reports and breaks only where a node was silent for longer.
const BRIDGE_SECONDS = 2 * 3600;

/** The whole fleet's energy-based state of charge over the last 48 hours, nights shaded. */
export function FleetSocChart({ hours = 48 }: { hours?: number }) {
  const query = useSocSeries(hours);
  const series = query.data;
  const chart = useMemo(() => {
    if (!series || series.nodes.length === 0) return null;
    const lines: ChartSeries[] = series.nodes.map((n, i) => ({ label: n.name, scale: 'soc', color: PALETTE[i % PALETTE.length], width: n.state === 'short' || n.state === 'dark' ? 2.25 : 1.5 }));
    const data = [series.t, ...series.soc.map((line) => line.map((s) => (s == null ? null : Math.round(s * 1000) / 10)))] as uPlot.AlignedData;
    return { lines, data };
  }, [series]);

  return (
    <section className="mt-8 rounded-xl border border-dusk-700 bg-dusk-900 p-4" aria-labelledby="fleet-chart-title" data-testid="fleet-chart-section">
      <h2 id="fleet-chart-title" className="sr-only">State of charge, last {hours} hours</h2>
      {query.isPending ? (
        <div className="flex h-[300px] items-center justify-center text-sm text-ink-muted" role="status">Loading the last {hours} hours…</div>
      ) : query.isError && !series ? (
        <div className="flex h-[300px] flex-col items-center justify-center gap-3 text-sm" role="alert">
          <p className="text-hazard">The chart could not be loaded: {query.error.message}</p>
          <button type="button" className="rounded-md border border-dusk-600 px-3 py-1.5 hover:bg-dusk-800" onClick={() => query.refetch()}>Try again</button>
        </div>
      ) : !chart || !series ? (
        <p className="flex h-[120px] items-center justify-center text-sm text-ink-muted">No readings in the last {hours} hours.</p>
      ) : (
        <>
          <TimeChart
            title={`State of charge of every node, last ${hours} h (energy-based; nights shaded; times ${series.time_zone})`}
            data={chart.data}
            series={chart.lines}
            axes={AXES}
            nights={series.nights}
            timeZone={series.time_zone}
            height={300}
            testId="fleet-chart"
            bridgeGapsSeconds={BRIDGE_SECONDS}
          />
          <p className="mt-2 text-xs text-ink-muted">
            {Math.round(series.bucket_seconds / 60)}-minute averages of calibrated bank volts; charge = (V² − V_cut²)/(V_max² − V_cut²). Lines join reports up to 2 h apart; a break means a longer silence.
          </p>
        </>
      )}
    </section>
  );
}
