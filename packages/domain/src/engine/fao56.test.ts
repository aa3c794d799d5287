import { describe, expect, test } from 'vitest';
import * as f from './fao56.ts';

describe('fao56', () => {
  test('should give standard-atmosphere pressure and γ at sea level', () => {
    expect(f.atmosphericPressure(0)).toBeCloseTo(101.3, 9);
    expect(f.psychrometricConstant(101.3)).toBeCloseTo(0.0674, 4);
    expect(f.atmosphericPressure(1800)).toBeLessThan(f.atmosphericPressure(0));
  });

  test('should give e° 0.6108 kPa at 0 °C and Δ consistent with a numerical derivative', () => {
    expect(f.saturationVapourPressure(0)).toBeCloseTo(0.6108, 12);
    const h = 1e-4;
    const numeric = (f.saturationVapourPressure(20 + h) - f.saturationVapourPressure(20 - h)) / (2 * h);
    expect(f.vapourPressureSlope(20)).toBeCloseTo(numeric, 3);
  });

  test('should order the ea variants sensibly', () => {
    const full = f.actualVapourPressureFromRhMaxMin(12, 24, 90, 40);
    expect(full).toBeGreaterThan(0);
    expect(f.actualVapourPressureFromRhMean(24, 12, 100)).toBeCloseTo(f.meanSaturationVapourPressure(24, 12), 12);
    expect(f.actualVapourPressureFromRhMax(12, 100)).toBeCloseTo(f.saturationVapourPressure(12), 12);
    expect(f.actualVapourPressureFromDewpoint(10)).toBeCloseTo(f.saturationVapourPressure(10), 12);
  });

  test('should give u2 = uz at 2 m within 0.1 %', () => {
    expect(f.windSpeedAt2m(3, 2)).toBeCloseTo(3, 2);
    expect(f.windSpeedAt2m(3, 10)).toBeLessThan(3);
  });

  test('should handle polar day and night without NaN', () => {
    const lat = f.degToRad(80);
    expect(f.sunsetHourAngle(lat, f.solarDeclination(172))).toBeCloseTo(Math.PI, 12);
    expect(f.sunsetHourAngle(lat, f.solarDeclination(355))).toBe(0);
    expect(f.extraterrestrialRadiation(lat, 355)).toBeCloseTo(0, 9);
    const r = f.et0PenmanMonteith({ tmaxC: -10, tminC: -20, latDeg: 80, elevationM: 0, doy: 355 });
    expect(Number.isFinite(r.et0Mm)).toBe(true);
  });

  test('should give Rs = 0 in polar night with zero sunshine hours, not throw', () => {
    expect(f.solarRadiationFromSunshine(0, 0, 0)).toBe(0);
    expect(() => f.solarRadiationFromSunshine(1, 0, 0)).toThrow(expect.objectContaining({ code: 'engine/invalid_sunshine' }));
    const r = f.et0PenmanMonteith({ tmaxC: -10, tminC: -20, latDeg: 80, elevationM: 0, doy: 355, sunshineH: 0, rhMaxPct: 90, rhMinPct: 70, windMs: 3 });
    expect(r.rs).toBe(0);
    expect(r.rsMethod).toBe('sunshine');
    expect(Number.isFinite(r.et0Mm)).toBe(true);
  });

  test('should fall back to Tdew = Tmin, u2 = 2 and Rs from temperature', () => {
    const r = f.et0PenmanMonteith({ tmaxC: 30, tminC: 15, latDeg: 35, elevationM: 100, doy: 180 });
    expect(r.eaMethod).toBe('tmin_as_dewpoint');
    expect(r.windAssumed).toBe(true);
    expect(r.u2).toBe(2);
    expect(r.rsMethod).toBe('temperature');
    expect(r.rs).toBeCloseTo(0.16 * Math.sqrt(15) * r.ra, 12);
    const coastal = f.et0PenmanMonteith({ tmaxC: 30, tminC: 15, latDeg: 35, elevationM: 100, doy: 180, coastal: true });
    expect(coastal.rs).toBeCloseTo(0.19 * Math.sqrt(15) * coastal.ra, 12);
  });

  test('should cap Rs/Rso at 1 in Rnl', () => {
    expect(f.netLongwaveRadiation(25, 15, 1.5, 40, 30)).toBeCloseTo(f.netLongwaveRadiation(25, 15, 1.5, 30, 30), 12);
  });

  test('should give monthly G from eq. 43 or eq. 44', () => {
    expect(f.soilHeatFluxMonthly(20, 18)).toBeCloseTo(0.28, 12);
    expect(f.soilHeatFluxMonthly(20, 18, 22)).toBeCloseTo(0.28, 12);
    expect(f.soilHeatFluxDaily()).toBe(0);
  });

  test('should never return negative Hargreaves ET0', () => {
    expect(f.hargreavesEt0(-20, -25, 5)).toBe(0);
  });

  test('should reject out-of-range weather', () => {
    const base = { tmaxC: 25, tminC: 15, latDeg: 40, elevationM: 100, doy: 180 };
    expect(() => f.et0PenmanMonteith({ ...base, tminC: 26 })).toThrow(expect.objectContaining({ code: 'engine/invalid_temperature' }));
    expect(() => f.et0PenmanMonteith({ ...base, tmaxC: 65 })).toThrow(expect.objectContaining({ code: 'engine/invalid_temperature' }));
    expect(() => f.et0PenmanMonteith({ ...base, rhMaxPct: 101, rhMinPct: 50 })).toThrow(expect.objectContaining({ code: 'engine/invalid_humidity' }));
    expect(() => f.et0PenmanMonteith({ ...base, rhMaxPct: 50, rhMinPct: 60 })).toThrow(expect.objectContaining({ code: 'engine/invalid_humidity' }));
    expect(() => f.et0PenmanMonteith({ ...base, rhMeanPct: -1 })).toThrow(expect.objectContaining({ code: 'engine/invalid_humidity' }));
    expect(() => f.et0PenmanMonteith({ ...base, doy: 0 })).toThrow(expect.objectContaining({ code: 'engine/invalid_day_of_year' }));
    expect(() => f.et0PenmanMonteith({ ...base, latDeg: 95 })).toThrow(expect.objectContaining({ code: 'engine/invalid_latitude' }));
    expect(() => f.et0PenmanMonteith({ ...base, sunshineH: 20 })).toThrow(expect.objectContaining({ code: 'engine/invalid_sunshine' }));
    expect(() => f.et0PenmanMonteith({ ...base, windMs: -2 })).toThrow(expect.objectContaining({ code: 'engine/invalid_wind' }));
  });
});
