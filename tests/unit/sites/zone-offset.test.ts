import { describe, expect, it } from 'vitest';
import { defaultSiteZone, describeZoneNow, formatUtcOffset, utcOffsetMinutes, zoneChoices } from '@/components/sites/zone-offset';

// Offsets below are the IANA tz database's rules as they stand (from memory): India keeps
// UTC+05:30 all year, Nepal UTC+05:45; US Pacific time is UTC−08:00 in winter and UTC−07:00
// from 2 a.m. local on the second Sunday of March (15 U.S.C. § 260a, from memory);
// New Zealand's Chatham Islands are UTC+13:45 in the southern summer.
describe('a zone’s offset from UTC', () => {
  it('reads whole, half and quarter hours, east and west', () => {
    const winter = new Date('2026-01-15T12:00:00Z');
    expect(utcOffsetMinutes('UTC', winter)).toBe(0);
    expect(utcOffsetMinutes('Asia/Kolkata', winter)).toBe(330);
    expect(utcOffsetMinutes('Asia/Kathmandu', winter)).toBe(345);
    expect(utcOffsetMinutes('America/Los_Angeles', winter)).toBe(-480);
    expect(utcOffsetMinutes('Pacific/Chatham', winter)).toBe(13 * 60 + 45);
  });

  it('follows daylight saving time across the change, to the second', () => {
    // 2026-03-08 is the second Sunday of March; 02:00 PST is 10:00 UTC.
    expect(utcOffsetMinutes('America/Los_Angeles', new Date('2026-03-08T09:59:59Z'))).toBe(-480);
    expect(utcOffsetMinutes('America/Los_Angeles', new Date('2026-03-08T10:00:00Z'))).toBe(-420);
    expect(utcOffsetMinutes('America/Los_Angeles', new Date('2026-07-01T00:00:00.750Z'))).toBe(-420);
  });

  it('answers null for a zone the engine does not know', () => {
    expect(utcOffsetMinutes('Mars/Base', new Date())).toBeNull();
  });

  it('writes offsets with a true minus sign and two-digit hours and minutes', () => {
    expect(formatUtcOffset(-480)).toBe('UTC−08:00');
    expect(formatUtcOffset(330)).toBe('UTC+05:30');
    expect(formatUtcOffset(0)).toBe('UTC+00:00');
    expect(formatUtcOffset(-150)).toBe('UTC−02:30');
  });
});

describe('what the form says beside the zone', () => {
  const at = new Date('2026-12-03T07:52:00Z');
  it('gives the offset now for a known zone, UTC included', () => {
    expect(describeZoneNow('America/Los_Angeles', at)).toEqual({ text: 'UTC−08:00 now', known: true });
    expect(describeZoneNow(' Europe/Vienna ', at)).toEqual({ text: 'UTC+01:00 now', known: true });
    expect(describeZoneNow('UTC', at)).toEqual({ text: 'UTC+00:00 now', known: true });
  });

  it('says so for an empty, unknown or wrongly cased zone (the server refuses those too)', () => {
    expect(describeZoneNow('', at).known).toBe(false);
    expect(describeZoneNow('Mars/Base', at)).toEqual({ text: 'Not a known time zone: pick one from the list.', known: false });
    expect(describeZoneNow('europe/vienna', at).known).toBe(false);
  });
});

describe('a new site’s zone and the zone list', () => {
  it('starts in the browser’s zone when it is a known one, else UTC', () => {
    expect(defaultSiteZone('Europe/Vienna')).toBe('Europe/Vienna');
    expect(defaultSiteZone(undefined)).toBe('UTC');
    expect(defaultSiteZone('')).toBe('UTC');
    expect(defaultSiteZone('Mars/Base')).toBe('UTC');
  });

  it('always offers UTC, sorted and without repeats', () => {
    expect(zoneChoices(['Europe/Vienna', 'America/Los_Angeles', 'Europe/Vienna'])).toEqual(['UTC', 'America/Los_Angeles', 'Europe/Vienna']);
    expect(zoneChoices(['UTC', 'Asia/Kolkata'])).toEqual(['Asia/Kolkata', 'UTC']);
    const real = zoneChoices(Intl.supportedValuesOf('timeZone'));
    expect(real).toContain('UTC');
    expect(real.length).toBeGreaterThan(300);
  });
});
