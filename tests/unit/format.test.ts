import { describe, expect, it } from 'vitest';
import { formatAmps, formatJoules, formatWattHours } from '@/lib/format/units';

describe('unit formatting', () => {
  it('shows watt-hours beside joules (1 Wh = 3600 J, SI definition)', () => {
    expect(formatWattHours(1458)).toBe('0.405 Wh'); // one 400 F cell at 2.7 V (common practice: ≈ 0.41 Wh)
    expect(formatJoules(1458)).toBe('1458 J');
    expect(formatJoules(15_400)).toBe('15.4 kJ');
  });
  it('picks a readable prefix for currents', () => {
    expect(formatAmps(10e-6)).toBe('10.0 µA');
    expect(formatAmps(0.22)).toBe('220.0 mA');
    expect(formatAmps(360)).toBe('360 A');
  });
});
