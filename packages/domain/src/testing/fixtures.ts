/**
 * Invented outlines, weather and fields that several of the domain's test files build, written
 * once. Not exported by the package: only its tests import it.
 */
import type { Polygon } from '../schemas/common.ts';
import { addDaysIso } from '../engine/dates.ts';
import type { DailyWeather } from '../engine/outlook.ts';
import type { PlanField } from '../engine/weekgen.ts';

/** A rectangle of lengthM × widthM centred at (lat, lng), its long axis at `bearingDeg` from north. */
export function rotatedRect(lat: number, lng: number, lengthM: number, widthM: number, bearingDeg: number): Polygon {
  const b = (bearingDeg * Math.PI) / 180;
  const along: [number, number] = [Math.sin(b), Math.cos(b)]; // east, north
  const across: [number, number] = [Math.cos(b), -Math.sin(b)];
  const mLat = 111_132.92 - 559.82 * Math.cos((2 * lat * Math.PI) / 180);
  const mLng = 111_412.84 * Math.cos((lat * Math.PI) / 180);
  const corner = (sa: number, sc: number): [number, number] => {
    const x = (sa * lengthM * along[0]) / 2 + (sc * widthM * across[0]) / 2;
    const y = (sa * lengthM * along[1]) / 2 + (sc * widthM * across[1]) / 2;
    return [lng + x / mLng, lat + y / mLat];
  };
  const ring = [corner(-1, -1), corner(1, -1), corner(1, 1), corner(-1, 1)];
  return { type: 'Polygon', coordinates: [[...ring, ring[0]!]] };
}

/** An outline `w` × `h` degrees from its south-west corner (lat, lng); by default 100 m × 64 m at 38° N, about 6,400 m². */
export const degreeRect = (lat: number, lng: number, w = 0.00115, h = 0.000576): Polygon => ({
  type: 'Polygon' as const,
  coordinates: [[[lng, lat], [lng + w, lat], [lng + w, lat + h], [lng, lat + h], [lng, lat]]],
});

/** `n` days of the same weather from `start`: Tmax, Tmin and rain (3 mm unless given). */
export const steadyDays = (start: string, n: number, t: { tmax: number; tmin: number; rain?: number }): DailyWeather[] =>
  Array.from({ length: n }, (_, i) => ({ date: addDaysIso(start, i), tmaxC: t.tmax, tminC: t.tmin, rainMm: t.rain ?? 3 }));

/**
 * A level-2 soccer field of Kentucky bluegrass at 38° N (`degreeRect`, 6,400 m²), open, not
 * irrigated, with nothing done yet and no bookings; `over` sets the rest.
 */
export const planField = (over: Partial<PlanField> = {}): PlanField => ({
  id: 1,
  siteId: 10,
  site: { lat: 38, lng: -77 },
  sport: 'soccer',
  grass: 'kentucky_bluegrass',
  areaM2: 6400,
  geometry: degreeRect(38, -77),
  maintenanceLevel: 2,
  hocOverrideMm: null,
  clippings: 'returned',
  irrigation: 'none',
  status: 'open',
  lastMowedOn: null,
  lastPaintedOn: null,
  lastFedOn: null,
  lastCheckedOn: null,
  events: [],
  ...over,
});
