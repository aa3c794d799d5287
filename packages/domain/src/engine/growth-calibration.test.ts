import { describe, expect, test } from 'vitest';
import { growthCalibrationFactor, type GrowthReading } from './growth-calibration.ts';

const reading = (checkedOn: string, measuredHeightMm: number, daysSinceCut: number, predictedGrowthMm: number, hocMm = 30): GrowthReading => ({ checkedOn, measuredHeightMm, hocMm, daysSinceCut, predictedGrowthMm });

describe('growthCalibrationFactor', () => {
  test('should give the ratio of sums, the spread of the ratios and a medium confidence for three readings (worked by hand)', () => {
    // Hand-worked, HOC 30 mm:
    //   Jun 4: 38 mm after 4 days, 10 mm predicted → observed  8 mm, ratio 0.80
    //   Jun 9: 45 mm after 6 days, 12 mm predicted → observed 15 mm, ratio 1.25
    //   Jun 15: 40 mm after 5 days, 10 mm predicted → observed 10 mm, ratio 1.00
    // factor = (8 + 15 + 10) ÷ (10 + 12 + 10) = 33 ÷ 32 = 1.03125
    // mean ratio = 3.05 ÷ 3 = 1.01667; squared deviations 0.046944 + 0.054444 + 0.000278 = 0.101667
    // spread = √(0.101667 ÷ 2) = 0.225462 → n = 3 (< 6) and spread ≤ 0.5: medium.
    const fit = growthCalibrationFactor([reading('2026-06-04', 38, 4, 10), reading('2026-06-09', 45, 6, 12), reading('2026-06-15', 40, 5, 10)]);
    expect(fit.factor).toBeCloseTo(1.03125, 12);
    expect(fit.n).toBe(3);
    expect(fit.spread).toBeCloseTo(0.225462, 5);
    expect(fit.confidence).toBe('medium');
    expect(fit.readings.map((r) => r.ratio)).toEqual([0.8, 1.25, 1]);
    expect(fit.skipped).toEqual([]);
  });

  test('should leave out readings too long after the cut or with too little predicted growth, and say why', () => {
    const fit = growthCalibrationFactor([reading('2026-06-04', 38, 4, 10), reading('2026-07-01', 80, 30, 40), reading('2026-10-30', 31, 2, 1.5), reading('2026-05-01', 50, 0, 0)]);
    expect(fit.n).toBe(1);
    expect(fit.factor).toBeCloseTo(0.8, 12);
    expect(fit.spread).toBeNull();
    expect(fit.confidence).toBe('low');
    expect(fit.skipped.map((s) => s.checkedOn)).toEqual(['2026-07-01', '2026-10-30', '2026-05-01']);
    expect(fit.skipped[0]!.reason).toMatch(/30 days after the cut/);
    expect(fit.skipped[1]!.reason).toMatch(/too little growth/);
  });

  test('should count a height below HOC as no growth, not negative growth', () => {
    const fit = growthCalibrationFactor([reading('2026-06-04', 28, 4, 10), reading('2026-06-09', 42, 6, 10)]);
    // (0 + 12) ÷ (10 + 10) = 0.6
    expect(fit.factor).toBeCloseTo(0.6, 12);
    expect(fit.readings[0]!.observedMm).toBe(0);
  });

  test('should be high with six consistent readings, low with a wide spread and none without readings', () => {
    const steady = [4, 5, 6, 7, 8, 9].map((d, i) => reading(`2026-06-${String(10 + i).padStart(2, '0')}`, 30 + 1.2 * 2 * d, d, 2 * d));
    const high = growthCalibrationFactor(steady);
    expect(high.factor).toBeCloseTo(1.2, 12);
    expect(high.spread).toBeCloseTo(0, 12);
    expect(high.confidence).toBe('high');
    const wide = growthCalibrationFactor([reading('a', 32, 5, 10), reading('b', 50, 5, 10), reading('c', 45, 5, 10)]);
    // ratios 0.2, 2.0, 1.5: spread ≈ 0.92 > 0.5
    expect(wide.confidence).toBe('low');
    expect(growthCalibrationFactor([])).toMatchObject({ factor: 1, n: 0, spread: null, confidence: 'none' });
  });

  test('should refuse a reading without a height or with a negative prediction', () => {
    expect(() => growthCalibrationFactor([reading('x', 0, 4, 10)])).toThrow(expect.objectContaining({ code: 'engine/invalid_height' }));
    expect(() => growthCalibrationFactor([reading('x', 40, 4, -1)])).toThrow(expect.objectContaining({ code: 'engine/invalid_growth' }));
  });
});
