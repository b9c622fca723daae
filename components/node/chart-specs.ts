import type { ChartAxis, ChartSeries } from '@/components/charts/time-chart';
import type { RefLine } from '@/components/charts/night-bands';
import { energyJoules } from '@/lib/energy';
import type { ChartPalette } from './chart-palette';
import { formatLocal } from './local-time';

/**
 * What each chart of the node draws (DESIGN.md §9): bucket means as the line, min and max as
 * faint companions, the projection dashed past the latest reading, the burst floor dashed and
 * the cutoff dotted, the recharge marked with a sunrise tick. Series order matches
 * lib/series/aligned.ts.
 */
const DASH_PROJECTION = [7, 5];
const DASH_FLOOR = [10, 4];
const DOT_CUTOFF = [1.5, 3.5];
const DASH_RATED = [3, 3];

export function voltSeries(p: ChartPalette): ChartSeries[] {
  return [
    { label: 'bank mean (V)', scale: 'V', color: p.ember, width: 2 },
    { label: 'min (V)', scale: 'V', color: p.emberSoft, width: 1 },
    { label: 'max (V)', scale: 'V', color: p.emberSoft, width: 1 },
    { label: 'projected (V)', scale: 'V', color: p.ember, width: 2, dash: DASH_PROJECTION },
  ];
}

export interface Floors {
  floorVolts: number;
  cutoffVolts: number;
  farads: number;
  /** The bank's rating, strings × cell rated volts: a reading above it over-charges the cells. */
  ratedVolts: number;
}

/** The volts axis always spans the cutoff to the rating, so a bank's place in its window reads at a glance. */
export function voltAxes({ floorVolts, cutoffVolts, ratedVolts }: Floors): ChartAxis[] {
  return [{ scale: 'V', label: 'bank (V)', include: [cutoffVolts, floorVolts, ...(ratedVolts > 0 ? [ratedVolts] : [])] }];
}

export function voltRefLines({ floorVolts, cutoffVolts, ratedVolts }: Floors, p: ChartPalette): RefLine[] {
  return [
    ...(ratedVolts > 0 ? [{ value: ratedVolts, scale: 'V', label: `rated ${ratedVolts.toFixed(2)} V`, color: p.inkMuted, dash: DASH_RATED }] : []),
    { value: floorVolts, scale: 'V', label: `burst floor ${floorVolts.toFixed(2)} V`, color: p.hazard, dash: DASH_FLOOR },
    { value: cutoffVolts, scale: 'V', label: `cutoff ${cutoffVolts.toFixed(2)} V`, color: p.inkMuted, dash: DOT_CUTOFF, labelSide: 'below' },
  ];
}

export function energySeries(p: ChartPalette): ChartSeries[] {
  return [
    { label: 'stored (J)', scale: 'J', color: p.inkMuted, width: 1.5 },
    { label: 'reserve (J)', scale: 'J', color: p.ember, width: 2, fill: p.emberFill },
    { label: 'projected stored (J)', scale: 'J', color: p.inkMuted, width: 1.5, dash: DASH_PROJECTION },
    { label: 'projected reserve (J)', scale: 'J', color: p.ember, width: 2, dash: DASH_PROJECTION },
  ];
}

export function energyAxes(): ChartAxis[] {
  return [{ scale: 'J', label: 'energy (J)', include: [0] }];
}

export function energyRefLines({ farads, floorVolts }: Floors, p: ChartPalette): RefLine[] {
  const floorJoules = energyJoules({ farads, volts: floorVolts });
  return [{ value: floorJoules, scale: 'J', label: `at the floor ${floorJoules.toFixed(0)} J`, color: p.hazard, dash: DASH_FLOOR }];
}

export function panelSeries(p: ChartPalette): ChartSeries[] {
  return [{ label: 'panel max (V)', scale: 'Vp', color: p.tide, width: 1.5 }];
}

export function panelAxes(): ChartAxis[] {
  return [{ scale: 'Vp', label: 'panel (V)', include: [0] }];
}

/** The sunrise tick at the recharge instant, and the brownout where the projection stops short of it. */
export function projectionMarks(
  { timeZone, rechargeAt, brownoutAt, shown }: { timeZone: string; rechargeAt: number | null; brownoutAt: number | null; shown: boolean },
  p: ChartPalette,
) {
  if (!shown) return [];
  // short labels: on a phone the plot is under 250 px wide and shares its floor with the line labels
  const local = (s: number) => formatLocal(s, timeZone, 'HH:mm');
  const marks: { at: number; label: string; color: string }[] = [];
  if (rechargeAt !== null) marks.push({ at: rechargeAt, label: `☀ ${local(rechargeAt)}`, color: p.tide });
  if (brownoutAt !== null) marks.push({ at: brownoutAt, label: `brownout ${local(brownoutAt)}`, color: p.hazard });
  return marks;
}
