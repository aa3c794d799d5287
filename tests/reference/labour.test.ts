/**
 * Machine field capacity, ASABE EP496 / D497: effective field capacity (ac/h) =
 * speed (mph) × width (ft) × efficiency ÷ 8.25; metric (ha/h) = km/h × m × efficiency ÷ 10.
 */
import { describe, expect, test } from 'vitest';
import * as e from '@swardwise/domain/engine';

describe('effective field capacity (ASABE EP496)', () => {
  test('should give 20.4 ac/h for 40 ft at 6 mph and 70 % (Iowa State Extension, Ag Decision Maker A3-24, Table 1)', () => {
    expect(e.effectiveFieldCapacityAcPerH(6, 40, 0.7)).toBeCloseTo(20.4, 1);
  });

  test('should give 2.91 ac/h for a 6 ft rotary at 5 mph and 80 % (derived)', () => {
    expect(e.effectiveFieldCapacityAcPerH(5, 6, 0.8)).toBeCloseTo(2.91, 2);
  });

  test('should agree between the metric and imperial forms (derived: 8.25 and 10 are the unit constants)', () => {
    const acPerH = e.effectiveFieldCapacityAcPerH(6, 40, 0.7);
    const haPerH = e.effectiveFieldCapacityHaPerH(e.mphToKmh(6), e.ftToM(40), 0.7);
    // 8.25 is a rounded constant (exact 8.2498…), so allow 0.01 %.
    expect(e.haToAcres(haPerH) / acPerH).toBeCloseTo(1, 3);
  });

  test('should default mower efficiency to the typical 80 % within 75–90 % (ASAE D497, from memory)', () => {
    for (const m of Object.values(e.DEFAULT_PARAMETERS.mowers)) {
      expect(m.efficiency).toBeGreaterThanOrEqual(0.75);
      expect(m.efficiency).toBeLessThanOrEqual(0.9);
    }
    expect(e.DEFAULT_PARAMETERS.mowers.rotary.efficiency).toBe(0.8);
  });
});

describe('stripe passes (arithmetic; overlap between passes is common practice)', () => {
  test('should count the passes whose n × width − (n − 1) × overlap first covers the field', () => {
    const mower = { ...e.DEFAULT_PARAMETERS.mowers.rotary, widthM: 2.1, overlapM: 0.1 };
    // 5 passes cover 5 × 2.1 − 4 × 0.1 = 10.1 m exactly: 5, not 6.
    expect(e.stripePassPlan(50, 10.1, mower, 'lengthwise').passes).toEqual([5]);
    for (const across of [5, 10.1, 33.3, 68, 105]) {
      const [n] = e.stripePassPlan(200, across, mower, 'lengthwise').passes as [number];
      expect(n * mower.widthM - (n - 1) * mower.overlapM).toBeGreaterThanOrEqual(across - 1e-9);
      expect((n - 1) * mower.widthM - (n - 2) * mower.overlapM).toBeLessThan(across);
    }
  });
});
