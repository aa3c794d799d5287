import { describe, expect, test } from 'vitest';
import { calibrateMaxGrowthRate, dailyGrowthMm, dailyGrowthSeriesMm, growthOverDaysMm, growthPotential, nitrogenModifier, waterModifier } from './growth.ts';

describe('growth', () => {
  test('should peak at the optimum and fall off symmetrically', () => {
    expect(growthPotential(20, 'cool')).toBe(1);
    expect(growthPotential(31, 'warm')).toBe(1);
    expect(growthPotential(14.5, 'cool')).toBeCloseTo(growthPotential(25.5, 'cool'), 12);
    expect(growthPotential(14.5, 'cool')).toBeCloseTo(Math.exp(-0.5), 12);
    expect(growthPotential(5, 'warm')).toBeLessThan(0.01);
  });

  test('should hold warm-season GP at 1 from its optimum up and leave the cool-season curve symmetric', () => {
    expect(growthPotential(31, 'warm')).toBe(1);
    expect(growthPotential(35, 'warm')).toBe(1);
    expect(growthPotential(45, 'warm')).toBe(1);
    expect(growthPotential(30.9, 'warm')).toBeLessThan(1);
    expect(growthPotential(30, 'cool')).toBeCloseTo(growthPotential(10, 'cool'), 12);
  });

  test('should scale daily growth by GP and the modifiers', () => {
    expect(dailyGrowthMm(4, 20, 'cool')).toBe(4);
    expect(dailyGrowthMm(4, 20, 'cool', { nitrogen: 0.5, water: 0.5 })).toBe(1);
    expect(dailyGrowthMm(6, 31, 'warm', { water: 0 })).toBe(0);
    expect(growthOverDaysMm(2, [20, 20, 20], 'cool')).toBe(6);
    expect(dailyGrowthSeriesMm(2, [20, 14.5], 'cool')).toEqual([2, 2 * Math.exp(-0.5)]);
  });

  test('should bound the modifiers', () => {
    expect(waterModifier(10, 20)).toBe(0.5);
    expect(waterModifier(0, 20)).toBe(0.2);
    expect(waterModifier(40, 20)).toBe(1);
    expect(waterModifier(0, 0)).toBe(1);
    expect(nitrogenModifier(0, 5)).toBe(0.5);
    expect(nitrogenModifier(10, 5)).toBe(1);
  });

  test('should recover the rate from exact synthetic checks with high confidence', () => {
    const temps = [[18, 19, 20, 21], [15, 16, 17], [22, 23, 24, 25, 26], [12, 14, 16, 18, 20, 22], [19, 20], [10, 12, 14]];
    const obs = temps.map((t) => ({ measuredHeightMm: 40 + growthOverDaysMm(4.5, t, 'cool'), hocAfterCutMm: 40, daysSinceCut: t.length, dailyMeanC: t }));
    const fit = calibrateMaxGrowthRate(obs, 'cool');
    expect(fit.maxRateMmPerDay).toBeCloseTo(4.5, 9);
    expect(fit.rSquared).toBeCloseTo(1, 9);
    expect(fit.standardError).toBeCloseTo(0, 9);
    expect(fit.n).toBe(6);
    expect(fit.confidence).toBe('high');
  });

  test('should give the least-squares slope through the origin for noisy checks', () => {
    const obs = [
      { measuredHeightMm: 31, hocAfterCutMm: 25, daysSinceCut: 2, dailyMeanC: [20, 20] },
      { measuredHeightMm: 38, hocAfterCutMm: 25, daysSinceCut: 3, dailyMeanC: [20, 20, 20] },
    ];
    // x = 2, 3 (GP = 1); y = 6, 13 → slope = (12 + 39) / (4 + 9) = 51/13.
    const fit = calibrateMaxGrowthRate(obs, 'cool');
    expect(fit.maxRateMmPerDay).toBeCloseTo(51 / 13, 12);
    expect(fit.confidence).toBe('low');
    expect(fit.residualsMm[0]).toBeCloseTo(6 - (2 * 51) / 13, 12);
  });

  test('should reject bad observations and temperatures', () => {
    expect(() => calibrateMaxGrowthRate([], 'cool')).toThrow(expect.objectContaining({ code: 'engine/no_observations' }));
    expect(() => calibrateMaxGrowthRate([{ measuredHeightMm: 30, hocAfterCutMm: 25, daysSinceCut: 3, dailyMeanC: [20] }], 'cool')).toThrow(expect.objectContaining({ code: 'engine/invalid_observation' }));
    expect(() => calibrateMaxGrowthRate([{ measuredHeightMm: 30, hocAfterCutMm: 0, daysSinceCut: 1, dailyMeanC: [20] }], 'cool')).toThrow(expect.objectContaining({ code: 'engine/invalid_hoc' }));
    expect(() => growthPotential(61, 'cool')).toThrow(expect.objectContaining({ code: 'engine/invalid_temperature' }));
    expect(() => growthPotential(-61, 'warm')).toThrow(expect.objectContaining({ code: 'engine/invalid_temperature' }));
    expect(() => dailyGrowthMm(-1, 20, 'cool')).toThrow(expect.objectContaining({ code: 'engine/invalid_growth_rate' }));
    expect(() => dailyGrowthMm(4, 20, 'cool', { water: 1.5 })).toThrow(expect.objectContaining({ code: 'engine/invalid_modifier' }));
  });
});
