import { describe, expect, test } from 'vitest';
import { fieldCheckDue, mowingDue, mowingDueBy } from './due.ts';
import { DEFAULT_STANDARDS } from './standards.ts';

describe('due', () => {
  test('should flag a field check overdue once its level\u2019s interval has passed', () => {
    // Level 2 checks every 14 days (demo Standards).
    const days = DEFAULT_STANDARDS[2].fieldCheckDays;
    expect(fieldCheckDue('2026-11-01', days, '2026-11-14')).toEqual({ dueOn: '2026-11-15', state: 'ok', daysOverdue: 0 });
    expect(fieldCheckDue('2026-11-01', days, '2026-11-15')).toEqual({ dueOn: '2026-11-15', state: 'due', daysOverdue: 0 });
    expect(fieldCheckDue('2026-10-01', days, '2026-12-02')).toEqual({ dueOn: '2026-10-15', state: 'overdue', daysOverdue: 48 });
    expect(fieldCheckDue(null, days, '2026-12-02')).toEqual({ dueOn: null, state: 'never', daysOverdue: 0 });
  });

  test('should give the latest next mowing by the shorter of the level\u2019s interval and 7 \u00f7 its least mowings per week', () => {
    // Level 2: at most 4 days apart and at least 2 a week: floor(7 / 2) = 3 days wins.
    expect(mowingDueBy('2026-11-30', DEFAULT_STANDARDS[2], '2026-12-02')).toEqual({ dueOn: '2026-12-03', state: 'ok', daysOverdue: 0 });
    expect(mowingDueBy('2026-11-20', DEFAULT_STANDARDS[3], '2026-12-02')).toEqual({ dueOn: '2026-11-27', state: 'overdue', daysOverdue: 5 });
  });
});

describe('mowingDue', () => {
  const hoc = 25.4;
  test('should fall due on the day the grass would pass 1.5 \u00d7 HOC (one-third rule)', () => {
    // 5 mm a day: 12.7 mm allowance passed on day 3.
    expect(mowingDue('2026-06-01', hoc, DEFAULT_STANDARDS[3], [5, 5, 5, 5], '2026-06-02')).toMatchObject({ dueOn: '2026-06-04', reason: 'growth', state: 'ok' });
  });

  test('should fall due at the level\u2019s interval once the grass has grown a tenth of HOC', () => {
    // Level 2: 3 days; 1 mm a day is 3 mm > 2.54 mm by day 3.
    expect(mowingDue('2026-06-01', hoc, DEFAULT_STANDARDS[2], [1, 1, 1, 1, 1], '2026-06-06')).toEqual({ dueOn: '2026-06-04', state: 'overdue', daysOverdue: 2, reason: 'frequency', waitingForGrowth: false });
  });

  test('should ask no cut of dormant turf past the interval', () => {
    expect(mowingDue('2026-11-10', hoc, DEFAULT_STANDARDS[2], new Array(20).fill(0.05), '2026-11-30')).toEqual({ dueOn: null, state: 'ok', daysOverdue: 0, reason: null, waitingForGrowth: true });
  });
});
