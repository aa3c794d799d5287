import { describe, expect, test } from 'vitest';
import type { Queryable } from '../db/client.ts';
import { DepartmentClock } from './clock.ts';

/** A clock standing at a chosen instant that the test moves. */
function clockAt(iso: string, zone = 'America/Chicago') {
  let now = new Date(iso);
  const clock = new DepartmentClock({} as Queryable, zone, () => now);
  return { clock, set: (next: string) => (now = new Date(next)) };
}

describe('the department clock remembers the current minute', () => {
  test('should turn to the next date at local midnight although it remembered the minute before', () => {
    // Sunday 6 December 2026, 23:59:59.999 in Chicago (CST, UTC−6) is 05:59:59.999 UTC on Monday.
    const { clock, set } = clockAt('2026-12-07T05:59:59.999Z');
    expect([clock.today(), clock.weekStart()]).toEqual(['2026-12-06', '2026-11-30']);
    expect(clock.today()).toBe('2026-12-06');
    set('2026-12-07T06:00:00.000Z');
    expect([clock.today(), clock.weekStart()]).toEqual(['2026-12-07', '2026-12-07']);
  });

  test('should answer in a newly stored zone at once, within the same minute', () => {
    const { clock } = clockAt('2026-12-07T05:30:00.000Z');
    expect(clock.today()).toBe('2026-12-06');
    clock.use('Europe/Berlin');
    expect(clock.today()).toBe('2026-12-07');
  });
});
