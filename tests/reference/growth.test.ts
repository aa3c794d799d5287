/**
 * Growth potential: Gelernter & Stowell (2005), Golf Course Management, "Improved overseeding
 * programs 1: the role of weather". To 20 °C (68 °F) cool-season and 31 °C (88 °F)
 * warm-season are published; σ 5.5 °C cool and 7 °C warm are from memory; the warm-season
 * plateau from 31 °C up is the model authors' later revision. The GP values below are
 * derived from that formula (consistency checks, not external references).
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
  ])('should give warm-season GP(%d °C) = %f (derived)', (t, gp) => {
    expect(e.growthPotential(t, 'warm')).toBeCloseTo(gp, 3);
  });

  // GP(35 °C) warm was 0.849 (the bell curve's right side, derived); the model authors' later
  // revision holds the warm-season curve at 1 from its optimum up (REFERENCES, added after
  // the first audit), so warm-season grass no longer slows in midsummer heat.
  test.each([31, 33, 35, 40])('should hold warm-season GP at 1 at %d °C, from the optimum up (authors\' later revision)', (t) => {
    expect(e.growthPotential(t, 'warm')).toBe(1);
  });

  test('should cross the cool- and warm-season curves near 24.8 °C (REFERENCES; derived)', () => {
    const t = e.gpCrossoverC();
    expect(t).toBeCloseTo(24.8, 1);
    expect(e.growthPotential(t, 'cool')).toBeCloseTo(e.growthPotential(t, 'warm'), 12);
    expect(e.growthPotential(t - 1, 'cool')).toBeGreaterThan(e.growthPotential(t - 1, 'warm'));
    expect(e.growthPotential(t + 1, 'cool')).toBeLessThan(e.growthPotential(t + 1, 'warm'));
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
