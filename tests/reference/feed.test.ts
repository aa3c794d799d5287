/** Fertiliser reference checks; each value names its source. */
import { describe, expect, test } from 'vitest';
import * as e from '@swardwise/domain/engine';

describe('product rate = N wanted ÷ (N % / 100)', () => {
  test('should need 3.57 lb of 28-3-6 per 1000 ft² for 1 lb N (UNL Extension, Lawn fertilizer calculations)', () => {
    expect(e.productRate(1, 28)).toBeCloseTo(3.57, 2);
  });

  test('should need 21.42 lb of 28-3-6 for 6,000 ft² (UNL Extension; 3.57 × 6 as published)', () => {
    expect(e.productRate(1, 28) * 6).toBeCloseTo(21.42, 1);
    // The same through the metric product function, back in lb.
    const need = e.productForArea(e.lbPer1000Ft2ToGPerM2(1), { n: 28, p: 3, k: 6 }, e.ft2ToM2(6000), 22.7, 1);
    expect(e.kgToLb(need.productKg)).toBeCloseTo(21.43, 2);
  });

  test('should need 2.17 lb of 46-0-0 and 4.76 lb of 21-0-0 (derived)', () => {
    expect(e.productRate(1, 46)).toBeCloseTo(2.17, 2);
    expect(e.productRate(1, 21)).toBeCloseTo(4.76, 2);
  });
});

describe('annual N ranges (lb N/1000 ft²/yr)', () => {
  test('should carry Kentucky bluegrass and perennial ryegrass 3–4, fine fescues about 2 (Penn State Extension)', () => {
    expect(e.ANNUAL_N_RANGES_LB.kentucky_bluegrass).toMatchObject({ low: 3, high: 4 });
    expect(e.ANNUAL_N_RANGES_LB.perennial_ryegrass).toMatchObject({ low: 3, high: 4 });
    expect(e.ANNUAL_N_RANGES_LB.fine_fescue).toMatchObject({ low: 2, high: 2 });
  });

  test('should carry tall fescue 2–4 (University of Illinois 1995)', () => {
    expect(e.ANNUAL_N_RANGES_LB.tall_fescue).toMatchObject({ low: 2, high: 4 });
  });

  test('should carry bermudagrass athletic fields 5–7 on native soil (LSU AgCenter 2003)', () => {
    expect(e.ANNUAL_N_RANGES_LB.bermudagrass).toMatchObject({ low: 5, high: 7 });
  });

  test('should keep the Showcase level inside the published range', () => {
    for (const grass of ['kentucky_bluegrass', 'perennial_ryegrass', 'tall_fescue', 'bermudagrass'] as const) {
      const r = e.ANNUAL_N_RANGES_LB[grass];
      for (const irrigated of [true, false]) {
        const n = e.annualNitrogen({ grass, level: 1, clippings: 'removed', irrigated });
        expect(n.lbPer1000Ft2).toBeGreaterThanOrEqual(r.low);
        expect(n.lbPer1000Ft2).toBeLessThanOrEqual(r.high);
      }
    }
  });
});

describe('per-application limit and clippings', () => {
  test('should cap soluble N at 1 lb N/1000 ft² ≈ 4.88 g/m² per application (LSU AgCenter 2003)', () => {
    expect(e.DEFAULT_PARAMETERS.solubleNLimitGPerM2).toBeCloseTo(4.88, 2);
    expect(e.gPerM2ToLbPer1000Ft2(e.maxNPerApplication(0))).toBeCloseTo(1, 9);
  });

  test('should reduce N by 25 % when clippings are returned on young turf (Qian et al. 2003, J. Environ. Qual. 32:1694)', () => {
    const removed = e.annualNitrogen({ grass: 'kentucky_bluegrass', level: 2, clippings: 'removed', irrigated: true });
    const returned = e.annualNitrogen({ grass: 'kentucky_bluegrass', level: 2, clippings: 'returned', irrigated: true, turfAgeYears: 5 });
    expect(returned.gPerM2 / removed.gPerM2).toBeCloseTo(0.75, 12);
  });

  test('should reduce N by about 60 % on turf over 50 years old (Qian et al. 2003; REFERENCES, added after the first audit)', () => {
    expect(e.clippingsNReduction(60)).toBe(0.6);
    expect(e.clippingsNReduction(10)).toBe(0.25);
    // Between: 33 % at 11–25 years and 50 % at 26–50 years (from memory), never falling with age.
    const steps = [5, 15, 30, 55].map((y) => e.clippingsNReduction(y));
    expect(steps).toEqual([...steps].sort((a, b) => a - b));
  });

  test('should assume young turf (25 %) when the age is not recorded (stated default)', () => {
    expect(e.clippingsNReduction(null)).toBe(0.25);
    expect(e.DEFAULT_TURF_AGE_YEARS).toBeLessThanOrEqual(10);
  });

  test('should not cite a range it does not use: an Open space lawn is fed below the published range, and says so (Univ. of Illinois 1995 range)', () => {
    const n = e.annualNitrogen({ grass: 'tall_fescue', level: 4, clippings: 'returned', irrigated: false });
    expect(n.lbPer1000Ft2).toBeLessThan(e.ANNUAL_N_RANGES_LB.tall_fescue.low);
    expect(n.withinPublishedRange).toBe(false);
    expect(n.reasons[0]).toMatch(/below the published/);
  });
});

describe('applications of a season (common practice: granular rates of about 0.5–1 lb N/1000 ft² per pass)', () => {
  test('should keep every application, the last included, at or above the department minimum and within the soluble-N limit (LSU AgCenter 2003)', () => {
    const lb = e.lbPer1000Ft2ToGPerM2(1);
    for (const monthly of [
      [0, 0, 0, 0, 0, 0, 0, 0, 0.98 * lb, 0, 0.2 * lb, 0],
      [0, 0, 0.3 * lb, 0.6 * lb, 0.9 * lb, 0.4 * lb, 0.1 * lb, 0.3 * lb, 0.8 * lb, 0.5 * lb, 0.2 * lb, 0],
    ]) {
      const apps = e.planNApplications(monthly, { year: 2026 });
      expect(apps.reduce((s, a) => s + a.nGPerM2, 0)).toBeCloseTo(monthly.reduce((s, v) => s + v, 0), 9);
      for (const a of apps) {
        expect(e.gPerM2ToLbPer1000Ft2(a.nGPerM2)).toBeGreaterThanOrEqual(0.5 - 1e-9);
        expect(e.gPerM2ToLbPer1000Ft2(a.nGPerM2)).toBeLessThanOrEqual(1 + 1e-9);
      }
    }
  });
});
