import { describe, expect, test } from 'vitest';
import { addDaysIso } from './dates.ts';
import { prepareWeather, fieldDailySeries, fieldMowingSimulation } from './outlook.ts';
import { simulateMowing } from './mowing.ts';
import { DEFAULT_PARAMETERS, DEFAULT_STANDARDS, hocFor } from './standards.ts';
import { assignWeek, crewDayLoads, isKept, planFieldWeek, reconcileWeek, weekDates } from './weekgen.ts';
import type { AskedOrder, KeptOrder } from './weekgen.ts';
import type { ExistingOrder, PlanField } from './weekgen.ts';
import { weekWarningText } from './week-warnings.ts';
import { planField, steadyDays } from '../testing/fixtures.ts';
import type { Level } from '../vocabulary.ts';
import { WEEKDAYS } from './dates.ts';

const WEEK = '2026-06-01'; // a Monday
const weather = (t: { tmax: number; tmin: number; rain?: number }) => prepareWeather(steadyDays('2026-05-04', 35, t), { latDeg: 38, elevationM: 20 });
const WARM = weather({ tmax: 24, tmin: 16 }); // mean 20 °C: GP 1 for cool-season grass
const COOL = weather({ tmax: 11, tmin: 5 }); // mean 8 °C

// Irrigated, mown on the Sunday before WEEK.
const field = (over: Partial<PlanField> = {}): PlanField =>
  planField({ irrigation: 'automatic', lastMowedOn: '2026-05-31', lastPaintedOn: '2026-05-28', lastCheckedOn: '2026-05-25', ...over });
const allDays = ['mon', 'tue', 'wed', 'thu', 'fri'] as const;
const mowDates = (p: ReturnType<typeof planFieldWeek>) => p.orders.filter((o) => o.task === 'mow').map((o) => o.askedDate);

describe('one mowing policy: season outlook and week plan', () => {
  // Twelve weeks of steady growth from a Monday: mean 20 °C (GP 1 for cool-season grass), rain every day.
  const steady = prepareWeather(steadyDays('2026-04-06', 84, { tmax: 24, tmin: 16, rain: 4 }), { latDeg: 38, elevationM: 20 });
  const mondays = Array.from({ length: 10 }, (_, k) => addDaysIso('2026-04-13', 7 * k));

  test.each([1, 2, 3, 4] as Level[])('should mow in the outlook what the week plan writes at level %d, never below the level minimum', (level) => {
    const std = DEFAULT_STANDARDS[level];
    for (const workDays of [WEEKDAYS, allDays]) {
      const f = field({ maintenanceLevel: level, lastMowedOn: null, lastPaintedOn: null, lastCheckedOn: null });
      const outlook = fieldMowingSimulation({ ...f }, steady, DEFAULT_STANDARDS, DEFAULT_PARAMETERS, { mowingDays: workDays });
      const outlookDates = outlook.mowings.map((m) => m.date);
      for (const monday of mondays) {
        const sunday = addDaysIso(monday, 6);
        const plan = planFieldWeek({ field: f, weather: steady, weekStart: monday, kept: [], workDays });
        const inWeek = outlookDates.filter((d) => d >= monday && d <= sunday);
        expect(mowDates(plan)).toEqual(inWeek);
        // The Standards' least mowings per week (level 4: one in any two weeks).
        if (std.minMowingsPerWeek >= 1) expect(inWeek.length).toBeGreaterThanOrEqual(std.minMowingsPerWeek);
        else expect(outlookDates.filter((d) => d >= addDaysIso(monday, -7) && d <= sunday).length).toBeGreaterThanOrEqual(1);
      }
    }
  });
});

describe('one water budget: season outlook and week plan', () => {
  // Six dry, warm weeks from a Monday (only temperatures: Hargreaves ET0).
  const dry = prepareWeather(steadyDays('2026-06-01', 42, { tmax: 30, tmin: 18, rain: 0 }), { latDeg: 38, elevationM: 20 });

  test('should water in the outlook the depth the week plan schedules, week by week', () => {
    const f = field({ maintenanceLevel: 2, irrigation: 'quick_coupler' });
    const d = fieldDailySeries({ ...f }, dry, DEFAULT_STANDARDS, DEFAULT_PARAMETERS);
    expect(d.weeklyGrossMm).toHaveLength(6);
    d.weeklyGrossMm.forEach((mm, k) => {
      const plan = planFieldWeek({ field: f, weather: dry, weekStart: addDaysIso('2026-06-01', 7 * k), kept: [], workDays: allDays });
      const runs = plan.orders.filter((o) => o.task === 'irrigate');
      expect(runs).toHaveLength(3); // Monday, Wednesday, Friday
      expect(runs[0]!.details.volumeL).toBeCloseTo(mm * f.areaM2, -1);
    });
  });

  test('should grow the turf on the water actually scheduled, not on a share of ETc', () => {
    const f = { ...field({ maintenanceLevel: 1, irrigation: 'automatic' }) };
    const full = fieldDailySeries(f, dry, DEFAULT_STANDARDS, DEFAULT_PARAMETERS);
    // A watering restriction: one day a week, one 20-minute cycle (4 mm at 12 mm/h).
    const restricted = { ...DEFAULT_PARAMETERS, planning: { ...DEFAULT_PARAMETERS.planning, wateringDays: ['mon' as const] }, irrigation: { ...DEFAULT_PARAMETERS.irrigation, maxCyclesPerDay: 1 } };
    const short = fieldDailySeries(f, dry, DEFAULT_STANDARDS, restricted);
    expect(short.weeklyGrossMm[2]).toBeCloseTo(4, 9);
    const lastWeek = (xs: number[]) => xs.slice(-7).reduce((a, b) => a + b, 0);
    expect(lastWeek(short.growthMm)).toBeLessThan(0.5 * lastWeek(full.growthMm));
    // Full replacement of ETc keeps the water modifier near 1 once the 14-day window is filled
    // (the window holds two weeks' watering days give or take one).
    expect(full.growthMm[30]! / (full.gmaxMmPerDay * full.gp[30]!)).toBeGreaterThan(0.95);
  });
});

