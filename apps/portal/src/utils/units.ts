import { DEFAULT_TIME_ZONE, formatDepth, formatHocText, type UnitSystem } from '@swardwise/domain';

/** Exact definitions: international acre and foot, inch of 25.4 mm. */
const M2_PER_ACRE = 4046.8564224;
const M2_PER_FT2 = 0.09290304;
const M2_PER_HA = 10_000;
const MM_PER_IN = 25.4;
const KM_PER_MI = 1.609344;

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

/**
 * The zone instants are shown in: the department's, set by the session store when a session
 * answer names it (before any page shows a time), never the browser's own.
 */
let displayTimeZone: string = DEFAULT_TIME_ZONE;

export function setDisplayTimeZone(zone: string): void {
  displayTimeZone = zone;
}

/** An instant as the department's local date and time ("Dec 3, 2026, 1:15 AM"). */
export function formatDateTime(iso: string | null): string {
  if (!iso) return '—';
  const d = new Date(iso);
  return Number.isNaN(d.getTime())
    ? iso
    : d.toLocaleString('en-US', { year: 'numeric', month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit', timeZone: displayTimeZone });
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

/**
 * Crew time as a crew reads it, hours and minutes: 1.5 → "1:30", 0.25 → "0:15", 7.9 → "7:54"
 * (to the nearest minute; a negative span keeps its sign).
 */
export function hoursMinutes(h: number): string {
  const minutes = Math.round(Math.abs(h) * 60);
  const sign = h < 0 && minutes > 0 ? '−' : '';
  return `${sign}${Math.floor(minutes / 60)}:${String(minutes % 60).padStart(2, '0')}`;
}

/** Crew time with its unit: "1:30 h". */
export const crewHoursText = (h: number) => `${hoursMinutes(h)} h`;

/** A drive distance (km inside) in miles or kilometres, one decimal. */
export function distanceText(km: number, units: UnitSystem): string {
  return units === 'imperial' ? `${num(km / KM_PER_MI, 1)} mi` : `${num(km, 1)} km`;
}

/**
 * A week plan's reason in the person's units. The planner writes its reasons in millimetres
 * ("the grass would pass 38 mm (1.5 × HOC 25 mm)", "Water budget: 12.5 mm gross"), and they are
 * stored that way; under imperial each "<n> mm" reads as a height of cut to the eighth inch,
 * or as a water depth in inches in a water-budget reason.
 */
export function reasonText(reason: string, units: UnitSystem): string {
  if (units !== 'imperial') return reason;
  const water = /^Water budget/i.test(reason);
  return reason.replace(/(\d+(?:\.\d+)?) mm\b/g, (_all, n: string) => {
    const mm = Number(n);
    if (!water) return formatHocText(mm, units);
    const d = formatDepth(mm, units);
    return `${d.value.toLocaleString('en-US')} ${d.unit}`;
  });
}
