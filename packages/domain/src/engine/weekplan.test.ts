import { describe, expect, test } from 'vitest';
import { planCrewWeek } from './weekplan.ts';

const travel = { roadFactor: 1.3, speedKmh: 30, loadUnloadMin: 15 };
const crew = { id: 'c1', yard: { lat: 40, lng: -88 }, days: ['fri', 'mon', 'wed'] as const, availableHours: 40 };

describe('weekplan', () => {
  test('should keep a site on one day and balance hours over the days', () => {
    const jobs = [
      { id: 'f1', siteId: 's1', site: { lat: 40.01, lng: -88 }, hours: 3 },
      { id: 'f2', siteId: 's1', site: { lat: 40.01, lng: -88 }, hours: 2 },
      { id: 'f3', siteId: 's2', site: { lat: 40.02, lng: -88.01 }, hours: 4 },
      { id: 'f4', siteId: 's3', site: { lat: 39.99, lng: -88.02 }, hours: 1 },
      { id: 'f5', siteId: 's4', site: { lat: 39.98, lng: -87.99 }, hours: 1 },
    ];
    const plan = planCrewWeek(crew, jobs, travel);
    expect(plan.days.map((d) => d.day)).toEqual(['mon', 'wed', 'fri']);
    const s1 = plan.days.find((d) => d.jobIds.includes('f1'));
    expect(s1?.jobIds).toContain('f2');
    expect(plan.days.flatMap((d) => d.jobIds).sort()).toEqual(['f1', 'f2', 'f3', 'f4', 'f5']);
    expect(plan.days.map((d) => d.workHours)).toEqual([5, 4, 2]);
    expect(plan.load.plannedHours).toBeCloseTo(plan.days.reduce((s, d) => s + d.totalHours, 0), 9);
    expect(plan.load.overloaded).toBe(false);
  });

  test('should flag an overloaded week', () => {
    const jobs = Array.from({ length: 6 }, (_, i) => ({ id: i, siteId: i, site: { lat: 40 + i / 100, lng: -88 }, hours: 8 }));
    expect(planCrewWeek(crew, jobs, travel).load.overloaded).toBe(true);
  });

  test('should reject a crew without days and negative hours', () => {
    expect(() => planCrewWeek({ ...crew, days: [] }, [], travel)).toThrow(expect.objectContaining({ code: 'engine/no_work_days' }));
    expect(() => planCrewWeek(crew, [{ id: 1, siteId: 1, site: { lat: 40, lng: -88 }, hours: -1 }], travel)).toThrow(expect.objectContaining({ code: 'engine/invalid_hours' }));
  });
});
