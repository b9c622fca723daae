import { describe, expect, it } from 'vitest';
import { formatDuration, formatUntilOrAgo, secondsBetween } from '@/components/fleet/duration';

describe('durations for people', () => {
  it('writes seconds, minutes, hours and days', () => {
    expect(formatDuration(45)).toBe('45 s');
    expect(formatDuration(12 * 60)).toBe('12 min');
    expect(formatDuration(7 * 3600 + 5 * 60)).toBe('7 h 05 min');
    expect(formatDuration(3 * 86_400 + 4 * 3600)).toBe('3 d 4 h');
    expect(formatDuration(null)).toBe('—');
  });

  it('says "ago" for an instant already passed, not "in 0 s"', () => {
    const now = '2026-12-03T07:52:00Z';
    expect(formatUntilOrAgo(secondsBetween(now, '2026-12-03T05:38:00Z'))).toBe('2 h 14 min ago');
    expect(formatUntilOrAgo(secondsBetween(now, '2026-12-03T10:00:00Z'))).toBe('in 2 h 08 min');
    expect(formatUntilOrAgo(null)).toBe('in —');
  });
});
