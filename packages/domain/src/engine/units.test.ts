import { describe, expect, test } from 'vitest';
import * as u from './units.ts';

describe('units', () => {
  test('should convert lengths, areas and masses both ways', () => {
    expect(u.mmToIn(25.4)).toBe(1);
    expect(u.inToMm(u.mmToIn(38))).toBeCloseTo(38, 12);
    expect(u.mToFt(0.3048)).toBeCloseTo(1, 12);
    expect(u.ftToM(3)).toBeCloseTo(0.9144, 12);
    expect(u.m2ToFt2(u.ft2ToM2(1000))).toBeCloseTo(1000, 9);
    expect(u.m2ToAcres(4046.8564224)).toBeCloseTo(1, 12);
    expect(u.acresToM2(2)).toBeCloseTo(8093.7128448, 6);
    expect(u.haToAcres(1)).toBeCloseTo(2.4710538, 6);
    expect(u.acresToHa(u.haToAcres(3.7))).toBeCloseTo(3.7, 12);
    expect(u.kgToLb(0.45359237)).toBeCloseTo(1, 12);
    expect(u.lbToKg(10)).toBeCloseTo(4.5359237, 12);
  });

  test('should convert N rates, volumes, temperatures and speeds', () => {
    expect(u.lbPer1000Ft2ToGPerM2(1)).toBeCloseTo(4.8824, 4);
    expect(u.gPerM2ToLbPer1000Ft2(u.lbPer1000Ft2ToGPerM2(0.75))).toBeCloseTo(0.75, 12);
    expect(u.litresToUsGallons(3.785411784)).toBeCloseTo(1, 12);
    expect(u.usGallonsToLitres(2)).toBeCloseTo(7.570823568, 9);
    expect(u.depthMmOverAreaToLitres(10, 50)).toBe(500);
    expect(u.cToF(100)).toBe(212);
    expect(u.fToC(-40)).toBe(-40);
    expect(u.kmhToMph(1.609344)).toBeCloseTo(1, 12);
    expect(u.mphToKmh(5)).toBeCloseTo(8.04672, 9);
    expect(u.msToKmh(u.kmhToMs(36))).toBeCloseTo(36, 12);
  });

  test('should format values per unit system', () => {
    expect(u.formatHoc(25.4, 'imperial')).toEqual({ value: 1, unit: 'in' });
    expect(u.formatHoc(25.4, 'metric')).toEqual({ value: 25, unit: 'mm' });
    // Inches go to the eighth a mower is set to: 25 mm (0.98 in) reads 1 in, 35 mm 1⅜ in.
    expect(u.formatHoc(25, 'imperial')).toEqual({ value: 1, unit: 'in' });
    expect(u.formatHoc(34.925, 'imperial')).toEqual({ value: 1.375, unit: 'in' });
    expect(u.formatHocText(34.925, 'imperial')).toBe('1⅜ in');
    expect(u.formatHocText(15.875, 'imperial')).toBe('⅝ in');
    expect(u.formatHocText(50.8, 'imperial')).toBe('2 in');
    expect(u.formatHocText(49.9, 'imperial')).toBe('2 in');
    expect(u.formatHocText(76.2, 'metric')).toBe('76 mm');
    expect(u.inchesToEighthsText(0.06)).toBe('0');
    expect(u.formatArea(7140, 'metric')).toEqual({ value: 7140, unit: 'm²' });
    expect(u.formatArea(20_000, 'metric')).toEqual({ value: 2, unit: 'ha' });
    expect(u.formatArea(4046.8564224 * 1.5, 'imperial')).toEqual({ value: 1.5, unit: 'ac' });
    expect(u.formatArea(92.90304, 'imperial')).toEqual({ value: 1000, unit: 'ft²' });
    expect(u.formatNRate(4.8824, 'imperial').unit).toBe('lb N/1000 ft²');
    expect(u.formatNRate(4.8824, 'imperial').value).toBe(1);
    expect(u.formatVolume(3.785411784 * 10, 'imperial')).toEqual({ value: 10, unit: 'gal' });
    expect(u.formatVolume(25_000, 'metric')).toEqual({ value: 25, unit: 'm³' });
    expect(u.formatTemperature(20, 'imperial')).toEqual({ value: 68, unit: '°F' });
    expect(u.formatMass(1, 'imperial')).toEqual({ value: 2.2, unit: 'lb' });
    expect(u.formatLength(1609.344 * 2, 'imperial')).toEqual({ value: 2, unit: 'mi' });
    expect(u.formatLength(30.48, 'imperial')).toEqual({ value: 100, unit: 'ft' });
    expect(u.formatSpeed(8.04672, 'imperial')).toEqual({ value: 5, unit: 'mph' });
    expect(u.formatDepth(25.4, 'imperial')).toEqual({ value: 1, unit: 'in' });
  });

  test('should reject a non-finite value to format', () => {
    expect(() => u.formatArea(Number.NaN, 'metric')).toThrow(expect.objectContaining({ code: 'engine/invalid_value' }));
  });
});
