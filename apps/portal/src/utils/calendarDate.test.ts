import { describe, expect, test } from 'vitest';
import { DAY_MONTH, DAY_MONTH_YEAR, formatDay, WEEKDAY_DAY, WEEKDAY_DAY_YEAR } from './calendarDate.ts';

describe('formatDay', () => {
  test('should write the date itself, whatever the zone of the browser', () => {
    expect(formatDay('2026-12-03', DAY_MONTH)).toBe('Dec 3');
    expect(formatDay('2026-12-03', DAY_MONTH_YEAR)).toBe('Dec 3, 2026');
    expect(formatDay('2026-12-03', WEEKDAY_DAY)).toBe('Thu, Dec 3');
    expect(formatDay('2026-01-01', WEEKDAY_DAY_YEAR)).toBe('Thu, Jan 1, 2026');
    expect(formatDay('2026-12-31', { weekday: 'long', month: 'long', day: 'numeric' })).toBe('Thursday, December 31');
  });
});
