import type { SeriesReply } from './wire';

/**
 * The series reply → uPlot's aligned columns (x first, one array per series, null where a
 * series has no value). Pure, so the charts stay thin and this stays tested. A gap in the
 * readings (a node quiet for hours) is broken with a null rather than bridged by a straight line.
 */
export type Aligned = [number[], ...(number | null)[][]];

export interface ChartColumns {
  volts: Aligned; // x, mean, min, max, projected
  energy: Aligned; // x, energy, reserve, projected energy, projected reserve
  panel: Aligned; // x, panel max
}

type Point = { x: number; values: (number | null)[] };

function align(points: Point[], width: number): Aligned {
  const byX = new Map<number, (number | null)[]>();
  for (const p of points) {
    const row = byX.get(p.x) ?? new Array<number | null>(width).fill(null);
    p.values.forEach((v, i) => { if (v !== null) row[i] = v; });
    byX.set(p.x, row);
  }
  const xs = [...byX.keys()].sort((a, b) => a - b);
  const cols: (number | null)[][] = Array.from({ length: width }, () => []);
  for (const x of xs) byX.get(x)!.forEach((v, i) => cols[i].push(v));
  return [xs, ...cols];
}

/** Instants where a gap starts: spacing over four times the usual one (and over two buckets). */
export function gapBreaks({ t, bucketSeconds }: { t: number[]; bucketSeconds: number }): number[] {
  if (t.length < 3) return [];
  const gaps = t.slice(1).map((x, i) => x - t[i]).sort((a, b) => a - b);
  const usual = gaps[gaps.length >> 1];
  const limit = Math.max(4 * usual, 2 * bucketSeconds);
  const breaks: number[] = [];
  for (let i = 1; i < t.length; i++) if (t[i] - t[i - 1] > limit) breaks.push((t[i] + t[i - 1]) / 2);
  return breaks;
}

export function buildChartColumns({ reply, withProjection }: { reply: SeriesReply; withProjection: boolean }): ChartColumns {
  const b = reply.buckets;
  const breaks = gapBreaks({ t: b.t, bucketSeconds: reply.bucket_seconds });
  const p = withProjection ? reply.projection : null;
  const nulls = (n: number) => new Array<null>(n).fill(null);

  const volts: Point[] = b.t.map((x, i) => ({ x, values: [b.v_mean[i], b.v_min[i], b.v_max[i], null] }));
  const energy: Point[] = b.t.map((x, i) => ({ x, values: [b.energy_mean_joules[i], b.reserve_mean_joules[i], null, null] }));
  const panel: Point[] = b.t.map((x, i) => ({ x, values: [b.vp_max[i]] }));
  // The asked range's two ends are on the axis even without readings there, so a node that
  // went quiet shows its silence instead of a chart that stops where the data stops.
  for (const x of [...breaks, reply.from, reply.to]) {
    volts.push({ x, values: nulls(4) });
    energy.push({ x, values: nulls(4) });
    panel.push({ x, values: nulls(1) });
  }
  if (p) {
    p.t.forEach((x, i) => {
      volts.push({ x, values: [null, null, null, p.volts[i]] });
      energy.push({ x, values: [null, null, p.energy_joules[i], p.reserve_joules[i]] });
    });
    // The span runs on to the recharge even when the projection stops at a brownout first,
    // so the sunrise tick is on the chart and the dark hours before it can be seen; the panel
    // has no projection but shares the span, so the three charts line up.
    const end = Math.max(p.t[p.t.length - 1], p.recharge_at ?? -Infinity);
    if (end > p.t[p.t.length - 1]) {
      volts.push({ x: end, values: nulls(4) });
      energy.push({ x: end, values: nulls(4) });
    }
    panel.push({ x: end, values: [null] });
  }
  return { volts: align(volts, 4), energy: align(energy, 4), panel: align(panel, 1) };
}

/** Whether the range reaches the latest reading, so that the projection belongs on the chart. */
export function rangeReachesLatest({ reply }: { reply: SeriesReply }): boolean {
  return reply.projection !== null && reply.projection.from_at >= reply.from && reply.projection.from_at <= reply.to + reply.bucket_seconds;
}
