import { describe, expect, test } from 'vitest';
import { DISTRICT_WEEK_WARNINGS, weekWarningText, type WeekWarning } from './week-warnings.ts';

describe('weekWarningText', () => {
  test('should name the field when a name is given, else its id', () => {
    const w: WeekWarning = { code: 'due_date_missed', fieldId: 12, date: '2026-05-22', task: 'mow' };
    expect(weekWarningText(w, (id) => (id === 12 ? 'North Meadow 1' : undefined))).toBe('Mowing on North Meadow 1 falls after 2026-05-22: no working day of the crew before it.');
    expect(weekWarningText({ ...w, task: 'feed' })).toBe('Work on field 12 falls after 2026-05-22: no working day of the crew before it.');
  });

  test('should word projected weather with its last day and the days projected', () => {
    expect(weekWarningText({ code: 'weather_projected', fieldId: 1, date: '2026-05-20', days: 4 })).toBe('Weather on file ends 2026-05-20: growth for the last 4 day(s) of the week is projected from the week before.');
  });

  test('should tell a missing mowing record from one after the week began', () => {
    expect(weekWarningText({ code: 'mowing_assumed', fieldId: 1, date: null })).toMatch(/^No mowing on record/);
    expect(weekWarningText({ code: 'mowing_assumed', fieldId: 1, date: '2026-05-19' })).toMatch(/\(2026-05-19\) is after this week began/);
  });

  test('should pass the weather warnings, lines painted on a booking\'s day and cultural work with no day left from a field up to the district week', () => {
    expect([...DISTRICT_WEEK_WARNINGS].sort()).toEqual(['cultural_no_day', 'no_weather_before_week', 'paint_on_event_day', 'weather_projected']);
  });

  test('should word cultural work that waits for growth or for a day clear of bookings', () => {
    expect(weekWarningText({ code: 'cultural_waits_growth', fieldId: 3, task: 'aerate', gp: 0.04, needs: 0.5 }, () => 'East Lawn')).toBe(
      'Aerate on East Lawn is due but waits: the turf grows too little this week (growth potential 0.04, needs 0.50) to recover.',
    );
    expect(weekWarningText({ code: 'cultural_no_day', fieldId: 3, task: 'overseed' })).toMatch(/^Overseed on field 3 is due but every working day left/);
  });
});
