'use client';

import { useCallback, useMemo, useState } from 'react';
import { TimeChart } from '@/components/charts/time-chart';
import { formatInTimeZone } from '@/lib/format/time';
import { buildChartColumns, rangeReachesLatest } from '@/lib/series/aligned';
import { useChartPalette } from './chart-palette';
import * as spec from './chart-specs';
import { RangePresets } from './range-presets';
import { useNodeSeries, type ChartRange } from './use-node-data';

const BUCKETS = 1200;

/** Bank volts, energy and reserve, panel volts: one range for all three; drag on a chart to zoom. */
export function NodeCharts({ nodeId, timeZone }: { nodeId: number; timeZone: string }) {
  const [range, setRange] = useState<ChartRange>({ kind: 'preset', seconds: 3 * 86_400 });
  const { data: reply, isPending, isError, error, isFetching, refetch } = useNodeSeries({ nodeId, range, buckets: BUCKETS });
  const palette = useChartPalette();
  const onZoom = useCallback((from: number, to: number) => {
    if (to - from >= 60) setRange({ kind: 'zoom', from, to });
  }, []);

  // Memoised on values, not on the reply object, so a poll that brings the same bank figures
  // and nights updates the data in place instead of rebuilding the charts.
  const series = useMemo(() => ({ volts: spec.voltSeries(palette), energy: spec.energySeries(palette), panel: spec.panelSeries(palette) }), [palette]);
  const floor = reply?.bank.burst_floor_volts ?? 0;
  const cutoff = reply?.bank.cutoff_volts ?? 0;
  const farads = reply?.bank.farads ?? 0;
  const rated = reply?.bank.max_volts ?? 0;
  const lines = useMemo(() => {
    const floors = { floorVolts: floor, cutoffVolts: cutoff, farads, ratedVolts: rated };
    return {
      voltAxes: spec.voltAxes(floors), voltLines: spec.voltRefLines(floors, palette),
      energyAxes: spec.energyAxes(), energyLines: spec.energyRefLines(floors, palette), panelAxes: spec.panelAxes(),
    };
  }, [floor, cutoff, farads, rated, palette]);
  const nightsKey = reply ? reply.nights.map((n) => `${n.start}-${n.end}`).join(',') : '';
  const nights = useMemo(() => (nightsKey ? nightsKey.split(',').map((k) => { const [from, to] = k.split('-').map(Number); return { from, to }; }) : []), [nightsKey]);
  const withProjection = reply ? rangeReachesLatest({ reply }) : false;
  const rechargeAt = reply?.projection?.recharge_at ?? null;
  const brownoutAt = reply?.projection?.brownout_at ?? null;
  const zone = reply?.time_zone ?? timeZone;
  const marks = useMemo(
    () => spec.projectionMarks({ timeZone: zone, rechargeAt, brownoutAt, shown: withProjection }, palette),
    [zone, rechargeAt, brownoutAt, palette, withProjection],
  );
  const columns = useMemo(() => (reply ? buildChartColumns({ reply, withProjection }) : null), [reply, withProjection]);
  const empty = reply ? reply.count === 0 && !withProjection : false;

  const local = (s: number) => formatInTimeZone(new Date(s * 1000), timeZone, 'd MMM HH:mm');
  const timeLabel = `time (${timeZone})`;

  return (
    <section aria-labelledby="charts-heading" className="mt-8" data-testid="node-charts">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="charts-heading" className="text-lg font-bold">Bank, energy and panel</h2>
          <p className="text-xs text-ink-muted">Shaded bands are nights. Drag across a chart to zoom in.</p>
        </div>
        <div className="flex flex-wrap items-center gap-2">
          <RangePresets range={range} onChange={setRange} busy={isFetching} />
          {range.kind === 'zoom' ? (
            <button type="button" onClick={() => setRange({ kind: 'preset', seconds: 3 * 86_400 })} className="rounded-md border border-dusk-600 px-2.5 py-1.5 text-sm text-ink hover:bg-dusk-800" data-testid="zoom-reset">
              Zoomed {local(range.from)} – {local(range.to)} · back to 3 d
            </button>
          ) : null}
        </div>
      </div>

      <p className="sr-only" role="status" aria-live="polite">{isFetching ? 'Loading the charts…' : ''}</p>
      {isPending ? <ChartSkeleton /> : null}
      {isError && !reply ? (
        <div role="alert" className="mt-4 rounded-lg border border-hazard/50 p-4 text-sm">
          <p className="text-hazard">The charts could not be loaded: {error.message}</p>
          <button type="button" className="mt-2 underline" onClick={() => refetch()}>Try again</button>
        </div>
      ) : null}
      {empty ? <p className="mt-4 rounded-lg border border-dashed border-dusk-700 p-6 text-center text-ink-muted" data-testid="charts-empty">No readings in this range.</p> : null}
      {columns && reply && !empty ? (
        <div className={`mt-4 grid gap-6 transition-opacity ${isFetching ? 'opacity-70' : ''}`}>
          <TimeChart title="Bank volts (calibrated)" testId="chart-volts" data={columns.volts} series={series.volts} axes={lines.voltAxes} nights={nights} refLines={lines.voltLines} marks={marks} timeZone={timeZone} onZoom={onZoom} timeLabel={timeLabel} />
          <TimeChart title="Energy stored and reserve above the burst floor" testId="chart-energy" data={columns.energy} series={series.energy} axes={lines.energyAxes} nights={nights} refLines={lines.energyLines} marks={marks} timeZone={timeZone} onZoom={onZoom} timeLabel={timeLabel} height={220} />
          {reply.has_panel ? (
            <TimeChart title="Panel volts (highest per bucket)" testId="chart-panel" data={columns.panel} series={series.panel} axes={lines.panelAxes} nights={nights} timeZone={timeZone} onZoom={onZoom} timeLabel={timeLabel} height={180} />
          ) : (
            <p className="text-xs text-ink-faint">This node reports no panel volts.</p>
          )}
          <p className="text-xs text-ink-faint" data-testid="series-source">
            {reply.count} buckets of {bucketWords(reply.bucket_seconds)} from {sourceWords(reply.source)}; volts calibrated.
          </p>
        </div>
      ) : null}
    </section>
  );
}

function ChartSkeleton() {
  return (
    <div className="mt-4 grid gap-6" aria-hidden="true">
      {[260, 220, 180].map((h) => <div key={h} className="animate-pulse rounded-lg bg-dusk-900" style={{ height: h }} />)}
    </div>
  );
}

function bucketWords(seconds: number): string {
  if (seconds % 86_400 === 0) return `${seconds / 86_400} d`;
  if (seconds % 3600 === 0) return `${seconds / 3600} h`;
  if (seconds % 60 === 0) return `${seconds / 60} min`;
  return `${seconds} s`;
}

function sourceWords(source: string): string {
  return source === 'raw' ? 'the raw readings' : source === 'rollup-300' ? '5-minute rollups' : 'hourly rollups';
}
