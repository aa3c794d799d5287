import { describe, expect, test } from 'vitest';
import { isTimeZone, localDateOf, localTimeOf, localToday, localWeekDays, localWeekStart } from './clock.ts';

describe('department clock', () => {
  test('should keep today at 23:30 local time in a US zone although UTC is on tomorrow', () => {
    // 2026-12-02 23:30 in Chicago (CST, UTC−6) is 2026-12-03 05:30 UTC.
    const now = new Date('2026-12-03T05:30:00Z');
    expect(now.toISOString().slice(0, 10)).toBe('2026-12-03');
    expect(localToday('America/Chicago', now)).toBe('2026-12-02');
    expect(localTimeOf(now, 'America/Chicago')).toBe('23:30');
    expect(localToday('America/Los_Angeles', new Date('2026-12-03T07:30:00Z'))).toBe('2026-12-02');
    expect(localToday('America/New_York', new Date('2026-12-03T04:30:00Z'))).toBe('2026-12-02');
  });

  test('should move to the next day at local midnight, not UTC midnight', () => {
    expect(localToday('America/Chicago', new Date('2026-12-03T05:59:59Z'))).toBe('2026-12-02');
    expect(localToday('America/Chicago', new Date('2026-12-03T06:00:00Z'))).toBe('2026-12-03');
  });

  test('should keep the week a Sunday-night job belongs to', () => {
    // Sunday 2026-12-06 22:00 in Denver (UTC−7) is Monday 05:00 UTC: still last week locally.
    const now = new Date('2026-12-07T05:00:00Z');
    expect(localWeekStart('America/Denver', now)).toBe('2026-11-30');
    expect(localWeekStart('UTC', now)).toBe('2026-12-07');
    expect(localWeekDays('America/Denver', now)).toEqual([
      '2026-11-30', '2026-12-01', '2026-12-02', '2026-12-03', '2026-12-04', '2026-12-05', '2026-12-06',
    ]);
  });

  test('should follow daylight-saving changes (spring forward and fall back, US rules)', () => {
    // US DST 2026: starts Sunday 8 March 02:00, ends Sunday 1 November 02:00 (second Sunday of
    // March, first Sunday of November, Energy Policy Act of 2005).
    // 23:30 CDT (UTC−5) on 8 March = 04:30 UTC on 9 March.
    expect(localToday('America/Chicago', new Date('2026-03-09T04:30:00Z'))).toBe('2026-03-08');
    expect(localTimeOf(new Date('2026-03-09T04:30:00Z'), 'America/Chicago')).toBe('23:30');
    // The same UTC hour a day earlier was still CST (UTC−6): 22:30 on 7 March.
    expect(localTimeOf(new Date('2026-03-08T04:30:00Z'), 'America/Chicago')).toBe('22:30');
    // 23:30 CST (UTC−6) on 1 November = 05:30 UTC on 2 November.
    expect(localToday('America/Chicago', new Date('2026-11-02T05:30:00Z'))).toBe('2026-11-01');
    // The repeated hour on 1 November: 01:30 CDT (06:30 UTC) and 01:30 CST (07:30 UTC) are one date.
    expect(localToday('America/Chicago', new Date('2026-11-01T06:30:00Z'))).toBe('2026-11-01');
    expect(localToday('America/Chicago', new Date('2026-11-01T07:30:00Z'))).toBe('2026-11-01');
    expect(localTimeOf(new Date('2026-11-01T06:30:00Z'), 'America/Chicago')).toBe('01:30');
    expect(localTimeOf(new Date('2026-11-01T07:30:00Z'), 'America/Chicago')).toBe('01:30');
  });

  test('should give the local date of a stored timestamp', () => {
    expect(localDateOf('2026-07-01T03:15:00Z', 'America/Chicago')).toBe('2026-06-30');
    expect(localDateOf('2026-07-01T03:15:00Z', 'Europe/Berlin')).toBe('2026-07-01');
    expect(() => localDateOf('not a date', 'UTC')).toThrow(RangeError);
  });

  test('should know IANA names and refuse others', () => {
    expect(isTimeZone('America/Chicago')).toBe(true);
    expect(isTimeZone('UTC')).toBe(true);
    expect(isTimeZone('Mars/Olympus_Mons')).toBe(false);
    expect(isTimeZone('')).toBe(false);
  });
});
