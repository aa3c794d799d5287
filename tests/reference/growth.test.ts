/**
 * Growth potential: Gelernter & Stowell (2005), Golf Course Management, "Improved overseeding
 * programs 1: the role of weather". To 20 °C (68 °F) cool-season and 31 °C (88 °F)
 * warm-season are published; σ 5.5 °C cool and 7 °C warm are from memory. The GP values
 * below are derived from that formula (consistency checks, not external references).
 */
import { describe, expect, test } from 'vitest';
import * as e from '@swardwise/domain/engine';

describe('growth potential (Gelernter & Stowell 2005)', () => {
  test('should peak at To = 20 °C (68 °F) cool and 31 °C (88 °F) warm (published)', () => {
    expect(e.GP_CURVES.cool.optimumC).toBe(20);
    expect(e.GP_CURVES.warm.optimumC).toBe(31);
    expect(e.cToF(e.GP_CURVES.cool.optimumC)).toBe(68);
    expect(e.cToF(e.GP_CURVES.warm.optimumC)).toBeCloseTo(87.8, 9); // published as 88 °F
    expect(e.growthPotential(20, 'cool')).toBe(1);
    expect(e.growthPotential(31, 'warm')).toBe(1);
  });

  test('should use σ = 5.5 °C cool and 7 °C warm (from memory)', () => {
    expect(e.GP_CURVES.cool.sigmaC).toBe(5.5);
    expect(e.GP_CURVES.warm.sigmaC).toBe(7);
  });

  test.each([
    [10, 0.191],
    [15, 0.662],
    [20, 1.0],
  ])('should give cool-season GP(%d °C) = %f (derived)', (t, gp) => {
    expect(e.growthPotential(t, 'cool')).toBeCloseTo(gp, 3);
  });

  test.each([
    [20, 0.291],
    [25, 0.693],
    [35, 0.849],
  ])('should give warm-season GP(%d °C) = %f (derived)', (t, gp) => {
    expect(e.growthPotential(t, 'warm')).toBeCloseTo(gp, 3);
  });

  test('should put the monthly N share near GP × about 1 lb N/1000 ft² at full potential (secondary sources, loose)', () => {
    // A cool-season year whose months sit at 20 °C in six months and 14.5 °C in six (GP 1 and e^−½):
    // an annual N of 6 + 6 × 0.607 lb splits to about 1 lb in a GP = 1 month.
    const temps = [14.5, 14.5, 14.5, 20, 20, 20, 20, 20, 20, 14.5, 14.5, 14.5];
    const annualLb = 6 + 6 * Math.exp(-0.5);
    const split = e.monthlyNSplit(e.lbPer1000Ft2ToGPerM2(annualLb), temps, 'cool');
    expect(e.gPerM2ToLbPer1000Ft2(split[4]!)).toBeCloseTo(1, 9);
    expect(split[4]!).toBeCloseTo(4.88, 1); // "about 5 g/m²"
  });
});
