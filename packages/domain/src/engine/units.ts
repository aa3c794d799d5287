/**
 * Unit conversions for display. The engine computes in SI (mm, m, m², kg, g/m², L, °C,
 * km/h); US parks staff read inches, feet, acres, lb N per 1000 ft² and gallons.
 * Conversion factors are exact by definition (international yard and pound agreement, 1959;
 * US gallon = 231 in³) unless noted.
 */
import type { UnitSystem } from '../vocabulary.ts';
import { requireFinite } from './check.ts';

export const MM_PER_INCH = 25.4;
export const M_PER_FOOT = 0.3048;
export const M2_PER_FT2 = M_PER_FOOT * M_PER_FOOT; // 0.09290304
export const M2_PER_ACRE = 4046.8564224; // the international acre: 43,560 international ft², exact by definition
export const M2_PER_HECTARE = 10_000;
export const KG_PER_LB = 0.45359237;
export const L_PER_US_GALLON = 3.785411784; // 231 in³
export const KM_PER_MILE = 1.609344;
/** 1 lb N per 1000 ft² in g/m² (= 453.59237 g ÷ 92.90304 m² ≈ 4.882). */
export const G_PER_M2_PER_LB_PER_1000FT2 = (KG_PER_LB * 1000) / (1000 * M2_PER_FT2);

/**
 * The conversions both ways between a unit and one worth `perUnit` of it (the inch is 25.4 mm):
 * into the other unit divides by `perUnit`, back multiplies by it.
 */
const conversions = (perUnit: number) => [(si: number): number => si / perUnit, (other: number): number => other * perUnit] as const;

export const [mmToIn, inToMm] = conversions(MM_PER_INCH);
export const [mToFt, ftToM] = conversions(M_PER_FOOT);
export const [m2ToFt2, ft2ToM2] = conversions(M2_PER_FT2);
export const [m2ToAcres, acresToM2] = conversions(M2_PER_ACRE);
export const haToAcres = (ha: number): number => (ha * M2_PER_HECTARE) / M2_PER_ACRE;
export const acresToHa = (ac: number): number => (ac * M2_PER_ACRE) / M2_PER_HECTARE;
export const [kgToLb, lbToKg] = conversions(KG_PER_LB);
/** g N/m² ↔ lb N per 1000 ft². */
export const [gPerM2ToLbPer1000Ft2, lbPer1000Ft2ToGPerM2] = conversions(G_PER_M2_PER_LB_PER_1000FT2);
export const [litresToUsGallons, usGallonsToLitres] = conversions(L_PER_US_GALLON);
/** Water depth over an area → litres (1 mm over 1 m² is 1 L). */
export const depthMmOverAreaToLitres = (mm: number, areaM2: number): number => mm * areaM2;
/** Water depth over an area → US gallons. 1 in over 1000 ft² ≈ 623.4 gal. */
export const depthMmOverAreaToUsGallons = (mm: number, areaM2: number): number => litresToUsGallons(mm * areaM2);
export const cToF = (c: number): number => (c * 9) / 5 + 32;
export const fToC = (f: number): number => ((f - 32) * 5) / 9;
export const [kmhToMph, mphToKmh] = conversions(KM_PER_MILE);
export const [kmhToMs, msToKmh] = conversions(3.6);
export const kmToMiles = (km: number): number => km / KM_PER_MILE;

/** A value ready to show, with its unit symbol. */
export interface DisplayValue {
  value: number;
  unit: string;
}

const round = (v: number, digits: number): number => {
  const f = 10 ** digits;
  return Math.round(v * f) / f;
};

function shown(value: number, unit: string, digits: number): DisplayValue {
  requireFinite(value, 'invalid_value', 'value to format');
  return { value: round(value, digits), unit };
}

/**
 * Height of cut (mm inside) → inches to the nearest eighth (the step US crews set mowers in;
 * 0.125 = ⅛) or whole millimetres.
 */