describe('planFieldWeek', () => {
  test('should ask more mowings in a warm week than in a cool one', () => {
    const warm = planFieldWeek({ field: field(), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays });
    const cool = planFieldWeek({ field: field(), weather: COOL, weekStart: WEEK, kept: [], workDays: allDays });
    expect(mowDates(warm).length).toBeGreaterThanOrEqual(2);
    expect(mowDates(warm).length).toBeGreaterThan(mowDates(cool).length);
  });

  test('should put mowings on the dates the engine simulation gives from the last cut', () => {
    const f = field();
    const plan = planFieldWeek({ field: f, weather: WARM, weekStart: WEEK, kept: [], workDays: allDays });
    // The same run done by hand: growth from the day after the last cut, Monday–Friday mowing days.
    const std = DEFAULT_STANDARDS[2];
    const hoc = hocFor(f);
    const daily = fieldDailySeries({ ...f, id: 1 }, WARM, DEFAULT_STANDARDS, DEFAULT_PARAMETERS);
    const from = WARM.dates.indexOf('2026-06-01');
    // The plan looks a week past Sunday; past the last day of weather it repeats the last week's mean growth.
    const tail = daily.growthMm.slice(-7).reduce((a, b) => a + b, 0) / 7;
    const growth = [...daily.growthMm.slice(from), ...new Array<number>(7).fill(tail)];
    // Cut to HOC on the morning of 31 May; that day's growth follows the cut.
    const sim = simulateMowing(hoc, growth, hoc + daily.growthMm[from - 1]!, {
      startDate: '2026-06-01',
      maxIntervalDays: std.maxMowingIntervalDays,
      minMowingsPerWeek: std.minMowingsPerWeek,
      frequencyMinGrowthMm: 0.1 * hoc,
      mowingDays: allDays,
    });
    const expected = sim.mowings.map((m) => m.date).filter((d) => d <= '2026-06-07');
    expect(expected.length).toBeGreaterThanOrEqual(2);
    expect(mowDates(plan)).toEqual(expected);
    for (const o of plan.orders.filter((x) => x.task === 'mow')) {
      expect(o.details.hocMm).toBe(hoc);
      expect(o.plannedHours).toBeGreaterThan(0.3);
      expect(o.reason).toMatch(/One-third rule|asks a cut/);
    }
  });

  test('should put an overdue mowing on Monday', () => {
    const plan = planFieldWeek({ field: field({ lastMowedOn: '2026-05-20' }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays });
    const first = plan.orders.find((o) => o.task === 'mow');
    expect(first?.askedDate).toBe(WEEK);
    expect(first?.reason).toMatch(/^Overdue/);
  });

  test('should count a kept mowing as a cut and plan around it', () => {
    const free = mowDates(planFieldWeek({ field: field(), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays }));
    const keptDate = '2026-06-01';
    const withKept = mowDates(planFieldWeek({ field: field(), weather: WARM, weekStart: WEEK, kept: [{ id: 9, fieldId: 1, task: 'mow', plannedDate: keptDate, status: 'assigned' }], workDays: allDays }));
    expect(withKept).not.toContain(keptDate);
    expect(withKept.length).toBeLessThanOrEqual(free.length);
    // A skipped kept order is not a cut.
    const skipped = mowDates(planFieldWeek({ field: field(), weather: WARM, weekStart: WEEK, kept: [{ id: 9, fieldId: 1, task: 'mow', plannedDate: keptDate, status: 'skipped' }], workDays: allDays }));
    expect(skipped).toEqual(free);
  });

  test('should paint lines the day before a booking, once for bookings close together', () => {
    const events = [
      { id: 1, startsOn: '2026-06-04', title: 'League game' },
      { id: 2, startsOn: '2026-06-05', title: 'Second game' },
    ];
    const plan = planFieldWeek({ field: field({ events, lastPaintedOn: '2026-05-30' }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays });
    const paints = plan.orders.filter((o) => o.task === 'paint_lines');
    expect(paints.map((p) => p.askedDate)).toEqual(['2026-06-03']);
    expect(paints[0]?.latestDate).toBe('2026-06-03');
    expect(paints[0]?.details.paintL).toBeGreaterThan(0);
  });

  test('should repaint by the level interval and keep no lines on lawns', () => {
    const plan = planFieldWeek({ field: field({ lastPaintedOn: '2026-05-24' }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays });
    // Level 2 repaints every 10 days: 24 May + 10 = 3 June.
    expect(plan.orders.filter((o) => o.task === 'paint_lines').map((o) => o.askedDate)).toEqual(['2026-06-03']);
    const lawn = planFieldWeek({ field: field({ sport: 'lawn', lastPaintedOn: null }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays });
    expect(lawn.orders.some((o) => o.task === 'paint_lines')).toBe(false);
  });

  test('should paint a first coat where no lines show and touch up lines that do', () => {
    const touch = planFieldWeek({ field: field({ lastPaintedOn: '2026-05-24' }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays }).orders.find((o) => o.task === 'paint_lines')!;
    const first = planFieldWeek({ field: field({ lastPaintedOn: null }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays }).orders.find((o) => o.task === 'paint_lines')!;
    const grownOut = planFieldWeek({ field: field({ lastPaintedOn: '2026-04-20' }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays }).orders.find((o) => o.task === 'paint_lines')!;
    expect(touch.details.coat).toBe('touch_up');
    expect(first.details.coat).toBe('first');
    expect(grownOut.details.coat).toBe('first');
    // A touch-up: one pass, half the mixed paint, mixed 3:1 rather than 1:1.
    expect(touch.details.mixedL as number).toBeCloseTo((first.details.mixedL as number) / 2, 0);
    expect(touch.details.paintL as number).toBeLessThan((first.details.paintL as number) / 3);
    expect(touch.plannedHours).toBeLessThan(first.plannedHours);
  });

  test('should plan a field check when the level interval runs out', () => {
    // Level 2 checks every 14 days: 25 May + 14 = 8 June, next week.
    expect(planFieldWeek({ field: field(), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays }).orders.some((o) => o.task === 'field_check')).toBe(false);
    const due = planFieldWeek({ field: field({ lastCheckedOn: '2026-05-19' }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays });
    expect(due.orders.find((o) => o.task === 'field_check')?.askedDate).toBe('2026-06-02');
  });

  test('should plan watering on the allowed days only, and none on a rainy week or without irrigation', () => {
    const dry = weather({ tmax: 30, tmin: 18, rain: 0 });
    const plan = planFieldWeek({ field: field({ irrigation: 'quick_coupler' }), weather: dry, weekStart: WEEK, kept: [], workDays: allDays });
    const water = plan.orders.filter((o) => o.task === 'irrigate');
    expect(water.map((o) => o.askedDate)).toEqual(['2026-06-01', '2026-06-03', '2026-06-05']);
    expect(water[0]?.details.runTimeMin).toBeGreaterThan(0);
    const wet = weather({ tmax: 24, tmin: 16, rain: 20 });
    expect(planFieldWeek({ field: field(), weather: wet, weekStart: WEEK, kept: [], workDays: allDays }).orders.some((o) => o.task === 'irrigate')).toBe(false);
    expect(planFieldWeek({ field: field({ irrigation: 'none' }), weather: dry, weekStart: WEEK, kept: [], workDays: allDays }).orders.some((o) => o.task === 'irrigate')).toBe(false);
    const auto = planFieldWeek({ field: field(), weather: dry, weekStart: WEEK, kept: [], workDays: allDays }).orders.filter((o) => o.task === 'irrigate');
    expect(auto).toHaveLength(1);
    expect((auto[0]?.details.runs as unknown[]).length).toBe(3);
  });

  test('should plan only the check on a closed field and say when weather is projected', () => {
    const closed = planFieldWeek({ field: field({ status: 'closed', lastCheckedOn: null }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays });
    expect(closed.orders.map((o) => o.task)).toEqual(['field_check']);
    const late = planFieldWeek({ field: field(), weather: WARM, weekStart: '2026-06-08', kept: [], workDays: allDays });
    expect(late.warnings.map((w) => w.code)).toContain('weather_projected');
    expect(late.warnings.map((w) => weekWarningText(w)).join(' ')).toMatch(/projected/);
  });

  test('should plan nothing on a retired field, not even its check, and say why', () => {
    const retired = planFieldWeek({ field: field({ status: 'retired', lastCheckedOn: null }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays });
    expect(retired.orders).toEqual([]);
    expect(retired.warnings.map((w) => weekWarningText(w))).toEqual(['The field is retired: nothing is planned for it.']);
  });

  test('should refuse a week that does not start on a Monday', () => {
    expect(() => weekDates('2026-06-02')).toThrow(/Monday/);
  });
});

describe('stripe patterns on mowing orders', () => {
  test('should put the field’s pattern on its mowings and plan the pass-plan time when it is longer', () => {
    const plain = planFieldWeek({ field: field(), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays }).orders.filter((o) => o.task === 'mow');
    const board = planFieldWeek({ field: field({ stripes: { pattern: 'checkerboard', mowerId: null } }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays }).orders.filter((o) => o.task === 'mow');
    expect(board.map((o) => o.askedDate)).toEqual(plain.map((o) => o.askedDate));
    const [p, b] = [plain[0]!, board[0]!];
    expect(p.details.pattern).toBeUndefined();
    expect(b.details.pattern).toBe('checkerboard');
    // A checkerboard drives the field twice: its pass plan passes the side-to-side plan.
    expect(b.plannedHours).toBeGreaterThan(p.plannedHours);
    expect(b.details.hoursMethod).toBe('stripe_plan');
    expect(b.reason).toMatch(/Checkerboard \(criss-cross\): \d+ passes take [\d.]+ h, longer than the plain mowing time/);
  });

  test('should keep the plain time and say so when the pattern takes no longer', () => {
    // A sports field's plain time is its side-to-side plan; length-wise passes at full efficiency
    // drive the same distance with fewer turns (100 m × 64 m: about 64 ÷ w passes against 100 ÷ w).
    const full = (m: (typeof DEFAULT_PARAMETERS.mowers)['reel']) => ({ ...m, efficiency: 1 });
    const params = { ...DEFAULT_PARAMETERS, mowers: { reel: full(DEFAULT_PARAMETERS.mowers.reel), rotary: full(DEFAULT_PARAMETERS.mowers.rotary) } };
    const withPattern = planFieldWeek({ field: field({ stripes: { pattern: 'lengthwise', mowerId: null } }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays, params }).orders.find((o) => o.task === 'mow')!;
    const without = planFieldWeek({ field: field(), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays, params }).orders.find((o) => o.task === 'mow')!;
    expect(withPattern.details.pattern).toBe('lengthwise');
    expect(withPattern.plannedHours).toBe(without.plannedHours);
    expect(withPattern.reason).toMatch(/within the plain mowing time/);
  });
});

describe('assignWeek', () => {
  const yard = { lat: 38, lng: -77 };
  const sites = new Map([
    [10, { lat: 38.01, lng: -77 }],
    [11, { lat: 38.02, lng: -77.01 }],
    [12, { lat: 38.0, lng: -77.03 }],
  ]);
  const travel = DEFAULT_PARAMETERS.travel;
  const asked = (siteId: number, fieldId: number, date: string, hours: number, flexible = false) => ({
    fieldId,
    siteId,
    task: flexible ? ('field_check' as const) : ('mow' as const),
    askedDate: date,
    plannedHours: hours,
    reason: '',
    details: {},
    latestDate: flexible ? null : date,
    flexible,
    equipmentKind: null,
  });

  test('should keep a site with one crew and spread sites across crews by load', () => {
    const { orders } = assignWeek({
      weekStart: WEEK,
      orders: [asked(10, 1, '2026-06-02', 3), asked(10, 2, '2026-06-02', 2), asked(11, 3, '2026-06-03', 4), asked(12, 4, '2026-06-04', 1)],
      crews: [
        { id: 1, hoursPerDay: 8, workDays: allDays },
        { id: 2, hoursPerDay: 8, workDays: allDays },
      ],
      sites,
      yard,
      travel,
    });
    const crewOf = (f: number) => orders.find((o) => o.fieldId === f)?.crewId;
    expect(crewOf(1)).toBe(crewOf(2));
    expect(crewOf(3)).not.toBe(crewOf(1));
  });

  test('should move a mowing to the crew working day before the rule date', () => {
    const { orders } = assignWeek({ weekStart: WEEK, orders: [asked(10, 1, '2026-06-06', 2)], crews: [{ id: 1, hoursPerDay: 8, workDays: allDays }], sites, yard, travel });
    expect(orders[0]?.plannedDate).toBe('2026-06-05'); // Saturday → Friday
  });

  test('should move flexible work off an overloaded day', () => {
    const { orders } = assignWeek({
      weekStart: WEEK,
      orders: [asked(10, 1, '2026-06-01', 7), asked(10, 2, '2026-06-01', 3, true)],
      crews: [{ id: 1, hoursPerDay: 8, workDays: allDays }],
      sites,
      yard,
      travel,
    });
    expect(orders.find((o) => o.fieldId === 1)?.plannedDate).toBe('2026-06-01');
    expect(orders.find((o) => o.fieldId === 2)?.plannedDate).not.toBe('2026-06-01');
  });

  test('should leave orders unassigned with a warning when no crew works', () => {
    const r = assignWeek({ weekStart: WEEK, orders: [asked(10, 1, '2026-06-02', 2)], crews: [], sites, yard, travel });
    expect(r.orders[0]?.crewId).toBeNull();
    expect(r.warnings[0]).toEqual({ code: 'no_crew' });
    expect(weekWarningText(r.warnings[0]!)).toMatch(/No crew/);
  });
});

describe('crewDayLoads', () => {
  test('should add drive and load/unload to work hours and flag overload', () => {
    const sites = new Map([
      [10, { lat: 38.05, lng: -77 }],
      [11, { lat: 38.1, lng: -77 }],
    ]);
    const loads = crewDayLoads(
      [
        { id: 1, crewId: 1, plannedDate: WEEK, siteId: 10, plannedHours: 4 },
        { id: 2, crewId: 1, plannedDate: WEEK, siteId: 11, plannedHours: 3.5 },
      ],
      [{ id: 1, hoursPerDay: 8, workDays: allDays }],
      sites,
      { lat: 38, lng: -77 },
      DEFAULT_PARAMETERS.travel,
      WEEK,
    );
    const monday = loads.find((l) => l.date === WEEK)!;
    expect(monday.route).toEqual([10, 11]);
    expect(monday.loadUnloadHours).toBeCloseTo(0.5, 6);
    // Yard → 5.6 km → 11.1 km → yard: 22.2 km great-circle × 1.3 ÷ 35 km/h ≈ 0.82 h.
    expect(monday.driveHours).toBeCloseTo(0.83, 1);
    expect(monday.totalHours).toBeGreaterThan(8);
    expect(monday.overloaded).toBe(true);
    expect(loads.find((l) => l.date === '2026-06-06')?.availableHours).toBe(0);
  });
});

describe('reconcileWeek', () => {
  const row = (over: Partial<ExistingOrder>): ExistingOrder => ({ id: 1, fieldId: 1, task: 'mow', plannedDate: '2026-06-02', plannedHours: 1, crewId: 1, equipmentId: null, status: 'planned', origin: 'generated', pinned: false, reason: '', ...over });
  const plan = (over: Partial<{ fieldId: number; task: 'mow'; plannedDate: string; plannedHours: number; crewId: number | null; equipmentId: number | null }>) => ({ fieldId: 1, task: 'mow' as const, plannedDate: '2026-06-02', plannedHours: 1, crewId: 1, equipmentId: null, ...over });

  test('should keep pinned, manual and logged orders and diff the rest', () => {
    const existing = [
      row({ id: 1 }),
      row({ id: 2, plannedDate: '2026-06-04' }),
      row({ id: 3, fieldId: 2, pinned: true }),
      row({ id: 4, fieldId: 3, origin: 'manual' }),
      row({ id: 5, fieldId: 4, status: 'done' }),
      row({ id: 6, fieldId: 5 }),
    ];
    const r = reconcileWeek(existing, [plan({}), plan({ plannedDate: '2026-06-05' }), plan({ fieldId: 6 })]);
    expect(r.kept.map((k) => k.id)).toEqual([3, 4, 5]);
    expect(r.unchanged.map((k) => k.id)).toEqual([1]);
    expect(r.update).toHaveLength(1);
    expect(r.update[0]).toMatchObject({ id: 2, what: ['date'] });
    expect(r.remove.map((k) => k.id)).toEqual([6]);
    expect(r.insert.map((p) => p.fieldId)).toEqual([6]);
    expect(isKept(row({ status: 'started' }))).toBe(true);
  });
});

describe('planFieldWeek without a mowing on record', () => {
  test('should assume the rule was kept before the week, not call the field overdue', () => {
    const plan = planFieldWeek({ field: field({ lastMowedOn: null }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays });
    const mows = plan.orders.filter((o) => o.task === 'mow');
    expect(mows.length).toBeGreaterThan(0);
    expect(mows.every((o) => !o.reason.startsWith('Overdue'))).toBe(true);
    expect(plan.warnings.map((w) => weekWarningText(w)).join(' ')).toMatch(/No mowing on record/);
  });

  test('should plan a past week as if the rule was kept when the last cut on record is later', () => {
    const assumed = mowDates(planFieldWeek({ field: field({ lastMowedOn: null }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays }));
    const later = planFieldWeek({ field: field({ lastMowedOn: '2026-06-20' }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays });
    expect(mowDates(later)).toEqual(assumed);
    expect(later.warnings.map((w) => weekWarningText(w)).join(' ')).toMatch(/after this week began/);
  });
});

describe('a week already under way', () => {
  test('should move what the past days asked for onto the first day still open', () => {
    const plan = planFieldWeek({ field: field({ lastCheckedOn: '2026-05-10' }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays, notBefore: '2026-06-03' });
    expect(plan.orders.every((o) => o.askedDate >= '2026-06-03')).toBe(true);
    expect(plan.orders.find((o) => o.task === 'field_check')?.askedDate).toBe('2026-06-03');
    const { orders } = assignWeek({
      weekStart: WEEK,
      orders: plan.orders,
      crews: [{ id: 1, hoursPerDay: 8, workDays: allDays }],
      sites: new Map([[10, { lat: 38, lng: -77 }]]),
      yard: { lat: 38, lng: -77 },
      travel: DEFAULT_PARAMETERS.travel,
      notBefore: '2026-06-03',
    });
    expect(orders.every((o) => o.plannedDate >= '2026-06-03')).toBe(true);
  });
});

describe('lines for a booking', () => {
  const crew = [{ id: 1, hoursPerDay: 8, workDays: allDays }];
  const place = (orders: AskedOrder[], notBefore?: string, weekStart = WEEK) =>
    assignWeek({ weekStart, orders, crews: crew, sites: new Map([[10, { lat: 38, lng: -77 }]]), yard: { lat: 38, lng: -77 }, travel: DEFAULT_PARAMETERS.travel, ...(notBefore ? { notBefore } : {}) }).orders;
  const paintsOf = <T extends { task: string }>(orders: readonly T[]): T[] => orders.filter((o) => o.task === 'paint_lines');
  const monday = { id: 7, startsOn: '2026-06-08', title: 'Cup final' };

  test('should paint a booking once however often the week is generated, and not again the week after', () => {
    const f = field({ events: [monday], lastPaintedOn: '2026-05-30' });
    // First generation: Monday's booking is painted on the Friday before it.
    const first = place(planFieldWeek({ field: f, weather: WARM, weekStart: WEEK, kept: [], workDays: allDays }).orders);
    const painted = paintsOf(first);
    expect(painted.map((p) => p.plannedDate)).toEqual(['2026-06-05']);
    // Applied and confirmed: the painting is kept (assigned, pinned); generating again asks none.
    const kept: KeptOrder[] = [{ id: 40, fieldId: 1, task: 'paint_lines', plannedDate: '2026-06-05', status: 'assigned', details: painted[0]!.details }];
    expect(paintsOf(planFieldWeek({ field: f, weather: WARM, weekStart: WEEK, kept, workDays: allDays }).orders)).toEqual([]);
    // The next week holds the booking's day: last week's painting serves it, and the repaint interval (10 days) is not up.
    const next = planFieldWeek({ field: { ...f, paints: [{ date: '2026-06-05', eventId: 7 }] }, weather: WARM, weekStart: '2026-06-08', kept: [], workDays: allDays });
    expect(paintsOf(next.orders)).toEqual([]);
    // Two weeks on, the repaint interval asks for lines again (5 June + 10 days = 15 June).
    const later = planFieldWeek({ field: { ...f, events: [], paints: [{ date: '2026-06-05', eventId: 7 }] }, weather: WARM, weekStart: '2026-06-15', kept: [], workDays: allDays });
    expect(paintsOf(later.orders).map((o) => o.askedDate)).toEqual(['2026-06-15']);
  });

  test('should paint on the last working day before the booking, not on its day', () => {
    const friday = planFieldWeek({ field: field({ events: [{ id: 1, startsOn: '2026-06-05', title: 'Friday game' }], lastPaintedOn: '2026-05-30' }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays });
    expect(paintsOf(place(friday.orders)).map((o) => o.plannedDate)).toEqual(['2026-06-04']);
    const tuesday = planFieldWeek({ field: field({ events: [{ id: 2, startsOn: '2026-06-02', title: 'Tuesday game' }], lastPaintedOn: '2026-05-30' }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays });
    expect(paintsOf(place(tuesday.orders)).map((o) => o.plannedDate)).toEqual(['2026-06-01']);
    expect(tuesday.warnings.map((w) => w.code)).not.toContain('paint_on_event_day');
  });

  test('should paint on the day itself only when no working day is left before it, and say so', () => {
    // Generated on the Tuesday of the game: Monday is past.
    const late = planFieldWeek({ field: field({ events: [{ id: 2, startsOn: '2026-06-02', title: 'Tuesday game' }], lastPaintedOn: '2026-05-30' }), weather: WARM, weekStart: WEEK, kept: [], workDays: allDays, notBefore: '2026-06-02' });
    expect(paintsOf(place(late.orders, '2026-06-02')).map((o) => o.plannedDate)).toEqual(['2026-06-02']);
    const warning = late.warnings.find((w) => w.code === 'paint_on_event_day');
    expect(warning).toEqual({ code: 'paint_on_event_day', fieldId: 1, date: '2026-06-02', eventTitle: 'Tuesday game' });
    expect(weekWarningText(warning!, () => 'Field A')).toMatch(/Field A.*Tuesday game.*on the day itself/);
  });
});

describe('spreading work with slack', () => {
  test('should spread a district\'s overdue field checks over crews and days within their hours, none on today', () => {
    // Generated on Wednesday afternoon: two crews that know the sites, and a new crew with free hours.
    const today = '2026-06-03';
    const sites = new Map<number, { lat: number; lng: number }>([
      [10, { lat: 38.01, lng: -77 }],
      [11, { lat: 38.02, lng: -77.01 }],
      [12, { lat: 38.0, lng: -77.03 }],
    ]);
    const crews = [
      { id: 1, hoursPerDay: 8, workDays: allDays },
      { id: 2, hoursPerDay: 8, workDays: allDays },
      { id: 3, hoursPerDay: 8, workDays: allDays },
    ];
    const orders: AskedOrder[] = [];
    for (let i = 0; i < 17; i++) {
      const f = field({ id: 100 + i, siteId: 10 + (i % 3), lastCheckedOn: null, events: [] });
      orders.push(...planFieldWeek({ field: f, weather: WARM, weekStart: WEEK, kept: [], workDays: allDays, notBefore: today }).orders.filter((o) => o.task === 'field_check'));
    }
    // Today's mowing already fills most of crew 1's day.
    orders.push({ fieldId: 1, siteId: 10, task: 'mow', askedDate: today, plannedHours: 6, reason: '', details: {}, latestDate: today, flexible: false, equipmentKind: 'mower' });
    expect(orders.filter((o) => o.task === 'field_check')).toHaveLength(17);
    const hint = new Map([[10, 1], [11, 1], [12, 2]]);
    const { orders: placed } = assignWeek({ weekStart: WEEK, orders, crews, siteCrewHint: hint, sites, yard: { lat: 38, lng: -77 }, travel: DEFAULT_PARAMETERS.travel, notBefore: today });
    const checks = placed.filter((o) => o.task === 'field_check');
    expect(checks.filter((o) => o.plannedDate === today)).toEqual([]);
    expect(new Set(checks.map((o) => o.plannedDate)).size).toBeGreaterThanOrEqual(2);
    expect(checks.some((o) => o.crewId === 3)).toBe(true);
    const loads = crewDayLoads(placed.map((o, i) => ({ ...o, id: i + 1 })), crews, sites, { lat: 38, lng: -77 }, DEFAULT_PARAMETERS.travel, WEEK);
    expect(loads.filter((l) => l.overloaded)).toEqual([]);
  });
});

describe('watering kept by a crew that does not work the run day', () => {
  // A crew off on Fridays (Mon–Thu and Saturday) waters Friday's run on Thursday.
  const offFriday = ['mon', 'tue', 'wed', 'thu', 'sat'] as const;
  const dry = weather({ tmax: 30, tmin: 18, rain: 0 });
  const f = field({ irrigation: 'quick_coupler' });

  test('should not ask a run again once the order for it is kept on another day', () => {
    const first = planFieldWeek({ field: f, weather: dry, weekStart: WEEK, kept: [], workDays: offFriday });
    const runs = first.orders.filter((o) => o.task === 'irrigate');
    expect(runs.map((o) => o.askedDate)).toEqual(['2026-06-01', '2026-06-03', '2026-06-05']);
    const { orders: placed } = assignWeek({ weekStart: WEEK, orders: runs, crews: [{ id: 7, hoursPerDay: 9, workDays: offFriday }], sites: new Map([[10, { lat: 38.01, lng: -77 }]]), yard: { lat: 38, lng: -77 }, travel: DEFAULT_PARAMETERS.travel });
    expect(placed.map((o) => o.plannedDate)).toEqual(['2026-06-01', '2026-06-03', '2026-06-04']);
    // Confirmed: every order is kept where the crew does it.
    const kept: KeptOrder[] = placed.map((o, i) => ({ id: i + 1, fieldId: o.fieldId, task: o.task, plannedDate: o.plannedDate, status: 'assigned', details: o.details }));
    const again = planFieldWeek({ field: f, weather: dry, weekStart: WEEK, kept, workDays: offFriday });
    expect(again.orders.filter((o) => o.task === 'irrigate')).toEqual([]);
  });

  test('should count an order kept without the run it was for against the run it was moved from', () => {
    const kept: KeptOrder[] = ['2026-06-01', '2026-06-03', '2026-06-04'].map((d, i) => ({ id: i + 1, fieldId: f.id, task: 'irrigate', plannedDate: d, status: 'assigned', details: {} }));
    expect(planFieldWeek({ field: f, weather: dry, weekStart: WEEK, kept, workDays: offFriday }).orders.filter((o) => o.task === 'irrigate')).toEqual([]);
    // Two runs kept: the one left is asked.
    const two = planFieldWeek({ field: f, weather: dry, weekStart: WEEK, kept: kept.slice(0, 2), workDays: offFriday });
    expect(two.orders.filter((o) => o.task === 'irrigate').map((o) => o.askedDate)).toEqual(['2026-06-05']);
  });
});

describe('crew-days within their hours with kept work on them', () => {
  const yard = { lat: 38, lng: -77 };
  const sites = new Map<number, { lat: number; lng: number }>([
    [10, { lat: 38.01, lng: -77 }],
    [11, { lat: 38.02, lng: -77.01 }],
    [12, { lat: 38.0, lng: -77.03 }],
    [13, { lat: 38.015, lng: -77.02 }],
  ]);
  const travel = DEFAULT_PARAMETERS.travel;
  const MONDAY = WEEK;
  const FRIDAY = '2026-06-05';
  const water = (siteId: number, fieldId: number, date: string): AskedOrder => ({ fieldId, siteId, task: 'irrigate', askedDate: date, plannedHours: 0.75, reason: '', details: {}, latestDate: date, flexible: false, equipmentKind: null });
  const check = (siteId: number, fieldId: number): AskedOrder => ({ fieldId, siteId, task: 'field_check', askedDate: MONDAY, plannedHours: 0.6, reason: '', details: {}, latestDate: null, flexible: true, equipmentKind: null });
  // Crew 1 (9 h) did the season's mowing at every site: 6.5 h of it is kept (done, pinned) on Monday and on Friday.
  const keptHours = new Map([[`1|${MONDAY}`, 6.5], [`1|${FRIDAY}`, 6.5]]);
  const keptSites = new Map([[`1|${MONDAY}`, [10, 11, 12, 13]], [`1|${FRIDAY}`, [10, 11, 12, 13]]]);
  const hint = new Map([[10, 1], [11, 1], [12, 1], [13, 1]]);
  const asked: AskedOrder[] = [];
  for (const [i, siteId] of [10, 11, 12, 13].entries()) {
    asked.push(water(siteId, 20 + i, MONDAY), water(siteId, 30 + i, MONDAY), water(siteId, 20 + i, FRIDAY), check(siteId, 40 + i));
  }
  const loadsOf = (placed: ReturnType<typeof assignWeek>['orders'], crews: { id: number; hoursPerDay: number; workDays: readonly ('mon' | 'tue' | 'wed' | 'thu' | 'fri')[] }[]) => {
    // The kept orders stand on the board beside the new ones.
    const keptRows = [MONDAY, FRIDAY].flatMap((date, k) => [10, 11, 12, 13].map((siteId, i) => ({ id: 900 + k * 10 + i, crewId: 1, plannedDate: date, siteId, plannedHours: 6.5 / 4, status: 'done' as const })));
    return crewDayLoads([...keptRows, ...placed.map((o, i) => ({ ...o, id: i + 1 }))], crews, sites, yard, travel, WEEK);
  };

  test('should keep each crew-day within its hours, moving work due that day to a crew with room', () => {
    const crews = [
      { id: 1, hoursPerDay: 9, workDays: allDays },
      { id: 2, hoursPerDay: 8, workDays: allDays },
    ];
    const { orders: placed, warnings } = assignWeek({ weekStart: WEEK, orders: asked, crews, keptHours, keptSites, siteCrewHint: hint, sites, yard, travel });
    expect(placed).toHaveLength(asked.length);
    // Watering stays on its day; the work with slack finds a day with room.
    for (const o of placed.filter((o) => o.task === 'irrigate')) expect(o.plannedDate).toBe(o.askedDate);
    const over = loadsOf(placed, crews).filter((l) => l.overloaded);
    expect(over.map((l) => `${l.crewId} ${l.date} ${l.totalHours}/${l.availableHours}`)).toEqual([]);
    expect(placed.some((o) => o.crewId === 2 && o.plannedDate === MONDAY)).toBe(true);
    expect(warnings.filter((w) => w.code === 'crew_day_over')).toEqual([]);
  });

  test('should put only work due that day over the hours when no crew has room, and say so', () => {
    const crews = [{ id: 1, hoursPerDay: 9, workDays: allDays }];
    const { orders: placed, warnings } = assignWeek({ weekStart: WEEK, orders: asked, crews, keptHours, keptSites, siteCrewHint: hint, sites, yard, travel });
    const over = loadsOf(placed, crews).filter((l) => l.overloaded);
    expect(over.map((l) => l.date)).toEqual([MONDAY, FRIDAY]);
    // What stands over the hours is the watering due those days, nothing with slack.
    expect(placed.filter((o) => o.plannedDate === MONDAY || o.plannedDate === FRIDAY).every((o) => o.task === 'irrigate')).toBe(true);
    const said = warnings.filter((w) => w.code === 'crew_day_over');
    expect(said).toEqual([expect.objectContaining({ crewId: 1, date: MONDAY, available: 9 }), expect.objectContaining({ crewId: 1, date: FRIDAY, available: 9 })]);
    expect(weekWarningText(said[0]!, undefined, () => 'Crew A')).toMatch(/^Crew A has \d+:\d\d h planned on 2026-06-01 for 9:00 h/);
  });
  test('should leave work with slack where the last generation put it while that day still has room, and move it when it has none', () => {
    const crews = [{ id: 1, hoursPerDay: 9, workDays: allDays }];
    const aerate: AskedOrder = { fieldId: 50, siteId: 10, task: 'aerate', askedDate: MONDAY, plannedHours: 2, reason: '', details: {}, latestDate: FRIDAY, flexible: true, equipmentKind: null };
    const first = assignWeek({ weekStart: WEEK, orders: [aerate], crews, sites, yard, travel }).orders[0]!;
    // A foreman then pins 3 h of other work on that day: the day still has room, the aeration stays.
    const withHand = { keptHours: new Map([[`1|${first.plannedDate}`, 3]]), keptSites: new Map([[`1|${first.plannedDate}`, [11]]]) };
    const previous = [{ fieldId: 50, task: 'aerate' as const, plannedDate: first.plannedDate, crewId: 1 }];
    expect(assignWeek({ weekStart: WEEK, orders: [aerate], crews, sites, yard, travel, ...withHand }).orders[0]!.plannedDate).not.toBe(first.plannedDate);
    expect(assignWeek({ weekStart: WEEK, orders: [aerate], crews, sites, yard, travel, ...withHand, previous }).orders[0]).toMatchObject({ plannedDate: first.plannedDate, crewId: 1 });
    // A day filled past the crew's hours is a changed input: the aeration goes where there is room.
    const full = { keptHours: new Map([[`1|${first.plannedDate}`, 8]]), keptSites: new Map([[`1|${first.plannedDate}`, [11]]]) };
    expect(assignWeek({ weekStart: WEEK, orders: [aerate], crews, sites, yard, travel, ...full, previous }).orders[0]!.plannedDate).not.toBe(first.plannedDate);
  });
});
