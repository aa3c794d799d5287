import { describe, expect, test } from 'vitest';
import { checkCut, checkMowerForHoc, countMowings, hocSetting, levelIntervalDays, mowTriggerHeightMm, mowerTypeFor, mowingPolicy, overdueDate, simulateMowing } from './mowing.ts';

describe('mowing', () => {
  test('should trigger at 1.5 × HOC and flag cuts removing more than a third', () => {
    expect(mowTriggerHeightMm(50.8)).toBeCloseTo(76.2, 9);
    expect(checkCut(75, 50)).toEqual({ removalFraction: 1 / 3, scalpingRisk: false });
    const deep = checkCut(100, 50);
    expect(deep.removalFraction).toBe(0.5);
    expect(deep.scalpingRisk).toBe(true);
    expect(checkCut(40, 50).removalFraction).toBe(0);
  });

  test('should mow every 5 days at 2 mm/day and 20 mm HOC (10 mm allowed growth)', () => {
    const sim = simulateMowing(20, new Array(30).fill(2), 20, { startDate: '2025-05-01' });
    // Height at the start of day k is 20 + 2k: 30 mm (= 1.5 × HOC, not above) on day 5, 32 mm on
    // day 6, so the cut falls on day 5, then every 5 days.
    expect(sim.mowings.map((m) => m.dayIndex)).toEqual([5, 10, 15, 20, 25]);
    expect(sim.mowings[0]?.date).toBe('2025-05-06');
    expect(sim.mowings[0]?.heightBeforeMm).toBe(30);
    expect(sim.mowings[0]?.scalpingRisk).toBe(false);
    expect(sim.meanIntervalDays).toBe(5);
    expect(sim.mowingsPerWeek).toBeCloseTo((5 / 30) * 7, 12);
    expect(sim.overdueDates).toEqual([]);
    expect(sim.maxHeightMm).toBeLessThanOrEqual(30);
    expect(sim.overdueIfNotMowedDate).toBe('2025-05-07');
    expect(sim.growthMowings).toBe(5);
  });

  test('should add cuts for the level minimum frequency', () => {
    const sim = simulateMowing(40, new Array(21).fill(1), 40, { startDate: '2025-05-01', minMowingsPerWeek: 2 });
    // 7/2 → max 3 days between cuts, while growth alone would allow 20 days.
    expect(sim.frequencyMowings).toBeGreaterThan(0);
    expect(sim.growthMowings).toBe(0);
    for (const i of sim.intervalsDays) expect(i).toBeLessThanOrEqual(3);
  });

  test('should take the shorter of the level interval and ⌊7 ÷ least mowings per week⌋ as the policy', () => {
    expect(levelIntervalDays({ maxMowingIntervalDays: 3, minMowingsPerWeek: 3 })).toBe(2);
    expect(levelIntervalDays({ maxMowingIntervalDays: 4, minMowingsPerWeek: 2 })).toBe(3);
    expect(levelIntervalDays({ maxMowingIntervalDays: 14, minMowingsPerWeek: 0.5 })).toBe(14);
    expect(levelIntervalDays({ maxMowingIntervalDays: 10, minMowingsPerWeek: 0 })).toBe(10);
    expect(mowingPolicy(40, { maxMowingIntervalDays: 4, minMowingsPerWeek: 2 })).toEqual({ maxIntervalDays: 4, minMowingsPerWeek: 2, frequencyMinGrowthMm: 4 });
  });

  test('should skip frequency cuts on dormant turf when a minimum growth is set', () => {
    const sim = simulateMowing(40, new Array(21).fill(0.05), 40, { startDate: '2025-01-01', maxIntervalDays: 3, frequencyMinGrowthMm: 4 });
    expect(sim.mowings).toHaveLength(0);
  });

  test('should mow only on allowed days and report overdue days when those are too far apart', () => {
    // 2025-05-05 is a Monday. 6 mm/day at 20 mm HOC: 30 mm is passed in under 2 days.
    const sim = simulateMowing(20, new Array(14).fill(6), 20, { startDate: '2025-05-05', mowingDays: ['mon'] });
    expect(sim.mowings.every((m) => m.date === '2025-05-05' || m.date === '2025-05-12')).toBe(true);
    expect(sim.overdueDates.length).toBeGreaterThan(0);
    expect(sim.mowings.some((m) => m.scalpingRisk)).toBe(true);
  });

  test('should count what the simulation mows, without dates', () => {
    let seed = 7;
    const rand = () => ((seed = (seed * 16807) % 2147483647) / 2147483647);
    for (let run = 0; run < 50; run++) {
      const growth = Array.from({ length: 120 }, () => rand() * 6);
      const options = { startDate: '2026-04-01', maxIntervalDays: 1 + Math.floor(rand() * 10), minMowingsPerWeek: rand() * 3, frequencyMinGrowthMm: rand() * 3, mowingDays: rand() < 0.5 ? (['mon', 'wed', 'fri'] as const) : undefined };
      const sim = simulateMowing(25.4, growth, 25.4, options);
      expect(countMowings(25.4, growth, 25.4, options)).toEqual({ mowings: sim.mowings.length, growthMowings: sim.growthMowings, mowingsPerWeek: sim.mowingsPerWeek, overdueDays: sim.overdueDates.length });
    }
  });

  test('should predict the overdue date from a forecast', () => {
    // 24 → 26, 28, 30 (not above 30), 32 at the start of 5 June.
    expect(overdueDate(20, 24, [2, 2, 2, 2], '2025-06-01')).toBe('2025-06-05');
    expect(overdueDate(20, 31, [0], '2025-06-01')).toBe('2025-06-01');
    expect(overdueDate(20, 20, [1, 1], '2025-06-01')).toBeNull();
  });

  // Was "reel below 25 mm, rotary from 25 mm": 1 in (25.4 mm) went to a rotary, while common
  // practice cuts 1 in and below with a reel. The limit is now inclusive and in the unit and
  // step the department sets mowers in (an eighth of an inch by default).
  test('should choose reel at 1 in and below and rotary above, in the department setting unit', () => {
    expect(mowerTypeFor(24.9)).toBe('reel');
    expect(mowerTypeFor(25.4)).toBe('reel');
    expect(mowerTypeFor(Math.fround(25.4))).toBe('reel'); // a single-precision database value
    expect(mowerTypeFor(25)).toBe('reel'); // 0.98 in, set at 1 in
    expect(mowerTypeFor(28.575)).toBe('rotary'); // 1⅛ in
    expect(mowerTypeFor(76)).toBe('rotary');
    const metric = { unit: 'mm' as const, step: 1, reelUpToHoc: 25 };
    expect(hocSetting(25.4, metric)).toBe(25);
    expect(mowerTypeFor(25.4, metric)).toBe('reel');
    expect(mowerTypeFor(26, metric)).toBe('rotary');
    expect(hocSetting(34.925)).toBe(1.375);
  });

  test('should warn when a mower cannot hold the HOC or is the wrong kind', () => {
    expect(checkMowerForHoc({ kind: 'rotary', hocMinMm: 25, hocMaxMm: 100 }, 50)).toEqual([]);
    const w = checkMowerForHoc({ kind: 'rotary', hocMinMm: 25, hocMaxMm: 100 }, 16).map((x) => x.code);
    expect(w).toEqual(['hoc_below_range', 'kind_mismatch']);
    expect(checkMowerForHoc({ kind: 'reel', hocMinMm: 6, hocMaxMm: 30 }, 40).map((x) => x.code)).toEqual(['hoc_above_range', 'kind_mismatch']);
  });

  test('should reject a zero HOC, negative growth and bad dates', () => {
    expect(() => mowTriggerHeightMm(0)).toThrow(expect.objectContaining({ code: 'engine/invalid_hoc' }));
    expect(() => simulateMowing(20, [1, -1], 20, { startDate: '2025-05-01' })).toThrow(expect.objectContaining({ code: 'engine/invalid_growth' }));
    expect(() => simulateMowing(20, [1], 20, { startDate: '05/01/2025' })).toThrow(expect.objectContaining({ code: 'engine/invalid_date' }));
    expect(() => simulateMowing(20, [1], 20, { startDate: '2025-05-01', mowingDays: [] })).toThrow(expect.objectContaining({ code: 'engine/invalid_mowing_days' }));
    expect(() => checkMowerForHoc({ kind: 'reel', hocMinMm: 30, hocMaxMm: 10 }, 20)).toThrow(expect.objectContaining({ code: 'engine/invalid_mower' }));
  });
});
