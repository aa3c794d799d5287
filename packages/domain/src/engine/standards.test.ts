import { describe, expect, test } from 'vitest';
import { GRASSES, LEVELS, SPORTS } from '../vocabulary.ts';
import { DEFAULT_PARAMETERS, DEFAULT_STANDARDS, grassSeason, hocFor, levelStandard } from './standards.ts';

describe('standards', () => {
  test('should cut lower and more often at higher levels', () => {
    for (const sport of SPORTS) {
      for (const season of ['cool', 'warm'] as const) {
        for (const l of [1, 2, 3] as const) {
          expect(DEFAULT_STANDARDS[l].hocMm[sport][season]).toBeLessThanOrEqual(DEFAULT_STANDARDS[(l + 1) as 2 | 3 | 4].hocMm[sport][season]);
        }
      }
    }
    for (const l of [1, 2, 3] as const) {
      const next = DEFAULT_STANDARDS[(l + 1) as 2 | 3 | 4];
      expect(DEFAULT_STANDARDS[l].minMowingsPerWeek).toBeGreaterThan(next.minMowingsPerWeek);
      expect(DEFAULT_STANDARDS[l].targetScore).toBeGreaterThan(next.targetScore);
      expect(DEFAULT_STANDARDS[l].annualNShare).toBeGreaterThan(next.annualNShare);
    }
    expect(DEFAULT_STANDARDS[4].irrigationShareOfEtc).toBeNull();
  });

  test('should keep heights within common practice ranges', () => {
    // Common practice: sports fields 1–3 in cool season; bermudagrass ½–1½ in (12.7–38.1 mm); low maintenance up to ~3½ in.
    for (const l of LEVELS) {
      for (const sport of SPORTS) {
        const warm = DEFAULT_STANDARDS[l].hocMm[sport].warm;
        const cool = DEFAULT_STANDARDS[l].hocMm[sport].cool;
        expect(cool).toBeGreaterThanOrEqual(20);
        expect(cool).toBeLessThanOrEqual(90);
        if (sport !== 'lawn') expect(warm).toBeGreaterThanOrEqual(12);
        if (sport !== 'lawn') expect(warm).toBeLessThanOrEqual(38.1);
      }
    }
    // The defaults are inch values in exact mm (were metric round numbers: 25 mm read 0.98 in).
    expect(DEFAULT_STANDARDS[1].hocMm.soccer.cool).toBe(25.4);
  });

  test('should pick the HOC for a field with the override winning', () => {
    expect(hocFor({ sport: 'soccer', grass: 'perennial_ryegrass', maintenanceLevel: 1 })).toBe(25.4); // 1 in
    expect(hocFor({ sport: 'soccer', grass: 'bermudagrass', maintenanceLevel: 1 })).toBe(15.875); // ⅝ in
    expect(hocFor({ sport: 'soccer', grass: 'st_augustinegrass', maintenanceLevel: 3 })).toBe(76.2); // 3 in
    expect(hocFor({ sport: 'soccer', grass: 'bermudagrass', maintenanceLevel: 1, hocOverrideMm: 22 })).toBe(22);
    expect(hocFor({ sport: 'lawn', grass: 'tall_fescue', maintenanceLevel: 4, hocOverrideMm: null })).toBe(88.9); // 3½ in
  });

  test('should throw on unknown grass, level or a zero override', () => {
    expect(() => hocFor({ sport: 'soccer', grass: 'moss' as never, maintenanceLevel: 1 })).toThrow(expect.objectContaining({ code: 'engine/unknown_grass' }));
    expect(() => levelStandard(5 as never)).toThrow(expect.objectContaining({ code: 'engine/unknown_level' }));
    expect(() => hocFor({ sport: 'soccer', grass: 'tall_fescue', maintenanceLevel: 2, hocOverrideMm: 0 })).toThrow(expect.objectContaining({ code: 'engine/invalid_hoc' }));
    expect(() => hocFor({ sport: 'polo' as never, grass: 'tall_fescue', maintenanceLevel: 2 })).toThrow(expect.objectContaining({ code: 'engine/unknown_sport' }));
  });

  test('should carry a growth rate for every grass and the LSU soluble-N limit', () => {
    for (const g of GRASSES) {
      expect(DEFAULT_PARAMETERS.maxGrowthMmPerDay[g]).toBeGreaterThan(0);
      expect(['cool', 'warm']).toContain(grassSeason(g));
    }
    expect(DEFAULT_PARAMETERS.solubleNLimitGPerM2).toBeCloseTo(4.88, 2);
    for (const r of Object.values(DEFAULT_PARAMETERS.hardnessRangesG)) expect(r.min ?? 0).toBeLessThan(r.target ?? r.max);
  });
});
