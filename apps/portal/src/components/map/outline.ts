/**
 * A drawn or edited outline as the domain sees it: a closed GeoJSON polygon, its geodesic
 * area and the bearing of its long axis.
 */
import { longAxis, polygonAreaM2, type Polygon, type UnitSystem } from '@swardwise/domain';
import { formatLandArea, formatSurfaceArea } from '../../utils/units.ts';

export const EAST_WEST_WARNING = 'Long axis runs east–west: low sun in players’ eyes at one end — north–south is common practice.';

export interface LatLngLike {
  lat: number;
  lng: number;
}

/** Corners (not closed) → a closed GeoJSON polygon ([lng, lat] positions); null below three corners. */
export function polygonFromLatLngs(corners: readonly LatLngLike[]): Polygon | null {
  if (corners.length < 3) return null;
  const ring = corners.map((c) => [c.lng, c.lat] as [number, number]);
  ring.push([ring[0]![0], ring[0]![1]]);
  return { type: 'Polygon', coordinates: [ring] };
}

/** A polygon's outer ring as corners for Leaflet (without the closing position). */
export function latLngsOf(polygon: Polygon): LatLngLike[] {
  const ring = polygon.coordinates[0] ?? [];
  return ring.slice(0, -1).map((p) => ({ lat: p[1], lng: p[0] }));
}

export interface OutlineFacts {
  areaM2: number;
  bearingDeg: number | null;
  eastWest: boolean;
}

/** Area and long axis of an outline; a degenerate one (corners on a line) has no axis. */
export function outlineFacts(polygon: Polygon): OutlineFacts {
  const areaM2 = polygonAreaM2(polygon);
  try {
    const axis = longAxis(polygon);
    return { areaM2, bearingDeg: axis.bearingDeg, eastWest: axis.eastWest };
  } catch {
    return { areaM2, bearingDeg: null, eastWest: false };
  }
}

/** Both area units a crew uses: acres and ft² (imperial), hectares and m² (metric). */
export function formatOutlineArea(m2: number, units: UnitSystem): string {
  return `${formatLandArea(m2, units)} · ${formatSurfaceArea(m2, units)}`;
}

/** A bearing of the long axis, folded to 0–180°, with its compass words. */
export function formatBearing(deg: number): string {
  const d = ((deg % 180) + 180) % 180;
  const names = ['N–S', 'NNE–SSW', 'NE–SW', 'ENE–WSW', 'E–W', 'ESE–WNW', 'SE–NW', 'SSE–NNW'];
  return `${Math.round(d)}° (${names[Math.round(d / 22.5) % 8]})`;
}
