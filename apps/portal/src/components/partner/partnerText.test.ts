import { describe, expect, test } from 'vitest';
import { dayText, nextWorkText } from './partnerText.ts';

describe('partnerText', () => {
  test('should say today and tomorrow in words and other days by weekday, with the year only when it differs', () => {
    expect(dayText('2026-12-03', '2026-12-03')).toBe('Today');
    expect(dayText('2026-12-04', '2026-12-03')).toBe('Tomorrow');
    expect(dayText('2026-12-05', '2026-12-03')).toBe('Sat, Dec 5');
    expect(dayText('2027-01-02', '2026-12-03')).toBe('Sat, Jan 2, 2027');
  });

  test('should tell planned work from the latest day the level allows', () => {
    expect(nextWorkText({ on: '2026-12-05', basis: 'planned' }, '2026-12-03')).toBe('Sat, Dec 5');
    expect(nextWorkText({ on: '2026-12-05', basis: 'due' }, '2026-12-03')).toBe('By Sat, Dec 5 at the latest');
    expect(nextWorkText({ on: '2026-12-03', basis: 'due' }, '2026-12-03')).toBe('Due today');
    expect(nextWorkText({ on: null, basis: null }, '2026-12-03')).toBe('Nothing planned yet');
  });
});
