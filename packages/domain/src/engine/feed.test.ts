import { describe, expect, test } from 'vitest';
import * as feed from './feed.ts';
import { DEFAULT_PARAMETERS } from './standards.ts';
import { lbPer1000Ft2ToGPerM2 } from './units.ts';

describe('feed', () => {
  test('should take the upper end when irrigated and cut 25 % for returned clippings', () => {
    const showcase = feed.annualNitrogen({ grass: 'kentucky_bluegrass', level: 1, clippings: 'removed', irrigated: true });
    expect(showcase.lbPer1000Ft2).toBe(4);
    expect(showcase.gPerM2).toBeCloseTo(lbPer1000Ft2ToGPerM2(4), 12);
    const returned = feed.annualNitrogen({ grass: 'kentucky_bluegrass', level: 1, clippings: 'returned', irrigated: true });
    expect(returned.lbPer1000Ft2).toBeCloseTo(3, 12);
    const dry = feed.annualNitrogen({ grass: 'bermudagrass', level: 1, clippings: 'removed', irrigated: false });
    expect(dry.lbPer1000Ft2).toBe(5);
    expect(dry.reasons.length).toBeGreaterThan(1);
    const open = feed.annualNitrogen({ grass: 'bermudagrass', level: 4, clippings: 'removed', irrigated: false });
    expect(open.lbPer1000Ft2).toBeCloseTo(1.5, 12);
  });

  test('should cut N more for returned clippings as the turf ages (Qian et al. 2003) and default to young turf', () => {
    const at = (turfAgeYears: number | null) => feed.annualNitrogen({ grass: 'kentucky_bluegrass', level: 1, clippings: 'returned', irrigated: true, turfAgeYears }).lbPer1000Ft2;
    expect(at(null)).toBeCloseTo(3, 12);
    expect(at(3)).toBeCloseTo(3, 12);
    expect(at(20)).toBeCloseTo(4 * 0.67, 12);
    expect(at(40)).toBeCloseTo(2, 12);
    expect(at(60)).toBeCloseTo(1.6, 12);
    expect(feed.annualNitrogen({ grass: 'kentucky_bluegrass', level: 1, clippings: 'removed', irrigated: true, turfAgeYears: 60 }).lbPer1000Ft2).toBe(4);
    expect(() => at(-1)).toThrow(expect.objectContaining({ code: 'engine/invalid_turf_age' }));
  });

  test('should say when a level feeds below the published range instead of citing a range it does not use', () => {
    const lawn = feed.annualNitrogen({ grass: 'tall_fescue', level: 4, clippings: 'removed', irrigated: false });
    expect(lawn.lbPer1000Ft2).toBeCloseTo(0.6, 12);
    expect(lawn.withinPublishedRange).toBe(false);
    expect(lawn.reasons[0]).toMatch(/below the published 2–4 lb/);
    expect(lawn.reasons[0]).toMatch(/department choice/);
    expect(lawn.reasons.join(' ')).not.toMatch(/lower end of/);
    expect(feed.annualNitrogen({ grass: 'tall_fescue', level: 1, clippings: 'removed', irrigated: false }).withinPublishedRange).toBe(true);
  });

  test('should split N in proportion to GP and skip dormant months', () => {
    const temps = [0, 2, 8, 13, 18, 22, 25, 24, 19, 13, 7, 2];
    const split = feed.monthlyNSplit(20, temps, 'cool');
    expect(split.reduce((s, v) => s + v, 0)).toBeCloseTo(20, 9);
    expect(split[0]).toBe(0);
    // May (18 °C) is nearer the 20 °C optimum than July (25 °C).
    expect(split[4]!).toBeGreaterThan(split[6]!);
    expect(feed.monthlyNSplit(10, new Array(12).fill(-5), 'warm')).toEqual(new Array(12).fill(0));
  });

  test('should allow more per application with slow-release N, up to the ceiling', () => {
    expect(feed.maxNPerApplication(0)).toBeCloseTo(4.88, 2);
    expect(feed.maxNPerApplication(0.5)).toBeCloseTo(2 * DEFAULT_PARAMETERS.solubleNLimitGPerM2, 9);
    expect(feed.maxNPerApplication(0.9)).toBeCloseTo(DEFAULT_PARAMETERS.slowReleaseNCeilingGPerM2, 9);
    expect(feed.maxNPerApplication(0.25)).toBeCloseTo(DEFAULT_PARAMETERS.solubleNLimitGPerM2 / 0.75, 9);
  });

  test('should split a heavy month into equal applications within the limit', () => {
    const monthly = [0, 0, 0, 0, 10, 3, 0, 0, 0, 0, 0, 0];
    const apps = feed.planNApplications(monthly, { year: 2025 });
    const may = apps.filter((a) => a.month === 5);
    expect(may).toHaveLength(3);
    expect(may.map((a) => a.date)).toEqual(['2025-05-05', '2025-05-16', '2025-05-26']);
    for (const a of apps) expect(a.nGPerM2).toBeLessThanOrEqual(DEFAULT_PARAMETERS.solubleNLimitGPerM2 + 1e-9);
    expect(apps.reduce((s, a) => s + a.nGPerM2, 0)).toBeCloseTo(13, 9);
    expect(feed.planNApplications(monthly)[0]?.date).toBeNull();
  });

  test('should give product mass, bags, cost and the P and K that come along', () => {
    const p = feed.productForArea(5, { n: 25, p: 0, k: 10 }, 1000, 20, 2);
    expect(p.productGPerM2).toBe(20);
    expect(p.productKg).toBe(20);
    expect(p.bags).toBe(1);
    expect(p.cost).toBe(40);
    expect(p.k2oGPerM2).toBe(2);
    expect(feed.productForArea(5, { n: 25, p: 0, k: 10 }, 1001, 20, 2).bags).toBe(2);
  });

  test('should recommend P and K only below the department sufficiency levels', () => {
    const low = feed.phosphorusPotassium({ pPpm: 10, kPpm: 200 });
    expect(low.p2o5GPerM2).toBe(DEFAULT_PARAMETERS.soilTest.p2o5RateGPerM2);
    expect(low.k2oGPerM2).toBe(0);
    expect(feed.phosphorusPotassium(null)).toMatchObject({ p2o5GPerM2: 0, k2oGPerM2: 0, basis: 'no_soil_test' });
  });

  test('should split N by monthly mean GP and feed no month without weather or below the dormancy GP', () => {
    const gp = [null, null, 0.05, 0.4, 0.8, 1, 0.6, 0.6, 0.8, 0.4, 0.2, null];
    const split = feed.monthlyNSplitByGp(19.2, gp);
    expect(split.reduce((s, v) => s + v, 0)).toBeCloseTo(19.2, 9);
    expect(split[0]).toBe(0);
    expect(split[2]).toBe(0);
    expect(split[11]).toBe(0);
    expect(split[5]! / split[3]!).toBeCloseTo(1 / 0.4, 9);
    expect(feed.monthlyNSplitByGp(10, new Array(12).fill(null))).toEqual(new Array(12).fill(0));
    expect(() => feed.monthlyNSplitByGp(10, [0.5])).toThrow(expect.objectContaining({ code: 'engine/invalid_monthly_series' }));
    expect(() => feed.monthlyNSplitByGp(10, [1.5, ...new Array(11).fill(0)])).toThrow(expect.objectContaining({ code: 'engine/invalid_gp' }));
  });

  test('should reject bad inputs', () => {
    expect(() => feed.annualNitrogen({ grass: 'clover' as never, level: 1, clippings: 'removed', irrigated: true })).toThrow(expect.objectContaining({ code: 'engine/unknown_grass' }));
    expect(() => feed.productRate(1, 0)).toThrow(expect.objectContaining({ code: 'engine/invalid_analysis' }));
    expect(() => feed.productForArea(1, { n: 60, p: 30, k: 30 }, 10, 20, 1)).toThrow(expect.objectContaining({ code: 'engine/invalid_analysis' }));
    expect(() => feed.productForArea(1, { n: 20, p: 0, k: 0 }, -10, 20, 1)).toThrow(expect.objectContaining({ code: 'engine/invalid_area' }));
    expect(() => feed.monthlyNSplit(10, [10, 12], 'cool')).toThrow(expect.objectContaining({ code: 'engine/invalid_monthly_series' }));
    expect(() => feed.maxNPerApplication(1.5)).toThrow(expect.objectContaining({ code: 'engine/invalid_share' }));
  });
});

