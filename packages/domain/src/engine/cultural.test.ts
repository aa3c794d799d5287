import { describe, expect, test } from 'vitest';
import { prepareWeather } from './outlook.ts';
import { DEFAULT_CULTURAL, culturalDue, overseedShare, windowDates } from './cultural.ts';
import type { CulturalPrograms } from './cultural.ts';
import { DEFAULT_STANDARDS } from './standards.ts';
import type { Standards } from './standards.ts';
import { assignWeek, planFieldWeek, reconcileWeek } from './weekgen.ts';
import type { ExistingOrder, PlanField } from './weekgen.ts';
import { planField, steadyDays } from '../testing/fixtures.ts';

// Mown on the Sunday before WEEK.
const field = (over: Partial<PlanField> = {}): PlanField =>
  planField({ lastMowedOn: '2026-09-13', lastPaintedOn: '2026-09-12', lastFedOn: '2026-09-10', lastCheckedOn: '2026-09-10', ...over });
// Mean 18 °C: cool-season grass grows near its best (GP close to 1).
const SEPT = prepareWeather(steadyDays('2026-08-17', 42, { tmax: 23, tmin: 13 }), { latDeg: 38, elevationM: 20 });
// Mean 1 °C in December: cool-season turf is dormant.
const DEC = prepareWeather(steadyDays('2026-11-09', 42, { tmax: 4, tmin: -2 }), { latDeg: 38, elevationM: 20 });
const WEEK = '2026-09-14'; // a Monday
const weekdays = ['mon', 'tue', 'wed', 'thu', 'fri'] as const;
const only = (programs: Partial<CulturalPrograms>): Standards => {
  const none: CulturalPrograms = {
    aerate: { ...DEFAULT_CULTURAL[2].aerate, timesPerSeason: 0 },
    overseed: { ...DEFAULT_CULTURAL[2].overseed, timesPerSeason: 0 },
    topdress: { ...DEFAULT_CULTURAL[2].topdress, timesPerSeason: 0 },
    weed_control: { ...DEFAULT_CULTURAL[2].weed_control, timesPerSeason: 0 },
  };
  return { ...DEFAULT_STANDARDS, 2: { ...DEFAULT_STANDARDS[2], cultural: { ...none, ...programs } } };
};
const cultural = (p: ReturnType<typeof planFieldWeek>) => p.orders.filter((o) => ['aerate', 'overseed', 'topdress', 'weed_control'].includes(o.task));

describe('culturalDue', () => {
  const program = { timesPerSeason: 2, cool: { fromMonth: 4, toMonth: 9 }, warm: { fromMonth: 5, toMonth: 8 } };

  test('should take a window from the first of its first month to the last of its last', () => {
    expect(windowDates({ fromMonth: 4, toMonth: 9 }, 2026)).toEqual({ from: '2026-04-01', to: '2026-09-30' });
    expect(windowDates({ fromMonth: 2, toMonth: 2 }, 2028)).toEqual({ from: '2028-02-01', to: '2028-02-29' });
    expect(windowDates({ fromMonth: 12, toMonth: 12 }, 2026)).toEqual({ from: '2026-12-01', to: '2026-12-31' });
  });

  test('should ask the first application from the window opening and not before it', () => {
    expect(culturalDue({ program, season: 'cool', weekStart: '2026-03-23', weekEnd: '2026-03-29', doneDates: [] })).toMatchObject({ due: false, why: 'outside_window' });
    expect(culturalDue({ program, season: 'cool', weekStart: '2026-03-30', weekEnd: '2026-04-05', doneDates: [] })).toMatchObject({ due: true, done: 0, nextFrom: '2026-04-01' });
  });

  test('should space the season: the second of two is due from halfway through the window', () => {
    // April 1 – September 30 is 183 days; the second falls due 91 days after April 1 (July 1).
    const one = ['2026-04-10'];
    expect(culturalDue({ program, season: 'cool', weekStart: '2026-06-22', weekEnd: '2026-06-28', doneDates: one })).toMatchObject({ due: false, why: 'not_yet', nextFrom: '2026-07-01' });
    expect(culturalDue({ program, season: 'cool', weekStart: '2026-06-29', weekEnd: '2026-07-05', doneDates: one })).toMatchObject({ due: true, done: 1 });
  });

  test('should ask nothing more once the season count is done, and count only this year', () => {
    expect(culturalDue({ program, season: 'cool', weekStart: '2026-09-07', weekEnd: '2026-09-13', doneDates: ['2026-04-10', '2026-07-01'] })).toMatchObject({ due: false, why: 'season_complete' });
    expect(culturalDue({ program, season: 'cool', weekStart: '2026-09-07', weekEnd: '2026-09-13', doneDates: ['2025-04-10', '2025-07-01'] })).toMatchObject({ due: true, done: 0 });
  });

  test('should use the warm-season window for warm-season grass', () => {
    expect(culturalDue({ program, season: 'warm', weekStart: '2026-04-13', weekEnd: '2026-04-19', doneDates: [] })).toMatchObject({ due: false, why: 'outside_window' });
  });

  test('should take the worn share of the last check for overseeding, else the default, within 2–100 %', () => {
    expect(overseedShare(22, 0.15)).toBeCloseTo(0.22, 9);
    expect(overseedShare(null, 0.15)).toBeCloseTo(0.15, 9);
    expect(overseedShare(0, 0.15)).toBeCloseTo(0.15, 9);
    expect(overseedShare(0.5, 0.15)).toBeCloseTo(0.02, 9);
  });
});

