/**
 * Shows the engine's SI values in the user's units with the engine's own formatters, and
 * turns a needs block's inputs (value + unit token) into text.
 */
import {
  formatArea,
  formatDepth,
  formatHocText,
  formatLength,
  formatMass,
  formatNRate,
  formatSpeed,
  formatTemperature,
  formatVolume,
  L_PER_US_GALLON,
  m2ToFt2,
  type DisplayValue,
  type NeedInput,
  type UnitSystem,
} from '@swardwise/domain';

const shown = (d: DisplayValue): string => `${d.value.toLocaleString('en-US')} ${d.unit}`;
const num = (v: number, digits: number) => v.toLocaleString('en-US', { maximumFractionDigits: digits });

export const hocText = (mm: number, u: UnitSystem) => formatHocText(mm, u);
export const depthText = (mm: number, u: UnitSystem) => shown(formatDepth(mm, u));
const areaText = (m2: number, u: UnitSystem) => shown(formatArea(m2, u));
export const lengthText = (m: number, u: UnitSystem) => shown(formatLength(m, u));
export const volumeText = (l: number, u: UnitSystem) => shown(formatVolume(l, u));
export const massText = (kg: number, u: UnitSystem) => shown(formatMass(kg, u));
export const nRateText = (g: number, u: UnitSystem) => shown(formatNRate(g, u));
export const hoursText = (h: number) => `${num(h, h < 10 ? 2 : 1)} h`;
export const percentText = (share: number) => `${num(share * 100, 0)} %`;

/** Water depth per day for the chart axis: mm/day or in/day. */
export function depthPerDay(mm: number, u: UnitSystem): number {
  return formatDepth(mm, u).value;
}
export const depthUnit = (u: UnitSystem) => `${formatDepth(1, u).unit}/day`;
export const nRateUnit = (u: UnitSystem) => formatNRate(1, u).unit;

/** An input's value as text in the user's units. */
export function inputText(i: NeedInput, u: UnitSystem): string {
  const v = i.value;
  if (v === null) return '—';
  if (typeof v === 'boolean') return v ? 'Yes' : 'No';
  if (typeof v === 'string') return v.replace(/_/g, ' ');
  switch (i.unit) {
    case 'mm':
      return hocText(v, u);
    case 'm':
      return lengthText(v, u);
    case 'm2':
      return areaText(v, u);
    case '%':
      return percentText(v);
    case 'km/h':
      return shown(formatSpeed(v, u));
    case '°C':
      return shown(formatTemperature(v, u));
    case 'mm/day':
      return `${depthText(v, u)}/day`;
    case 'mm/h':
      return `${depthText(v, u)}/h`;
    case 'm2/L':
      return u === 'imperial' ? `${num(m2ToFt2(v) * L_PER_US_GALLON, 0)} ft²/gal` : `${num(v, 2)} m²/L`;
    case 'd':
      return `${num(v, 0)} days`;
    case 'h':
      return `${num(v, 1)} h`;
    case 's':
      return `${num(v, 0)} s`;
    default:
      return num(v, 2);
  }
}
