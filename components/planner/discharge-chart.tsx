'use client';

import { useMemo } from 'react';
import type uPlot from 'uplot';
import { TimeChart, type ChartAxis, type ChartSeries } from '@/components/charts/time-chart';
import type { PlannerReply } from './planner-types';

const SERIES: ChartSeries[] = [{ label: 'bank', scale: 'V', color: 'rgb(244, 172, 92)', width: 2 }];

/** The planned night's discharge from full: volts over time, burst floor dashed, cutoff dotted. */
export function DischargeChart({ answer, cutoffVolts, timeZone }: { answer: PlannerReply; cutoffVolts: number; timeZone: string }) {
  const chart = useMemo(() => {
    if (!answer.night_start || answer.discharge_curve.length === 0) return null;
    const start = Date.parse(answer.night_start) / 1000;
    const data = [answer.discharge_curve.map(([t]) => start + t), answer.discharge_curve.map(([, v]) => v)] as uPlot.AlignedData;
    const sunrise = start + answer.night_seconds;
    const marks = [{ at: sunrise, label: 'sunrise', color: 'rgb(104, 208, 220)' }];
    if (answer.window_seconds > answer.night_seconds + 1) marks.push({ at: start + answer.window_seconds, label: 'planned recharge', color: 'rgb(104, 208, 220)' });
    return {
      data,
      // The volts axis always reaches down to the floor and the cutoff: the headroom above
      // the floor is the point of the picture.
      axes: [{ scale: 'V', label: 'bank (V)', include: [answer.burst_floor_volts, cutoffVolts] }] as ChartAxis[],
      nights: [{ from: start, to: sunrise }],
      marks,
      refLines: [
        { value: answer.burst_floor_volts, scale: 'V', label: `burst floor ${answer.burst_floor_volts.toFixed(3)} V`, color: 'rgb(255, 122, 110)', dash: [6, 4] },
        { value: cutoffVolts, scale: 'V', label: `cutoff ${cutoffVolts.toFixed(2)} V`, color: 'rgb(168, 181, 206)', dash: [1.5, 3], labelSide: 'below' as const },
      ],
    };
  }, [answer, cutoffVolts]);
  if (!chart) return <p className="text-sm text-ink-muted">No night to draw: the sun does not set at this place on that date.</p>;
  return (
    <TimeChart title={`Discharge from full through the planned night (times ${timeZone})`} data={chart.data} series={SERIES} axes={chart.axes}
      nights={chart.nights} marks={chart.marks} refLines={chart.refLines} timeZone={timeZone} height={280} testId="planner-chart" />
  );
}
