import { describe, expect, test } from 'vitest';
import * as w from './water.ts';

describe('water', () => {
  test('should give turf Kc with the 0.10 reduction', () => {
    expect(w.turfKc('cool')).toBe(0.95);
    expect(w.turfKc('warm', { stage: 'ini' })).toBe(0.8);
    expect(w.turfKc('cool', { reduced: true })).toBeCloseTo(0.85, 12);
    expect(w.cropEvapotranspiration(0.85, 5)).toBeCloseTo(4.25, 12);
  });

  test("should budget with the department's turf Kc and its reduction", () => {
    const settings = { cool: 0.8, warm: 0.6, reducedBy: 0.1 };
    expect(w.departmentTurfKc('cool', false, settings)).toBe(0.8);
    expect(w.departmentTurfKc('warm', true, settings)).toBeCloseTo(0.5, 12);
    expect(() => w.departmentTurfKc('warm', true, { ...settings, reducedBy: 0.6 })).toThrow(expect.objectContaining({ code: 'engine/invalid_kc' }));
  });

  test('should apply the effective rain steps', () => {
    expect(w.effectiveRainMm(2.54)).toBe(0);
    expect(w.effectiveRainMm(25.4)).toBeCloseTo(0.9 * 25.4, 9);
    expect(w.effectiveRainMm(50.8)).toBeCloseTo((0.9 + 2 / 3) * 25.4, 9);
    expect(w.effectiveRainMm(200)).toBeCloseTo(w.effectiveRainMm(50.8), 9);
    expect(w.effectiveRainMm(0)).toBe(0);
  });

  test('should compute net and gross need', () => {
    expect(w.netIrrigationMm(30, 10, 0.8)).toBeCloseTo(14, 12);
    expect(w.netIrrigationMm(10, 30)).toBe(0);
    // One method: gross = net × SM, SM = 1 / (0.4 + 0.6 DU). Was net ÷ DU (20 mm here), a
    // second method beside the multiplier that asked more water than the one taught.
    expect(w.grossIrrigationMm(14, 0.7)).toBeCloseTo(14 / 0.82, 12);
    expect(w.grossIrrigationMm(10, 1)).toBeCloseTo(10, 12);
    expect(w.weekIrrigation(30, 10, 0.8, 0.7, 2)).toEqual({ netMm: 14, grossMm: 14 / 0.82, scheduled: true });
    expect(w.weekIrrigation(10, 7, 0.8, 0.7, 2).scheduled).toBe(false); // 1.2 mm gross: below the least worth watering
  });

  test('should compute low-quarter DU from catch cans', () => {
    // Lowest quarter of 8 cans: 2 and 4 → 3; mean 6 → 0.5.
    expect(w.distributionUniformityLowQuarter([2, 4, 6, 6, 7, 7, 8, 8])).toBeCloseTo(0.5, 12);
    expect(w.distributionUniformityLowQuarter([5, 5, 5, 5])).toBe(1);
  });

  test('should give the same precipitation rate in both unit systems', () => {
    // 10 gpm over 1000 ft² vs the same in L/min over m².
    const inPerH = w.precipitationRateInPerH(10, 1000);
    const mmPerH = w.precipitationRateMmPerH(10 * 3.785411784, 1000 * 0.09290304);
    expect(mmPerH / 25.4).toBeCloseTo(inPerH, 2);
    expect(w.runTimeMinutes(10, 20)).toBe(30);
    expect(w.irrigationVolumeLitres(12, 7000)).toBe(84_000);
  });

  test('should split a week over the allowed days with cycle and soak', () => {
    const s = w.weeklyIrrigationSchedule({ grossMmPerWeek: 24, precipRateMmPerH: 12, allowedDays: ['thu', 'mon'], maxRunMinPerCycle: 20 });
    expect(s.days.map((d) => d.day)).toEqual(['mon', 'thu']);
    // 12 mm per day at 12 mm/h = 60 min → 3 cycles of 20 min.
    expect(s.days[0]).toMatchObject({ cycles: 3, minutesPerCycle: 20, totalMinutes: 60 });
    expect(s.appliedMm).toBeCloseTo(24, 12);
    expect(s.shortfallMm).toBe(0);
  });

  test('should report a shortfall when restrictions cannot deliver the need', () => {
    const s = w.weeklyIrrigationSchedule({ grossMmPerWeek: 40, precipRateMmPerH: 10, allowedDays: ['sat'], maxRunMinPerCycle: 15, maxCyclesPerDay: 4 });
    expect(s.days[0]?.totalMinutes).toBe(60);
    expect(s.appliedMm).toBeCloseTo(10, 12);
    expect(s.shortfallMm).toBeCloseTo(30, 12);
  });

  test('should reject bad inputs', () => {
    expect(() => w.effectiveRainMm(-1)).toThrow(expect.objectContaining({ code: 'engine/invalid_rain' }));
    expect(() => w.schedulingMultiplier(0)).toThrow(expect.objectContaining({ code: 'engine/invalid_du' }));
    expect(() => w.grossIrrigationMm(10, 1.2)).toThrow(expect.objectContaining({ code: 'engine/invalid_du' }));
    expect(() => w.precipitationRateInPerH(5, 0)).toThrow(expect.objectContaining({ code: 'engine/invalid_area' }));
    expect(() => w.distributionUniformityLowQuarter([1, 2])).toThrow(expect.objectContaining({ code: 'engine/invalid_catch_cans' }));
    expect(() => w.weeklyIrrigationSchedule({ grossMmPerWeek: 10, precipRateMmPerH: 10, allowedDays: [], maxRunMinPerCycle: 10 })).toThrow(expect.objectContaining({ code: 'engine/no_watering_days' }));
    expect(() => w.weeklyIrrigationSchedule({ grossMmPerWeek: 10, precipRateMmPerH: 10, allowedDays: ['funday' as never], maxRunMinPerCycle: 10 })).toThrow(expect.objectContaining({ code: 'engine/invalid_weekday' }));
  });
});
