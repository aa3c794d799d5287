import { describe, expect, test } from 'vitest';
import { formatHoc, formatLandArea, formatSurfaceArea, hocToMm, hocValue } from './units.ts';

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

  // Heights were shown to 0.01 in, so metric defaults read 0.98, 1.97, 2.95 in; crews set
  // mowers in inches and eighths, so heights show to the eighth.
  test('should show a height of cut in inches to the eighth or whole millimetres', () => {
    expect(formatHoc(25.4, 'imperial')).toBe('1 in');
    expect(formatHoc(25, 'imperial')).toBe('1 in');
    expect(formatHoc(19.05, 'imperial')).toBe('¾ in');
    expect(formatHoc(34.925, 'imperial')).toBe('1⅜ in');
    expect(formatHoc(19, 'metric')).toBe('19 mm');
    expect(formatHoc(25.4, 'metric')).toBe('25 mm');
  });

  test('should keep an entered eighth exact in millimetres and back', () => {
    expect(hocToMm(1.375, 'imperial')).toBe(34.925);
    expect(hocValue(34.925, 'imperial')).toBe(1.375);
    expect(hocValue(25.4, 'metric')).toBe(25);
  });
});
