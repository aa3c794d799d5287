import { DEFAULT_TIME_ZONE } from '@swardwise/domain';
import { createPinia, setActivePinia } from 'pinia';
import { afterEach, beforeEach, describe, expect, test, vi } from 'vitest';
import { useSessionStore } from '../stores/session.ts';
import { useToday } from './useToday.ts';

const at = (iso: string) => () => new Date(iso);
const user = { id: 4, email: 'f@test.example', name: 'F', role: 'foreman', districtId: 1, crewId: null, siteIds: [], units: 'imperial', version: 1 };

beforeEach(() => setActivePinia(createPinia()));
afterEach(() => vi.unstubAllGlobals());

describe('useToday', () => {
  test('should give the department’s date at 23:30 on a Sunday in Chicago, not the UTC Monday', () => {
    useSessionStore().setTimeZone('America/Chicago');
    // 04:30 UTC on Monday 1 June 2026 is 23:30 CDT on Sunday 31 May.
    const { today, weekStart, weekDays, timeZone } = useToday(at('2026-06-01T04:30:00Z'));
    expect(timeZone.value).toBe('America/Chicago');
    expect(today.value).toBe('2026-05-31');
    expect(weekStart.value).toBe('2026-05-25');
    expect(weekDays.value).toEqual(['2026-05-25', '2026-05-26', '2026-05-27', '2026-05-28', '2026-05-29', '2026-05-30', '2026-05-31']);
  });

  test.each([
    ['2026-03-09T04:30:00Z', '2026-03-08', '2026-03-02'], // 23:30 CDT on the Sunday clocks went forward
    ['2026-03-09T05:30:00Z', '2026-03-09', '2026-03-09'], // 00:30 CDT on the Monday after
    ['2026-11-01T07:30:00Z', '2026-11-01', '2026-10-26'], // the second 01:30, CST
    ['2026-11-02T05:30:00Z', '2026-11-01', '2026-10-26'], // 23:30 CST on the Sunday clocks went back
    ['2026-11-02T06:30:00Z', '2026-11-02', '2026-11-02'], // 00:30 CST on the Monday after
  ])('should keep the local date across the daylight-saving change at %s', (instant, date, monday) => {
    useSessionStore().setTimeZone('America/Chicago');
    const { today, weekStart } = useToday(at(instant));
    expect(today.value).toBe(date);
    expect(weekStart.value).toBe(monday);
  });

  test('should use the demo city’s zone until a session says otherwise, and follow a change of zone', () => {
    const session = useSessionStore();
    const { today, timeZone } = useToday(at('2026-06-01T04:30:00Z'));
    expect(timeZone.value).toBe(DEFAULT_TIME_ZONE);
    expect(today.value).toBe('2026-05-31');
    session.setTimeZone('America/New_York'); // 00:30 on Monday there
    expect(today.value).toBe('2026-06-01');
    session.setTimeZone('Not/A_Zone');
    expect(timeZone.value).toBe('America/New_York');
  });

  test('should take the department’s zone from the sign-in answer', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response(JSON.stringify({ user, timeZone: 'America/Denver' }), { status: 200, headers: { 'Content-Type': 'application/json' } })),
    );
    const session = useSessionStore();
    await session.signIn('f@test.example', 'secret-1');
    expect(session.timeZone).toBe('America/Denver');
    // 04:30 UTC is 22:30 MDT on Sunday.
    expect(session.today(new Date('2026-06-01T04:30:00Z'))).toBe('2026-05-31');
    expect(session.weekStart(new Date('2026-06-01T06:30:00Z'))).toBe('2026-06-01');
  });
});
