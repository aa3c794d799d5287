import { describe, expect, test } from 'vitest';
import { CAUTIONS } from './cautions.ts';
import { COVER_TARGET_PCT, judgeFieldCheck, type FieldCheckRecord } from './field-check.ts';
import { DEFAULT_PARAMETERS } from './standards.ts';

const ranges = DEFAULT_PARAMETERS.hardnessRangesG;
const good: FieldCheckRecord = {
  turfCoverPct: 95,
  weedsPct: 2,
  bareWornPct: 2,
  bareAreas: [],
  heightMm: 30,
  hardnessReadingsG: [60, 70, 80],
  hardnessDevice: 'portable_2_25kg',
  evenness: 5,
  divots: 5,
  tornLeafTips: false,
};
const judge = (check: Partial<FieldCheckRecord>, level: 1 | 2 | 3 | 4 = 2) => judgeFieldCheck({ ...good, ...check }, { hocMm: 25, level, ranges });

describe('judgeFieldCheck', () => {
  test('should score a good check as surfaceScore does with the mean reading, without flags', () => {
    const r = judge({});
    expect(r.hardnessG).toBe(70);
    // Department rubric (grading.ts): 95×0.30 + 96×0.15 + 94×0.15 + 100×0.15 + 100×0.15 + 100×0.10 = 97.
    expect(r.score).toBeCloseTo(97, 9);
    expect(r.flags).toEqual([]);
  });

  test('should flag grass above 1.5 × HOC (one-third rule, common practice)', () => {
    expect(judge({ heightMm: 37.5 }).flags).not.toContain('overdue_mowing');
    expect(judge({ heightMm: 38 }).flags).toContain('overdue_mowing');
  });

  test('should judge each hardness reading against the tester’s range: one spot over the limit gives the close-field caution', () => {
    // 2.25 kg tester: the demo department's range 20–100 G (department setting, not published).
    const r = judge({ hardnessReadingsG: [60, 70, 110] });
    expect(r.hardnessG).toBe(80);
    expect(r.hardnessMaxG).toBe(110);
    expect(r.flags).toContain('close_field_caution');
    expect(r.cautions).toContain(CAUTIONS.hardness);
    // F355 missile A: above the 200 Gmax limit (ASTM F1936, from memory).
    expect(judge({ hardnessReadingsG: [150, 210], hardnessDevice: 'f355_missile_a' }).flags).toContain('close_field_caution');
    expect(judge({ hardnessReadingsG: [150, 190], hardnessDevice: 'f355_missile_a' }).flags).toEqual(['hardness_above_target']);
  });

  test('should give the wet-field caution for a reading below the tester’s minimum', () => {
    const r = judge({ hardnessReadingsG: [15, 60, 70] });
    expect(r.flags).toContain('soft_surface');
    expect(r.cautions).toContain(CAUTIONS.wetField);
  });

  test('should flag cover below the level’s target (department defaults)', () => {
    expect(COVER_TARGET_PCT[1]).toBe(95);
    expect(judge({ turfCoverPct: 85, weedsPct: 5, bareWornPct: 10 }, 1).flags).toContain('cover_below_target');
    expect(judge({ turfCoverPct: 85, weedsPct: 5, bareWornPct: 10 }, 3).flags).not.toContain('cover_below_target');
  });

  test('should send torn or browned leaf tips to the blades before disease (common practice)', () => {
    const r = judge({ tornLeafTips: true });
    expect(r.flags).toEqual(['check_blade_sharpness']);
    expect(r.advice[0]).toMatch(/sharpness before suspecting disease/);
  });

  test('should flag many divots and refuse readings without their tester', () => {
    expect(judge({ divots: 2 }).flags).toContain('divots_to_repair');
    expect(() => judge({ hardnessDevice: null })).toThrow(/tester/);
    expect(() => judge({ divots: 0 })).toThrow(/divots/);
    // Without readings the hardness weight is spread over the rest.
    expect(judge({ hardnessReadingsG: [], hardnessDevice: null }).hardnessG).toBeNull();
  });
});
