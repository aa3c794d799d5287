import { describe, expect, test } from 'vitest';
import { compliance, recommendLevel, surfaceScore } from './grading.ts';
import { CAUTIONS } from './cautions.ts';

// A range per tester: the 2.25 kg tester's is a department setting, F1936's upper limit 200.
const safe = { portable_2_25kg: { min: 20, target: null, max: 100 }, f355_missile_a: { min: null, target: 165, max: 200 } };
const good = { turfCoverPct: 95, weedsPct: 2, bareWornPct: 2, heightMm: 30, hocMm: 25, hardnessG: 70, hardnessDevice: 'portable_2_25kg' as const, evenness: 5 };

describe('grading', () => {
  test('should recommend Showcase for an elite, busy, visible, sand-based irrigated field', () => {
    const r = recommendLevel({ play: 'elite', weeklyUseHours: 25, visibility: 'high', rootzone: 'sand_based', irrigation: 'automatic' });
    expect(r.level).toBe(1);
    expect(r.points).toBe(10);
    expect(r.reasons).toHaveLength(5);
  });

  test('should recommend Open space for informal, little-used lawns', () => {
    expect(recommendLevel({ play: 'informal', weeklyUseHours: 2, visibility: 'low', rootzone: 'native_soil', irrigation: 'none' }).level).toBe(4);
  });

  test('should hold a field without irrigation at level 3', () => {
    const r = recommendLevel({ play: 'elite', weeklyUseHours: 30, visibility: 'high', rootzone: 'sand_based', irrigation: 'none' });
    expect(r.level).toBe(3);
    expect(r.reasons.at(-1)).toMatch(/not irrigated/);
  });

  test('should score a good field high with a per-component breakdown', () => {
    const s = surfaceScore(good, safe);
    expect(s.components.map((c) => c.key)).toEqual(['cover', 'weeds', 'bare', 'height', 'hardness', 'evenness']);
    expect(s.components.reduce((t, c) => t + c.weight, 0)).toBeCloseTo(100, 9);
    // 95×0.30 + 96×0.15 + 94×0.15 + 100×0.15 + 100×0.15 + 100×0.10 = 97.
    expect(s.score).toBeCloseTo(97, 9);
    expect(s.flags).toEqual([]);
  });

  test('should flag hardness above the safe range with the close-field caution', () => {
    const s = surfaceScore({ ...good, hardnessG: 130 }, safe);
    expect(s.flags).toContain('close_field_caution');
    expect(s.cautions).toContain(CAUTIONS.hardness);
    expect(s.components.find((c) => c.key === 'hardness')?.score).toBe(40);
    expect(surfaceScore({ ...good, hardnessG: 10 }, safe).flags).toContain('soft_surface');
  });

  test('should judge a reading by the range of the tester that took it', () => {
    // 150 Gmax: within F1936's limit (200) and its 165 target, far over the 2.25 kg tester's range.
    const f1936 = surfaceScore({ ...good, hardnessG: 150, hardnessDevice: 'f355_missile_a' }, safe);
    expect(f1936.flags).toEqual([]);
    expect(f1936.cautions).toEqual([]);
    expect(f1936.components.find((c) => c.key === 'hardness')?.score).toBe(100);
    expect(surfaceScore({ ...good, hardnessG: 150 }, safe).flags).toContain('close_field_caution');
    const aboveTarget = surfaceScore({ ...good, hardnessG: 180, hardnessDevice: 'f355_missile_a' }, safe);
    expect(aboveTarget.flags).toEqual(['hardness_above_target']);
    expect(aboveTarget.components.find((c) => c.key === 'hardness')?.score).toBe(70);
    expect(surfaceScore({ ...good, hardnessG: 210, hardnessDevice: 'f355_missile_a' }, safe).flags).toContain('close_field_caution');
    const { hardnessDevice: _d, ...noDevice } = good;
    expect(() => surfaceScore(noDevice, safe)).toThrow(expect.objectContaining({ code: 'engine/hardness_device_required' }));
    expect(() => surfaceScore({ ...good, hardnessDevice: 'pogo' as never }, safe)).toThrow(expect.objectContaining({ code: 'engine/unknown_hardness_device' }));
  });

  test('should spread the hardness weight when not measured and flag long grass', () => {
    const { hardnessG: _h, hardnessDevice: _d, ...noHardness } = good;
    const s = surfaceScore({ ...noHardness, heightMm: 45 }, safe);
    expect(s.components.some((c) => c.key === 'hardness')).toBe(false);
    expect(s.components.reduce((t, c) => t + c.weight, 0)).toBeCloseTo(100, 9);
    expect(s.flags).toContain('overdue_mowing');
    expect(surfaceScore({ ...good, turfCoverPct: 40 }, safe).flags).toContain('low_cover');
  });

  test('should judge compliance from work done and score', () => {
    expect(compliance({ level: 1, plannedTasks: 10, doneTasks: 10, latestScore: 90 }).status).toBe('compliant');
    expect(compliance({ level: 1, plannedTasks: 10, doneTasks: 8, latestScore: 90 }).status).toBe('at_risk');
    expect(compliance({ level: 1, plannedTasks: 10, doneTasks: 10, latestScore: 70 }).status).toBe('non_compliant');
    expect(compliance({ level: 3, plannedTasks: 10, doneTasks: 6, latestScore: 80 }).status).toBe('non_compliant');
    expect(compliance({ level: 2, plannedTasks: 0, doneTasks: 0, latestScore: null })).toMatchObject({ workShare: 1, scoreMet: null, status: 'at_risk' });
  });

  test('should reject out-of-range checks', () => {
    expect(() => surfaceScore({ ...good, turfCoverPct: 120 }, safe)).toThrow(expect.objectContaining({ code: 'engine/invalid_check' }));
    // Cover + weeds + bare is the whole surface: 95 + 4 + 3 = 102 % is refused, not scored.
    expect(() => surfaceScore({ ...good, weedsPct: 4, bareWornPct: 3 }, safe)).toThrow(expect.objectContaining({ code: 'engine/invalid_check', message: expect.stringMatching(/100 %/) }));
    expect(() => surfaceScore({ ...good, weedsPct: 3, bareWornPct: 2 }, safe)).not.toThrow();
    expect(() => surfaceScore({ ...good, hocMm: 0 }, safe)).toThrow(expect.objectContaining({ code: 'engine/invalid_hoc' }));
    expect(() => surfaceScore({ ...good, evenness: 6 }, safe)).toThrow(expect.objectContaining({ code: 'engine/invalid_check' }));
    expect(() => surfaceScore(good, { ...safe, portable_2_25kg: { min: 100, target: null, max: 20 } })).toThrow(expect.objectContaining({ code: 'engine/invalid_hardness_range' }));
    expect(() => recommendLevel({ play: 'pro' as never, weeklyUseHours: 1, visibility: 'low', rootzone: 'native_soil', irrigation: 'none' })).toThrow(expect.objectContaining({ code: 'engine/invalid_rubric' }));
    expect(() => recommendLevel({ play: 'league', weeklyUseHours: 200, visibility: 'low', rootzone: 'native_soil', irrigation: 'none' })).toThrow(expect.objectContaining({ code: 'engine/invalid_rubric' }));
  });
});