describe('planNApplications — small monthly amounts', () => {
  test('should carry amounts below a practical spreader rate into the next application and keep the total', () => {
    // 0.1–0.2 lb N/1000 ft² a month (an Open space lawn): a crew would not spread that monthly.
    const lb = lbPer1000Ft2ToGPerM2(1);
    const monthly = [0, 0, 0.1 * lb, 0.2 * lb, 0.2 * lb, 0.1 * lb, 0.05 * lb, 0.1 * lb, 0.2 * lb, 0.1 * lb, 0, 0];
    const apps = feed.planNApplications(monthly, { year: 2026 });
    const total = monthly.reduce((a, b) => a + b, 0);
    expect(apps.reduce((s, a) => s + a.nGPerM2, 0)).toBeCloseTo(total, 9);
    expect(apps.length).toBeLessThanOrEqual(3);
    for (const a of apps) expect(a.nGPerM2).toBeGreaterThanOrEqual(DEFAULT_PARAMETERS.minNPerApplicationGPerM2 - 1e-9);
    for (const a of apps) expect(a.nGPerM2).toBeLessThanOrEqual(DEFAULT_PARAMETERS.solubleNLimitGPerM2 + 1e-9);
  });

  // The season's last small remainder used to go out on its own when it did not fit in the
  // last application: here 1 g/m² in November, below the 2.44 g/m² minimum.
  test('should never end the season with an application below the minimum', () => {
    const monthly = [0, 0, 0, 0, 0, 0, 0, 0, 4.8, 0, 1.0, 0];
    const apps = feed.planNApplications(monthly, { year: 2026 });
    expect(apps.reduce((s, a) => s + a.nGPerM2, 0)).toBeCloseTo(5.8, 9);
    expect(apps.map((a) => a.month)).toEqual([9, 11]);
    for (const a of apps) {
      expect(a.nGPerM2).toBeGreaterThanOrEqual(DEFAULT_PARAMETERS.minNPerApplicationGPerM2 - 1e-9);
      expect(a.nGPerM2).toBeLessThanOrEqual(DEFAULT_PARAMETERS.solubleNLimitGPerM2 + 1e-9);
    }
  });
});
