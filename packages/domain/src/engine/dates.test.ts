import { describe, expect, test } from 'vitest';
import { addDaysIso, dayNumberToIso, dayOfYear, isoToDayNumber, mondayOf, monthOf, weekdayOf } from './dates.ts';

describe('dates', () => {
  test('should give FAO-56 day numbers J', () => {
    expect(dayOfYear('2025-01-01')).toBe(1);
    expect(dayOfYear('2025-09-03')).toBe(246);
    expect(dayOfYear('2025-07-06')).toBe(187);
    expect(dayOfYear('2024-12-31')).toBe(366);
  });

  test('should add days across months and years', () => {
    expect(addDaysIso('2025-02-27', 2)).toBe('2025-03-01');
    expect(addDaysIso('2024-02-28', 1)).toBe('2024-02-29');
    expect(addDaysIso('2025-01-01', -1)).toBe('2024-12-31');
    expect(dayNumberToIso(isoToDayNumber('2030-06-15'))).toBe('2030-06-15');
  });

  test('should name weekdays and months', () => {
    expect(weekdayOf('1970-01-01')).toBe('thu');
    expect(weekdayOf('2025-06-02')).toBe('mon');
    expect(weekdayOf('1969-12-28')).toBe('sun');
    expect(monthOf('2025-06-02')).toBe(6);
  });

  test('should agree with the platform calendar from 1900 to 2200', () => {
    const start = Math.round(Date.UTC(1900, 0, 1) / 86_400_000);
    const end = Math.round(Date.UTC(2200, 11, 31) / 86_400_000);
    for (let d = start; d <= end; d += 37) {
      const iso = new Date(d * 86_400_000).toISOString().slice(0, 10);
      expect(dayNumberToIso(d)).toBe(iso);
      expect(isoToDayNumber(iso)).toBe(d);
    }
    expect(dayNumberToIso(end)).toBe('2200-12-31');
  });

  test('should find the Monday of any day, Sunday belonging to the week before', () => {
    expect(mondayOf('2026-11-30')).toBe('2026-11-30');
    expect(mondayOf('2026-12-02')).toBe('2026-11-30');
    expect(mondayOf('2026-12-06')).toBe('2026-11-30');
    expect(mondayOf('2026-12-07')).toBe('2026-12-07');
    expect(mondayOf('2027-01-01')).toBe('2026-12-28');
  });

  test('should reject malformed and impossible dates', () => {
    expect(() => isoToDayNumber('2025-6-2')).toThrow(expect.objectContaining({ code: 'engine/invalid_date' }));
    expect(() => isoToDayNumber('2025-02-30')).toThrow(expect.objectContaining({ code: 'engine/invalid_date' }));
    for (const bad of ['2025-13-01', '2025-00-10', '2025-04-31', '2023-02-29', '2025-06-0x', '2025/06/02', ' 2025-06-02', '2025-06-02T00', '+025-06-02', '']) {
      expect(() => isoToDayNumber(bad), bad).toThrow(expect.objectContaining({ code: 'engine/invalid_date' }));
    }
    expect(isoToDayNumber('2024-02-29')).toBe(isoToDayNumber('2024-03-01') - 1);
    expect(isoToDayNumber('2000-02-29')).toBe(isoToDayNumber('2000-03-01') - 1);
    expect(() => isoToDayNumber('1900-02-29')).toThrow(expect.objectContaining({ code: 'engine/invalid_date' }));
  });
});
