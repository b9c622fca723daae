import { describe, expect, it } from 'vitest';
import { keepLongGaps } from '@/components/charts/gaps';

// Derived here: a 48 h chart 960 px wide is 180 s a pixel. Gaps are [from, to] in pixels
// between the readings either side, as uPlot encodes them.
describe('keepLongGaps', () => {
  const secondsPerPixel = (48 * 3600) / 960;

  it('bridges the empty bucket between two reports 10 min apart (a 5-minute-bucket chart)', () => {
    const tenMinutes = [100, 100 + 600 / secondsPerPixel] as [number, number];
    expect(keepLongGaps([tenMinutes], secondsPerPixel, 7200)).toEqual([]);
  });

  it('keeps a break where the node was silent for longer than the limit, and only there', () => {
    const hour = [10, 10 + 3600 / secondsPerPixel] as [number, number];
    const threeHours = [300, 300 + (3 * 3600) / secondsPerPixel] as [number, number];
    expect(keepLongGaps([hour, threeHours], secondsPerPixel, 7200)).toEqual([threeHours]);
  });

  it('keeps a silence of exactly the limit bridged, and leaves gaps alone when the scale is unknown', () => {
    const twoHours = [0, 7200 / secondsPerPixel] as [number, number];
    expect(keepLongGaps([twoHours], secondsPerPixel, 7200)).toEqual([]);
    expect(keepLongGaps([twoHours], Number.NaN, 7200)).toEqual([twoHours]);
  });
});
