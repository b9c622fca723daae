import type uPlot from 'uplot';

/**
 * Which breaks a line keeps. uPlot breaks a line at every empty bucket; on a chart whose
 * buckets are shorter than a node's report interval (the fleet chart's 5-minute buckets, a
 * node reporting every 10 minutes) that leaves every other bucket empty and no line at all.
 * Here a break stays only where the readings on either side are more than `maxBridgeSeconds`
 * apart: the node was silent, not merely between reports. Each gap is [from, to] in canvas
 * pixels between the last value before it and the first after it (uPlot's own encoding).
 */
export function keepLongGaps(gaps: [number, number][], secondsPerPixel: number, maxBridgeSeconds: number): [number, number][] {
  if (!(secondsPerPixel > 0)) return gaps;
  return gaps.filter(([from, to]) => (to - from) * secondsPerPixel > maxBridgeSeconds);
}

/** The uPlot gaps refiner for a series: bridges silences up to `maxBridgeSeconds`. */
export function bridgeShortGaps(maxBridgeSeconds: number): uPlot.Series.GapsRefiner {
  return (u, _seriesIdx, _idx0, _idx1, nullGaps) => {
    const { min, max } = u.scales.x;
    if (min == null || max == null || !(u.bbox.width > 0)) return nullGaps;
    return keepLongGaps(nullGaps as [number, number][], (max - min) / u.bbox.width, maxBridgeSeconds);
  };
}
