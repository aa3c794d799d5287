/**
 * Facts of the trade (common practice, no single source) and the surface-hardness note
 * (ASTM F1702 vs F1936; no published acceptance range for the 2.25 kg tester).
 */
import { describe, expect, test } from 'vitest';
import { LEVELS } from '@swardwise/domain';
import * as e from '@swardwise/domain/engine';

describe('one-third rule (common practice)', () => {
  test('should mow a 2 in HOC before 3 in', () => {
    expect(e.mmToIn(e.mowTriggerHeightMm(e.inToMm(2)))).toBeCloseTo(3, 12);
  });

  test('should flag a cut removing more than a third', () => {
    expect(e.checkCut(e.inToMm(3), e.inToMm(2)).scalpingRisk).toBe(false);
    expect(e.checkCut(e.inToMm(3.2), e.inToMm(2)).scalpingRisk).toBe(true);
  });
});

describe('mowing frequency: one-third rule (common practice) and the Standards minimum per week (department setting)', () => {
  // Twelve weeks of steady growth (mean 20 °C, rain each day) from a Monday.
  const days = Array.from({ length: 84 }, (_, i) => ({ date: e.addDaysIso('2026-04-06', i), tmaxC: 24, tminC: 16, rainMm: 4 }));
  const weather = e.prepareWeather(days, { latDeg: 38, elevationM: 20 });

  test.each(LEVELS)('should plan at least the level %d minimum per week in the season outlook', (level) => {
    const o = e.fieldOutlook({ id: 1, areaM2: 7000, sport: 'soccer', grass: 'kentucky_bluegrass', maintenanceLevel: level, clippings: 'returned', irrigation: 'automatic' }, weather);
    expect(o.mowingsPerWeek).toBeGreaterThanOrEqual(e.DEFAULT_STANDARDS[level].minMowingsPerWeek);
  });
});

describe('heights of cut (common practice)', () => {
  test('should cut elite soccer at 1 in', () => {
    expect(e.mmToIn(e.hocFor({ sport: 'soccer', grass: 'perennial_ryegrass', maintenanceLevel: 1 }))).toBeCloseTo(1, 12);
  });

  test('should keep level 1 baseball outfields a little above soccer (common practice)', () => {
    for (const grass of ['kentucky_bluegrass', 'bermudagrass'] as const) {
      expect(e.hocFor({ sport: 'baseball', grass, maintenanceLevel: 1 })).toBeGreaterThan(e.hocFor({ sport: 'soccer', grass, maintenanceLevel: 1 }));
    }
  });

  test('should store every default height as a whole number of eighths of an inch (US departments set mowers in inches)', () => {
    for (const level of LEVELS) {
      const std = e.DEFAULT_STANDARDS[level];
      const heights = [...Object.values(std.hocMm).flatMap((h) => [h.cool, h.warm]), ...Object.values(std.hocByGrassMm)];
      for (const mm of heights) expect(Math.abs(e.mmToIn(mm) * 8 - Math.round(e.mmToIn(mm) * 8))).toBeLessThan(1e-9);
    }
  });

  test('should keep cool-season sports fields within 1–3 in and bermudagrass within 0.5–1.5 in', () => {
    for (const level of LEVELS) {
      for (const sport of ['soccer', 'football', 'lacrosse', 'baseball', 'softball'] as const) {
        const cool = e.mmToIn(e.hocFor({ sport, grass: 'kentucky_bluegrass', maintenanceLevel: level }));
        expect(cool).toBeGreaterThanOrEqual(1 - 1e-9);
        expect(cool).toBeLessThanOrEqual(3 + 1e-9);
        const bermuda = e.mmToIn(e.hocFor({ sport, grass: 'bermudagrass', maintenanceLevel: level }));
        expect(bermuda).toBeGreaterThanOrEqual(0.5 - 1e-9);
        expect(bermuda).toBeLessThanOrEqual(1.5 + 1e-9);
      }
    }
  });

  test('should keep low-maintenance lawns at most about 3.5 in (up to about 75–90 mm)', () => {
    expect(e.hocFor({ sport: 'lawn', grass: 'tall_fescue', maintenanceLevel: 4 })).toBeLessThanOrEqual(90);
  });
});

