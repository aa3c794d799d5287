/** Per-acre figures (as the API answers) per the user's unit of land: acre or hectare. */
import { M2_PER_ACRE, type UnitSystem } from '@swardwise/domain';

/** Acres in a hectare: 10,000 m² over the international acre (4,046.8564224 m², exact). */
const ACRES_PER_HA = 10_000 / M2_PER_ACRE;

export function perLand(perAcre: number | null, units: UnitSystem): number | null {
  if (perAcre === null) return null;
  return units === 'imperial' ? perAcre : perAcre * ACRES_PER_HA;
}

export const landUnit = (units: UnitSystem): 'ac' | 'ha' => (units === 'imperial' ? 'ac' : 'ha');

export function money(value: number | null, currency: string, digits = 0): string {
  if (value === null) return '—';
  return value.toLocaleString('en-US', { style: 'currency', currency, minimumFractionDigits: digits, maximumFractionDigits: digits });
}
