'use client';

import { useEffect, useMemo, useRef, useState } from 'react';
import type uPlot from 'uplot';
import UplotReact from 'uplot-react';
import { useThemeVersion } from './use-theme-version';
import 'uplot/dist/uPlot.min.css';
import { bridgeShortGaps } from './gaps';
import { nightBandsPlugin, refLinesPlugin, timeMarksPlugin, type RefLine } from './night-bands';

/**
 * The one chart primitive: time on x (Unix seconds, shown in the site's zone), one or two y
 * scales with their units, nights shaded, reference lines and time marks. Every chart of the
 * app goes through here so that they read alike.
 */
export interface ChartSeries {
  label: string;
  scale: string;
  color: string;
  width?: number;
  dash?: number[];
  fill?: string;
}

export interface ChartAxis {
  scale: string;
  label: string; // with its unit, e.g. "bank (V)"
  side?: 'left' | 'right';
  /** Values the scale must always show (a floor or cutoff line below the data), beside the data's own range. */
  include?: number[];
}

export interface TimeChartProps {
  data: uPlot.AlignedData;
  series: ChartSeries[];
  axes: ChartAxis[];
  nights?: { from: number; to: number }[];
  refLines?: RefLine[];
  marks?: { at: number; label: string; color: string }[];
  timeZone: string;
  height?: number;
  title: string;
  onZoom?: (from: number, to: number) => void;
  testId?: string;
  /** Label under the time axis, e.g. "time (America/Los_Angeles)". */
  timeLabel?: string;
  /** Lines run across empty buckets when the readings either side are at most this far apart (s); longer silences stay breaks. */
  bridgeGapsSeconds?: number;
}

const css = (name: string) => (typeof window === 'undefined' ? '#888' : `rgb(${getComputedStyle(document.documentElement).getPropertyValue(name).trim().split(' ').join(',')})`);

/** A y range holding the data and every `include` value, with a little air above and below. */
function includeRange(include: number[]) {
  return (_u: uPlot, min: number | null, max: number | null): uPlot.Range.MinMax => {
    const values = [...include, ...(min == null || !Number.isFinite(min) ? [] : [min]), ...(max == null || !Number.isFinite(max) ? [] : [max])];
    const low = Math.min(...values);
    const high = Math.max(...values);
    // 8 %: room above the top line (the rating) for its label
    const pad = (high - low || Math.abs(high) || 1) * 0.08;
    return [low - pad, high + pad];
  };
}

function tzDate(timeZone: string) {
  return (ts: number) => {
    // uPlot formats a Date in local time; shift it so that "local" reads as the site's zone.
    const d = new Date(ts * 1000);
    const inZone = new Date(d.toLocaleString('en-US', { timeZone }));
    const local = new Date(d.toLocaleString('en-US'));
    return new Date(d.getTime() + (inZone.getTime() - local.getTime()));
  };
}

export function TimeChart(props: TimeChartProps) {
  const box = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(0);
  useEffect(() => {
    if (!box.current) return;
    const ro = new ResizeObserver(([entry]) => setWidth(Math.floor(entry.contentRect.width)));
    ro.observe(box.current);
    return () => ro.disconnect();
  }, []);

  const { series, axes, nights, refLines, marks, timeZone, height = 260, onZoom, timeLabel, bridgeGapsSeconds } = props;
  const themeVersion = useThemeVersion();
  const measured = width > 0; // in the browser, where the CSS variables can be read
  // Axis colours are read again when the theme changes.
  const [ink, grid] = useMemo(() => (measured ? [css('--ink-muted'), css('--dusk-800')] : ['#888', '#888']), [themeVersion, measured]);
  const options = useMemo<uPlot.Options>(() => {
    return {
      width: Math.max(width, 280),
      height,
      tzDate: tzDate(timeZone),
      cursor: { drag: { x: true, y: false } },
      legend: { show: true },
      scales: { x: { time: true }, ...Object.fromEntries(axes.filter((a) => a.include?.length).map((a) => [a.scale, { range: includeRange(a.include!) }])) },
      series: [
        { label: 'time' },
        ...series.map((s) => ({ label: s.label, scale: s.scale, stroke: s.color, width: s.width ?? 1.5, dash: s.dash, fill: s.fill, points: { show: false }, ...(bridgeGapsSeconds ? { gaps: bridgeShortGaps(bridgeGapsSeconds) } : {}) })),
      ],
      axes: [
        { stroke: ink, grid: { stroke: grid, width: 1 }, ticks: { stroke: grid }, ...(timeLabel ? { label: timeLabel, labelSize: 20 } : {}) },
        ...axes.map((a) => ({ scale: a.scale, label: a.label, stroke: ink, side: a.side === 'right' ? 1 : 3, grid: { show: a.side !== 'right', stroke: grid, width: 1 }, ticks: { stroke: grid }, size: 56 })),
      ],
      hooks: onZoom ? { setSelect: [(u: uPlot) => { if (u.select.width > 4) onZoom(u.posToVal(u.select.left, 'x'), u.posToVal(u.select.left + u.select.width, 'x')); }] } : {},
      plugins: [nightBandsPlugin(nights ?? []), refLinesPlugin(refLines ?? []), timeMarksPlugin(marks ?? [])],
    };
  }, [width, height, timeZone, series, axes, nights, refLines, marks, onZoom, timeLabel, bridgeGapsSeconds, ink, grid]);

  return (
    <figure className="w-full" data-testid={props.testId} data-axis-colour={ink}>
      <figcaption className="mb-1 text-sm font-bold text-ink">{props.title}</figcaption>
      <div ref={box} className="w-full [&_.u-legend]:text-xs [&_.u-legend]:text-ink-muted">
        {width > 0 ? <UplotReact options={options} data={props.data} /> : <div style={{ height }} />}
      </div>
    </figure>
  );
}