describe('mower type (common practice)', () => {
  // 1 in used to go to a rotary (the limit was exclusive and in mm); common practice cuts 1 in
  // and below with a reel, so the limit is inclusive and compared in inches (1 in = 25.4 mm).
  test('should use reel mowers at 1 in and below and rotary above', () => {
    expect(e.mowerTypeFor(e.inToMm(0.75))).toBe('reel');
    expect(e.mowerTypeFor(e.inToMm(1))).toBe('reel');
    expect(e.mowerTypeFor(25.4)).toBe('reel');
    expect(e.mowerTypeFor(e.inToMm(1.125))).toBe('rotary');
    expect(e.mowerTypeFor(e.inToMm(2.5))).toBe('rotary');
  });

  test('should cut elite soccer (1 in) with a reel and a 2 in park field with a rotary', () => {
    expect(e.mowerTypeFor(e.hocFor({ sport: 'soccer', grass: 'perennial_ryegrass', maintenanceLevel: 1 }))).toBe('reel');
    expect(e.mowerTypeFor(e.hocFor({ sport: 'soccer', grass: 'tall_fescue', maintenanceLevel: 3 }))).toBe('rotary');
  });
});

describe('stripes (common practice)', () => {
  test('should run side-to-side stripes across the field so officials can read lines', () => {
    const plan = e.stripePassPlan(105, 68, e.DEFAULT_PARAMETERS.mowers.rotary, 'side_to_side');
    expect(plan.passLengthsM).toEqual([68]);
    expect(e.stripePassPlan(105, 68, e.DEFAULT_PARAMETERS.mowers.rotary, 'criss_cross').passLengthsM).toEqual([105, 68]);
  });
});

describe('surface hardness: a range per tester (ASTM F1936 / F355 missile A; 2.25 kg tester, ASTM F1702, department setting)', () => {
  const check = { turfCoverPct: 90, weedsPct: 0, bareWornPct: 0, heightMm: 30, hocMm: 25, evenness: 4 };

  test('should hold F1936 / F355 missile A readings to an upper limit of 200 Gmax with 165 or lower as the target (REFERENCES, from memory)', () => {
    expect(e.DEFAULT_PARAMETERS.hardnessRangesG.f355_missile_a).toMatchObject({ max: 200, target: 165 });
    expect(e.surfaceScore({ ...check, hardnessG: 201, hardnessDevice: 'f355_missile_a' }).flags).toContain('close_field_caution');
    expect(e.surfaceScore({ ...check, hardnessG: 170, hardnessDevice: 'f355_missile_a' }).flags).toEqual(['hardness_above_target']);
  });

  // The engine judged every reading against the 2.25 kg tester's range, so a 150 G reading by
  // the F1936 method suggested closing a field that is within its limit.
  test('should no longer suggest closing the field for a 150 G reading by the F1936 method', () => {
    const r = e.surfaceScore({ ...check, hardnessG: 150, hardnessDevice: 'f355_missile_a' });
    expect(r.flags).not.toContain('close_field_caution');
    expect(r.cautions).toEqual([]);
  });

  test('should take the 2.25 kg tester\'s range from the department parameters, not from a published range (none found)', () => {
    const reading = { ...check, hardnessG: 110, hardnessDevice: 'portable_2_25kg' as const };
    const ranges = e.DEFAULT_PARAMETERS.hardnessRangesG;
    expect(e.surfaceScore(reading, ranges).flags).toContain('close_field_caution');
    expect(e.surfaceScore(reading, { ...ranges, portable_2_25kg: { min: 20, target: null, max: 120 } }).flags).not.toContain('close_field_caution');
    expect(e.CAUTIONS.hardness).toMatch(/department setting/);
    expect(e.CAUTIONS.hardness).toMatch(/not comparable/);
  });
});

describe('field check shares (arithmetic: cover, weeds and bare/worn divide one surface)', () => {
  test('should refuse shares that add up to more than 100 % instead of scoring them', () => {
    const check = { turfCoverPct: 90, weedsPct: 8, bareWornPct: 5, heightMm: 30, hocMm: 25, evenness: 4 };
    expect(() => e.surfaceScore(check)).toThrow(expect.objectContaining({ code: 'engine/invalid_check' }));
    expect(e.surfaceScore({ ...check, bareWornPct: 2 }).score).toBeGreaterThan(0);
  });
});

describe('cautions', () => {
  test('should defer to the label, local codes and licensed practice', () => {
    expect(e.CAUTIONS.feed).toMatch(/label/);
    expect(e.CAUTIONS.feed).toMatch(/licensed/);
    expect(e.CAUTIONS.pesticide).toMatch(/licensed applicator/);
    expect(e.CAUTIONS.water).toMatch(/local law/);
    expect(e.CAUTIONS.mowing).toMatch(/slopes/);
    expect(e.CAUTIONS.lightning).toMatch(/thunder/);
    expect(e.CAUTIONS.lines).toMatch(/white base coat/);
  });
});
