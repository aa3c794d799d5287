import { describe, expect, test } from 'vitest';
import { board, crewDay, DATES, order } from '../components/week/sample.ts';
import { keepUnchanged } from './useWeekBoard.ts';

describe('keepUnchanged', () => {
  test('should keep the objects of unchanged orders and crew-days and take the new ones of changed', () => {
    const a = order({ id: 1, crewId: 11 });
    const b = order({ id: 2, crewId: 11 });
    const dayA = crewDay({ crewId: 11, date: DATES[0]!, workHours: 3 });
    const dayB = crewDay({ crewId: 12, date: DATES[2]!, workHours: 0 });
    const prev = board([a, b], [dayA, dayB]);
    // As a reload brings them: fresh objects, one order moved, one crew-day's hours changed.
    const next = board(
      [structuredClone(a), { ...structuredClone(b), crewId: 12, plannedDate: DATES[2]!, version: 2 }],
      [structuredClone(dayA), { ...structuredClone(dayB), workHours: 1.5, totalHours: 1.5 }],
    );
    const merged = keepUnchanged(prev, next);
    expect(merged.orders[0]).toBe(a);
    expect(merged.orders[1]).toBe(next.orders[1]);
    expect(merged.orders[1]!.crewId).toBe(12);
    expect(merged.crewDays[0]).toBe(dayA);
    expect(merged.crewDays[1]).toBe(next.crewDays[1]);
  });

  test('should take the whole new board of another week', () => {
    const prev = board([order({ id: 1 })]);
    const next = { ...board([order({ id: 1 })]), weekStart: '2026-12-07' };
    expect(keepUnchanged(prev, next).orders[0]).toBe(next.orders[0]);
  });
});
