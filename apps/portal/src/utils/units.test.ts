import { describe, expect, test } from 'vitest';
import { formatHoc, formatLandArea, formatSurfaceArea } from './units.ts';

describe('units', () => {
  test('should show a land area in acres or hectares', () => {
    expect(formatLandArea(4046.8564224, 'imperial')).toBe('1.00 ac');
    expect(formatLandArea(25_000, 'metric')).toBe('2.50 ha');
  });

  test('should show a surface in square feet or square metres', () => {
    // A regulation soccer pitch of 105 m × 68 m.
    expect(formatSurfaceArea(7140, 'imperial')).toBe('76,854 ft²');
    expect(formatSurfaceArea(7140, 'metric')).toBe('7,140 m²');
  });

  test('should show a height of cut in inches or millimetres', () => {
    expect(formatHoc(25.4, 'imperial')).toBe('1.00 in');
    expect(formatHoc(19.05, 'imperial')).toBe('0.75 in');
    expect(formatHoc(19, 'metric')).toBe('19 mm');
  });
});
