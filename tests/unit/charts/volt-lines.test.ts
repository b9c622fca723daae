import { describe, expect, it } from 'vitest';
import { voltAxes, voltRefLines } from '@/components/node/chart-specs';
import type { ChartPalette } from '@/components/node/chart-palette';

const palette: ChartPalette = { ember: 'e', emberSoft: 'es', emberFill: 'ef', tide: 't', hazard: 'h', ink: 'i', inkMuted: 'im', inkFaint: 'if' };
// Invented bank for the demo's shape: two 2.7 V cells in series, floor and cutoff from a converter.
const floors = { floorVolts: 2.41, cutoffVolts: 1.8, farads: 25, ratedVolts: 5.4 };

describe('the volts chart lines', () => {
  it('draws the rating, the burst floor and the cutoff, each labelled with its volts', () => {
    const lines = voltRefLines(floors, palette);
    expect(lines.map((l) => [l.value, l.label])).toEqual([
      [5.4, 'rated 5.40 V'],
      [2.41, 'burst floor 2.41 V'],
      [1.8, 'cutoff 1.80 V'],
    ]);
    // the floor stays the one hazard-coloured line
    expect(lines.filter((l) => l.color === palette.hazard).map((l) => l.value)).toEqual([2.41]);
  });

  it('spans the axis from the cutoff to the rating, so the bank\'s place in its window shows', () => {
    expect(voltAxes(floors)[0].include).toEqual([1.8, 2.41, 5.4]);
  });

  it('leaves the rating out while the bank figures have not arrived (0 V)', () => {
    const early = { ...floors, ratedVolts: 0 };
    expect(voltRefLines(early, palette).map((l) => l.value)).toEqual([2.41, 1.8]);
    expect(voltAxes(early)[0].include).toEqual([1.8, 2.41]);
  });
});
