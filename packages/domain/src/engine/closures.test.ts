import { describe, expect, test } from 'vitest';
import { closureCaution, closureSuggestion, nextWorkingDay } from './closures.ts';
import { DEFAULT_PARAMETERS } from './standards.ts';

const ranges = DEFAULT_PARAMETERS.hardnessRangesG;
const check = (over: Partial<Parameters<typeof closureSuggestion>[0] & object> = {}) => ({ checkedOn: '2026-11-30', score: 80, gmax: null, gmaxDevice: null, ...over });

describe('closureSuggestion', () => {
  test('should suggest closing above the tester’s limit and nothing at or under it', () => {
    // ASTM F1936 / F355 missile A: limit 200 Gmax (from memory; the department's default range).
    expect(closureSuggestion(check({ gmax: 201, gmaxDevice: 'f355_missile_a' }), ranges, 75)).toMatchObject({ status: 'closed', reason: 'hardness' });
    expect(closureSuggestion(check({ gmax: 200, gmaxDevice: 'f355_missile_a' }), ranges, 75)).toBeNull();
  });

  test('should judge a reading by the range of the tester that took it', () => {
    // 150 is within the F355 limit but above the 2.25 kg tester's department limit of 100.
    expect(closureSuggestion(check({ gmax: 150, gmaxDevice: 'f355_missile_a' }), ranges, 75)).toBeNull();
    expect(closureSuggestion(check({ gmax: 150, gmaxDevice: 'portable_2_25kg' }), ranges, 75)?.reason).toBe('hardness');
    expect(closureSuggestion(check({ gmax: 15, gmaxDevice: 'portable_2_25kg' }), ranges, 75)).toMatchObject({ status: 'restricted', reason: 'wet' });
  });

  test('should suggest a restriction for a score more than 10 points under the target, and nothing without a check', () => {
    expect(closureSuggestion(check({ score: 64 }), ranges, 75)).toMatchObject({ status: 'restricted', reason: 'renovation' });
    expect(closureSuggestion(check({ score: 65 }), ranges, 75)).toBeNull();
    expect(closureSuggestion(null, ranges, 75)).toBeNull();
  });
});

describe('nextWorkingDay', () => {
  test('should give the first of the crew’s days on or after the date, Monday to Friday without any', () => {
    // 2026-12-05 is a Saturday.
    expect(nextWorkingDay('2026-12-05', [])).toBe('2026-12-07');
    expect(nextWorkingDay('2026-12-05', ['sat'])).toBe('2026-12-05');
    expect(nextWorkingDay('2026-12-03', ['tue'])).toBe('2026-12-08');
  });
});

describe('closureCaution', () => {
  test('should show the lightning, hardness and wet-field cautions and none for an event', () => {
    expect(closureCaution('lightning')).toMatch(/30 minutes after the last thunder/);
    expect(closureCaution('hardness')).toMatch(/head injury/);
    expect(closureCaution('wet')).toMatch(/drain/);
    expect(closureCaution('event')).toBeNull();
  });
});