describe('planFieldWeek: cultural program', () => {
  test('should place an aeration the level program asks for, with its reason in words', () => {
    const plan = planFieldWeek({ field: field(), weather: SEPT, weekStart: WEEK, kept: [], workDays: weekdays, standards: only({ aerate: DEFAULT_CULTURAL[2].aerate }) });
    const [a, ...rest] = cultural(plan);
    expect(rest).toEqual([]);
    expect(a).toMatchObject({ task: 'aerate', fieldId: 1, flexible: true, details: { nth: 1, of: 2, method: 'core', areaM2: 6400 } });
    expect(a!.reason).toMatch(/^Level 2 program: core \(hollow tine\) aeration 2× a season in Apr–Oct; this is 1 of 2 \(0 done\)/);
    // 6,400 m² at 1.5 m × 4 km/h × 0.75 = 0.45 ha/h → 1.42 h, plus 20 min set-up.
    expect(a!.plannedHours).toBeCloseTo(6400 / 10_000 / 0.45 + 20 / 60, 2);
  });

  test('should not aerate or overseed dormant turf, and say why', () => {
    const plan = planFieldWeek({ field: field({ lastMowedOn: '2026-12-01' }), weather: DEC, weekStart: '2026-12-07', kept: [], workDays: weekdays, standards: only({ aerate: { ...DEFAULT_CULTURAL[2].aerate, cool: { fromMonth: 1, toMonth: 12 } } }) });
    expect(cultural(plan)).toEqual([]);
    expect(plan.warnings).toContainEqual(expect.objectContaining({ code: 'cultural_waits_growth', task: 'aerate' }));
  });

  test('should ask nothing more once the season count is done', () => {
    const std = only({ aerate: DEFAULT_CULTURAL[2].aerate });
    const plan = planFieldWeek({ field: field({ culturalDone: { aerate: ['2026-04-20', '2026-07-10'] } }), weather: SEPT, weekStart: WEEK, kept: [], workDays: weekdays, standards: std });
    expect(cultural(plan)).toEqual([]);
  });

  test('should keep aeration off a booking day and the day before it', () => {
    const events = [{ id: 5, startsOn: '2026-09-15', title: 'League game' }];
    const std = only({ aerate: DEFAULT_CULTURAL[2].aerate });
    const plan = planFieldWeek({ field: field({ events }), weather: SEPT, weekStart: WEEK, kept: [], workDays: weekdays, standards: std });
    const [a] = cultural(plan);
    expect(a!.avoidDates).toEqual(['2026-09-14', '2026-09-15']);
    expect(a!.askedDate).toBe('2026-09-16');
    expect(a!.reason).toContain('not on a booking day or the day before');
    const assigned = assignWeek({ weekStart: WEEK, orders: [a!], crews: [{ id: 1, hoursPerDay: 8, workDays: weekdays }], sites: new Map([[10, { lat: 38, lng: -77 }]]), yard: { lat: 38, lng: -77 }, travel: { roadFactor: 1.3, speedKmh: 35, loadUnloadMin: 15 } });
    expect(['2026-09-14', '2026-09-15']).not.toContain(assigned.orders[0]!.plannedDate);
  });

  test('should warn and wait when every working day left is a booking or the day before one', () => {
    const events = ['2026-09-15', '2026-09-17', '2026-09-19'].map((d, i) => ({ id: i + 1, startsOn: d, title: 'Game' }));
    const plan = planFieldWeek({ field: field({ events }), weather: SEPT, weekStart: WEEK, kept: [], workDays: weekdays, standards: only({ topdress: { ...DEFAULT_CULTURAL[1].topdress } }) });
    expect(cultural(plan)).toEqual([]);
    expect(plan.warnings).toContainEqual({ code: 'cultural_no_day', fieldId: 1, task: 'topdress' });
  });

  test('should overseed the worn share the last field check found', () => {
    const plan = planFieldWeek({
      field: field({ lastWear: { checkedOn: '2026-09-10', barePct: 12, areas: ['goalmouths', 'centre'] } }),
      weather: SEPT,
      weekStart: WEEK,
      kept: [],
      workDays: weekdays,
      standards: only({ overseed: DEFAULT_CULTURAL[2].overseed }),
    });
    const [o] = cultural(plan);
    expect(o).toMatchObject({ task: 'overseed', details: { areaM2: 768, share: 0.12 } });
    expect(o!.reason).toContain('worn areas (goalmouths, centre): 12 % bare at the check of 2026-09-10');
  });

  test('should not ask again on re-generation once applied, nor once logged done', () => {
    const std = only({ aerate: DEFAULT_CULTURAL[2].aerate });
    const first = planFieldWeek({ field: field(), weather: SEPT, weekStart: WEEK, kept: [], workDays: weekdays, standards: std });
    const [a] = cultural(first);
    // Applied: the order is on the board as planned; the same plan again leaves it unchanged.
    const existing: ExistingOrder[] = [{ id: 9, fieldId: 1, task: 'aerate', plannedDate: a!.askedDate, plannedHours: a!.plannedHours, crewId: null, equipmentId: null, status: 'planned', origin: 'generated', pinned: false, reason: a!.reason }];
    const again = cultural(planFieldWeek({ field: field(), weather: SEPT, weekStart: WEEK, kept: [], workDays: weekdays, standards: std }));
    const rec = reconcileWeek(existing, again.map((o) => ({ ...o, plannedDate: o.askedDate, crewId: null, equipmentId: null })));
    expect(rec.insert).toEqual([]);
    expect(rec.unchanged.map((o) => o.id)).toEqual([9]);
    // Logged done this week: kept, nothing asked.
    const done = planFieldWeek({ field: field(), weather: SEPT, weekStart: WEEK, kept: [{ id: 9, fieldId: 1, task: 'aerate', plannedDate: a!.askedDate, status: 'done' }], workDays: weekdays, standards: std });
    expect(cultural(done)).toEqual([]);
    // The next week, the done order counts toward the season: with the spring one, both of two are done.
    const next = planFieldWeek({ field: field({ culturalDone: { aerate: ['2026-04-20', a!.askedDate] } }), weather: SEPT, weekStart: '2026-09-21', kept: [], workDays: weekdays, standards: std });
    expect(cultural(next)).toEqual([]);
    const onlySpring = planFieldWeek({ field: field({ culturalDone: { aerate: ['2026-04-20'] } }), weather: SEPT, weekStart: '2026-09-21', kept: [], workDays: weekdays, standards: std });
    expect(cultural(onlySpring)[0]).toMatchObject({ details: { nth: 2, of: 2 } });
  });

  test('should ask nothing at level 4 by default', () => {
    const plan = planFieldWeek({ field: field({ maintenanceLevel: 4 }), weather: SEPT, weekStart: WEEK, kept: [], workDays: weekdays });
    expect(cultural(plan)).toEqual([]);
  });
});
