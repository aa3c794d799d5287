import { formatHocText, type UnitSystem } from '@swardwise/domain';

/** Exact definitions: international acre and foot, inch of 25.4 mm. */
const M2_PER_ACRE = 4046.8564224;
const M2_PER_FT2 = 0.09290304;
const M2_PER_HA = 10_000;
const MM_PER_IN = 25.4;

function num(value: number, digits: number): string {
  return value.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });
}

/** A large area (a district, a site, a field's share of the turf): acres or hectares. */
export function formatLandArea(m2: number, units: UnitSystem): string {
  return units === 'imperial' ? `${num(m2 / M2_PER_ACRE, 2)} ac` : `${num(m2 / M2_PER_HA, 2)} ha`;
}

/** A field's surface in the small unit crews work with: square feet or square metres. */
export function formatSurfaceArea(m2: number, units: UnitSystem): string {
  return units === 'imperial' ? `${num(m2 / M2_PER_FT2, 0)} ft²` : `${num(m2, 0)} m²`;
}

/** Height of cut: inches to the eighth-inch crews set mowers by ("1⅜ in"), or whole millimetres. */
export function formatHoc(mm: number, units: UnitSystem): string {
  return formatHocText(mm, units);
}

export function formatDateTime(iso: string | null): string {
  if (!iso) return '—';
  const d = new Date(iso);
  return Number.isNaN(d.getTime())
    ? iso
    : d.toLocaleString('en-US', { year: 'numeric', month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit' });
}

/** A large area as a plain number in acres or hectares (2 decimals), for exports. */
export function landAreaValue(m2: number, units: UnitSystem): number {
  return Math.round((units === 'imperial' ? m2 / M2_PER_ACRE : m2 / M2_PER_HA) * 100) / 100;
}

export const landAreaUnit = (units: UnitSystem) => (units === 'imperial' ? 'ac' : 'ha');
export const hocUnit = (units: UnitSystem) => (units === 'imperial' ? 'in' : 'mm');

/** A height of cut in the person's unit (inches to 0.001, so eighths stay exact, or whole millimetres). */
export function hocValue(mm: number, units: UnitSystem): number {
  return units === 'imperial' ? Math.round((mm / MM_PER_IN) * 1000) / 1000 : Math.round(mm);
}

/** A height of cut entered in the person's unit, back to millimetres as stored (1⅜ in → 34.925 mm exactly). */
export function hocToMm(value: number, units: UnitSystem): number {
  return units === 'imperial' ? Math.round(value * MM_PER_IN * 1000) / 1000 : value;
}