export function formatHoc(mm: number, system: UnitSystem): DisplayValue {
  if (system !== 'imperial') return shown(mm, 'mm', 0);
  requireFinite(mm, 'invalid_value', 'value to format');
  return { value: Math.round(mmToIn(mm) * 8) / 8, unit: 'in' };
}

const EIGHTHS = ['', '⅛', '¼', '⅜', '½', '⅝', '¾', '⅞'] as const;

/** Inches to the nearest eighth as a crew writes them: "1", "⅝", "1⅜" (vulgar-fraction characters screen readers speak). */
export function inchesToEighthsText(inches: number): string {
  requireFinite(inches, 'invalid_value', 'inches to format');
  const eighths = Math.round(Math.abs(inches) * 8);
  const whole = Math.floor(eighths / 8);
  const frac = EIGHTHS[eighths % 8] as string;
  const sign = inches < 0 && eighths > 0 ? '−' : '';
  return `${sign}${whole === 0 && frac ? '' : String(whole)}${frac}`;
}

/** A height of cut as text: "1⅜ in" (to the eighth) or "35 mm" (whole millimetres). */
export function formatHocText(mm: number, system: UnitSystem): string {
  return system === 'imperial' ? `${inchesToEighthsText(mmToIn(mm))} in` : `${shown(mm, 'mm', 0).value.toLocaleString('en-US')} mm`;
}

/** A length (m inside) → ft or m; long distances (≥ 1 km / 1 mi) as km or mi. */
export function formatLength(m: number, system: UnitSystem): DisplayValue {
  if (system === 'imperial') {
    const mi = kmToMiles(m / 1000);
    return mi >= 1 ? shown(mi, 'mi', 2) : shown(mToFt(m), 'ft', 0);
  }
  return m >= 1000 ? shown(m / 1000, 'km', 2) : shown(m, 'm', 1);
}

/** An area (m² inside) → ft²/ac or m²/ha; ac and ha from one acre / one hectare up. */
export function formatArea(m2: number, system: UnitSystem): DisplayValue {
  if (system === 'imperial') return m2 >= M2_PER_ACRE ? shown(m2ToAcres(m2), 'ac', 2) : shown(m2ToFt2(m2), 'ft²', 0);
  return m2 >= M2_PER_HECTARE ? shown(m2 / M2_PER_HECTARE, 'ha', 2) : shown(m2, 'm²', 0);
}

/** A mass (kg inside) → lb or kg. */
export function formatMass(kg: number, system: UnitSystem): DisplayValue {
  return system === 'imperial' ? shown(kgToLb(kg), 'lb', 1) : shown(kg, 'kg', 1);
}

/** A nitrogen rate (g N/m² inside) → lb N/1000 ft² or g N/m². */
export function formatNRate(gPerM2: number, system: UnitSystem): DisplayValue {
  return system === 'imperial' ? shown(gPerM2ToLbPer1000Ft2(gPerM2), 'lb N/1000 ft²', 2) : shown(gPerM2, 'g N/m²', 1);
}

/** A volume (L inside) → US gal or L (m³ from 10,000 L up). */
export function formatVolume(litres: number, system: UnitSystem): DisplayValue {
  if (system === 'imperial') return shown(litresToUsGallons(litres), 'gal', 0);
  return litres >= 10_000 ? shown(litres / 1000, 'm³', 1) : shown(litres, 'L', 0);
}

/** A water depth (mm inside) → in or mm. */
export function formatDepth(mm: number, system: UnitSystem): DisplayValue {
  return system === 'imperial' ? shown(mmToIn(mm), 'in', 2) : shown(mm, 'mm', 1);
}

/** A temperature (°C inside) → °F or °C. */
export function formatTemperature(c: number, system: UnitSystem): DisplayValue {
  return system === 'imperial' ? shown(cToF(c), '°F', 0) : shown(c, '°C', 1);
}

/** A speed (km/h inside) → mph or km/h. */
export function formatSpeed(kmh: number, system: UnitSystem): DisplayValue {
  return system === 'imperial' ? shown(kmhToMph(kmh), 'mph', 1) : shown(kmh, 'km/h', 1);
}
