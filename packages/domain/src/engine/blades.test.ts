import { describe, expect, test } from 'vitest';
import { bladeCare, COMMON_SHARPEN_INTERVAL_H, planSharpeningJobs, sharpenJobHours, type SharpenMachine } from './blades.ts';

describe('bladeCare', () => {
  test('should flag a rotary mower due once the hours since sharpening reach its interval', () => {
    // Rotary blades every 25 h (common practice, from memory: 8–25 h): 410 − 385 = 25 h.
    expect(bladeCare({ hourMeterH: 410, sharpenIntervalH: 25, lastSharpenedAtH: 385 })).toEqual({ hoursSince: 25, hoursByWeekEnd: 25, hoursLeft: 0, state: 'due' });
    expect(bladeCare({ hourMeterH: 409.9, sharpenIntervalH: 25, lastSharpenedAtH: 385 }).state).toBe('ok');
  });

  test('should flag due soon when the week\u2019s planned mowing on the machine reaches the interval', () => {
    // Reel mower every 50 h (common practice, from memory: 20–50 h): 44 h run, 6.5 h of mowing planned → 50.5 h.
    expect(bladeCare({ hourMeterH: 344, sharpenIntervalH: 50, lastSharpenedAtH: 300 }, 6.5)).toEqual({ hoursSince: 44, hoursByWeekEnd: 50.5, hoursLeft: 6, state: 'due_soon' });
    expect(bladeCare({ hourMeterH: 344, sharpenIntervalH: 50, lastSharpenedAtH: 300 }, 5.9).state).toBe('ok');
  });

  test('should count a machine never sharpened on record from 0 h', () => {
    expect(bladeCare({ hourMeterH: 30, sharpenIntervalH: 20, lastSharpenedAtH: null })).toMatchObject({ hoursSince: 30, hoursLeft: -10, state: 'due' });
  });

  test('should not flag a machine without an interval', () => {
    expect(bladeCare({ hourMeterH: 900, sharpenIntervalH: null, lastSharpenedAtH: 0 }, 10)).toEqual({ hoursSince: null, hoursByWeekEnd: null, hoursLeft: null, state: 'no_interval' });
  });

  test('should be no longer due right after a sharpening is recorded at the hour meter', () => {
    expect(bladeCare({ hourMeterH: 410, sharpenIntervalH: 25, lastSharpenedAtH: 410 }, 3)).toMatchObject({ hoursSince: 0, state: 'ok' });
  });

  test('should keep the common ranges and job times of reel and rotary mowers', () => {
    expect(COMMON_SHARPEN_INTERVAL_H.reel_mower).toEqual({ min: 20, max: 50 });
    expect(COMMON_SHARPEN_INTERVAL_H.rotary_mower).toEqual({ min: 8, max: 25 });
    expect(sharpenJobHours('reel_mower')).toBe(1.5);
    expect(sharpenJobHours('flail_mower')).toBe(1);
  });
});

describe('planSharpeningJobs', () => {
  const weekdays = ['mon', 'tue', 'wed', 'thu', 'fri'] as const;
  const crews = [
    { id: 1, hoursPerDay: 8, workDays: weekdays },
    { id: 2, hoursPerDay: 10, workDays: ['tue', 'wed', 'thu', 'fri'] as const },
  ];
  const reel: SharpenMachine = { id: 7, name: 'R-1 triplex reel', kind: 'reel_mower', crewId: 1, hourMeterH: 460, sharpenIntervalH: 50, lastSharpenedAtH: 405 };
  const rotary: SharpenMachine = { id: 8, name: 'M-1 rotary', kind: 'rotary_mower', crewId: null, hourMeterH: 100, sharpenIntervalH: 25, lastSharpenedAtH: 80 };

  test('should put one job for each due machine on its crew’s first working day', () => {
    const jobs = planSharpeningJobs({ weekStart: '2026-12-07', machines: [reel, rotary], crews });
    // The rotary is at 20 of 25 h: not due, no job.
    expect(jobs).toEqual([
      { equipmentId: 7, crewId: 1, plannedDate: '2026-12-07', plannedHours: 1.5, reason: 'Blades due: 55 h since the last sharpening (every 50 h)', details: { hoursSinceSharpening: 55, sharpenIntervalH: 50, hourMeterH: 460 } },
    ]);
  });

  test('should give a pool machine to the crew with the most hours and skip rained-out days and past days', () => {
    const due = { ...rotary, hourMeterH: 106 };
    expect(planSharpeningJobs({ weekStart: '2026-12-07', machines: [due], crews })[0]).toMatchObject({ crewId: 2, plannedDate: '2026-12-08', plannedHours: 0.75 });
    expect(planSharpeningJobs({ weekStart: '2026-12-07', machines: [due], crews, closed: new Set(['2|2026-12-08']), notBefore: '2026-12-08' })[0]).toMatchObject({ crewId: 2, plannedDate: '2026-12-09' });
  });

  test('should leave the job unassigned on the first day when no crew works that week', () => {
    expect(planSharpeningJobs({ weekStart: '2026-12-07', machines: [reel], crews: [] })[0]).toMatchObject({ crewId: null, plannedDate: '2026-12-07' });
  });
});

describe('workTitle', () => {
  test('should name a yard job by its machine and field work by its task', async () => {
    const { workLabel, workTitle } = await import('../work-words.ts');
    expect(workTitle({ task: 'sharpen_blades', fieldId: null, equipmentName: 'R-1 triplex reel' })).toBe('Sharpen blades \u2014 R-1 triplex reel');
    expect(workLabel({ task: 'mow', fieldId: 4, fieldName: 'Field 2', equipmentName: 'R-1 triplex reel' })).toBe('Mow \u00b7 Field 2');
  });
});
