import { describe, expect, test } from 'vitest';
import { crewHoursText, distanceText, formatDateTime, formatHoc, formatLandArea, formatSurfaceArea, hocToMm, hocValue, hoursMinutes, reasonText, setDisplayTimeZone } from './units.ts';

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

  test('should show crew time as hours and minutes', () => {
    expect(hoursMinutes(1.5)).toBe('1:30');
    expect(hoursMinutes(0.25)).toBe('0:15');
    expect(hoursMinutes(7.9)).toBe('7:54');
    expect(hoursMinutes(8)).toBe('8:00');
    expect(hoursMinutes(1.999)).toBe('2:00');
    expect(hoursMinutes(-0.5)).toBe('−0:30');
    expect(crewHoursText(2.75)).toBe('2:45 h');
  });

  test('should show a drive in miles or kilometres', () => {
    expect(distanceText(16.09344, 'imperial')).toBe('10.0 mi');
    expect(distanceText(12.34, 'metric')).toBe('12.3 km');
  });

  test('should read a planner reason written in millimetres in inches under imperial', () => {
    const mow = 'One-third rule: the grass would pass 38 mm (1.5 × HOC 25 mm) before the next mowing day';
    expect(reasonText(mow, 'imperial')).toBe('One-third rule: the grass would pass 1½ in (1.5 × HOC 1 in) before the next mowing day');
    expect(reasonText(mow, 'metric')).toBe(mow);
    expect(reasonText('Water budget: 25.4 mm gross this week; set the controller to the run times', 'imperial')).toBe('Water budget: 1 in gross this week; set the controller to the run times');
  });
});

describe('formatDateTime', () => {
  test('should show an instant in the department’s zone, not the browser’s or UTC', () => {
    setDisplayTimeZone('America/Chicago');
    // 04:30 UTC on Dec 3 is 22:30 on Dec 2 in a US Central city (UTC−6 in winter).
    expect(formatDateTime('2026-12-03T04:30:00Z')).toBe('Dec 2, 2026, 10:30 PM');
    setDisplayTimeZone('Europe/Berlin');
    expect(formatDateTime('2026-12-03T04:30:00Z')).toBe('Dec 3, 2026, 5:30 AM');
    expect(formatDateTime(null)).toBe('—');
  });
});
