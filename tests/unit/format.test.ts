import { describe, expect, it } from 'vitest';
import { formatAmps, formatJoules, formatWattHours } from '@/lib/format/units';
import { formatInTimeZone, formatNearNow, TIME_PATTERNS } from '@/lib/format/time';

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

describe('time formatting', () => {
  // 2026-11-30T10:02:00Z is 02:02 Monday in Los Angeles (UTC−8 in November: common practice).
  const at = new Date('2026-11-30T10:02:00Z');
  it('writes a time near now by weekday, and one further off with its full date', () => {
    expect(formatNearNow(at, 'America/Los_Angeles', Date.parse('2026-12-01T00:00:00Z'))).toBe('Mon 02:02 PST');
    expect(formatNearNow(at, 'America/Los_Angeles', Date.parse('2026-12-14T00:00:00Z'))).toBe('30 Nov 2026 02:02 PST');
    expect(formatNearNow(at, 'America/Los_Angeles', Date.parse('2026-11-20T00:00:00Z'))).toBe('30 Nov 2026 02:02 PST');
  });
  it('each kind of time has one pattern', () => {
    expect(formatInTimeZone(at, 'UTC', TIME_PATTERNS.event)).toBe('Mon 30 Nov 10:02 UTC');
    expect(formatInTimeZone(at, 'UTC', TIME_PATTERNS.record)).toBe('30 Nov 2026 10:02 UTC');
  });
});
