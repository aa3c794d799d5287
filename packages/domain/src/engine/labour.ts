/**
 * Labour: mowing hours from a mower's effective field capacity or from a pass plan, trailer
 * travel between sites, and weekly crew load.
 * Effective field capacity (ASABE EP496): ha/h = km/h × m × efficiency ÷ 10;
 * ac/h = mph × ft × efficiency ÷ 8.25.
 */
import type { Polygon } from '../schemas/common.ts';
import { polygonAreaM2 } from '../geometry.ts';
import { fail, requireFraction, requireNonNegative, requirePositive, requireRange } from './check.ts';
import type { MowerSpec } from './standards.ts';

/** Effective field capacity, ha/h = speed (km/h) × width (m) × efficiency ÷ 10 (ASABE EP496). */
export function effectiveFieldCapacityHaPerH(speedKmh: number, widthM: number, efficiency: number): number {
  requirePositive(speedKmh, 'invalid_speed', 'speed (km/h)');
  requirePositive(widthM, 'invalid_width', 'cutting width (m)');
  requireFraction(efficiency, 'invalid_efficiency', 'field efficiency');
  return (speedKmh * widthM * efficiency) / 10;
}

/** Effective field capacity, ac/h = speed (mph) × width (ft) × efficiency ÷ 8.25 (ASABE EP496). */
export function effectiveFieldCapacityAcPerH(speedMph: number, widthFt: number, efficiency: number): number {
  requirePositive(speedMph, 'invalid_speed', 'speed (mph)');
  requirePositive(widthFt, 'invalid_width', 'cutting width (ft)');
  requireFraction(efficiency, 'invalid_efficiency', 'field efficiency');
  return (speedMph * widthFt * efficiency) / 8.25;
}

/** Hours to mow `areaM2` once with a mower (area ÷ effective field capacity). */
export function hoursPerMowing(areaM2: number, mower: Pick<MowerSpec, 'speedKmh' | 'widthM' | 'efficiency'>): number {
  requireNonNegative(areaM2, 'invalid_area', 'area (m²)');
  return areaM2 / 10_000 / effectiveFieldCapacityHaPerH(mower.speedKmh, mower.widthM, mower.efficiency);
}

/** Hours to mow a field outline once (geodesic area by `polygonAreaM2`). */
export function hoursPerMowingPolygon(polygon: Polygon, mower: Pick<MowerSpec, 'speedKmh' | 'widthM' | 'efficiency'>): number {
  return hoursPerMowing(polygonAreaM2(polygon), mower);
}

export type StripeDirection = 'lengthwise' | 'side_to_side' | 'criss_cross';

export interface PassPlan {
  direction: StripeDirection;
  /** Passes in each direction mowed (two entries for criss-cross). */
  passes: number[];
  passLengthsM: number[];
  turns: number;
  distanceM: number;
  hours: number;
}

/**
 * Pass plan for a rectangular field: passes = ⌈(across − overlap) ÷ (width − overlap)⌉ per
 * direction (n passes cover n × width − (n − 1) × overlap);
 * time = distance ÷ speed + turns × turn time. Lengthwise passes run along the long side;
 * side to side along the short side (stripes officials read across; common practice);
 * criss-cross mows both directions.
 */
export function stripePassPlan(lengthM: number, widthM: number, mower: Pick<MowerSpec, 'widthM' | 'overlapM' | 'speedKmh' | 'turnTimeS'>, direction: StripeDirection): PassPlan {
  requirePositive(lengthM, 'invalid_dimension', 'field length (m)');
  requirePositive(widthM, 'invalid_dimension', 'field width (m)');
  requirePositive(mower.speedKmh, 'invalid_speed', 'speed (km/h)');
  requireNonNegative(mower.turnTimeS, 'invalid_turn_time', 'turn time (s)');
  requireNonNegative(mower.overlapM, 'invalid_overlap', 'overlap (m)');
  const effective = mower.widthM - mower.overlapM;
  if (!(effective > 0)) fail('invalid_overlap', `overlap (${mower.overlapM} m) must be smaller than the cutting width (${mower.widthM} m)`);
  // n passes cover n × width − (n − 1) × overlap = n × (width − overlap) + overlap, so the
  // first pass covers a full width and each further pass adds width − overlap.
  const one = (passLength: number, across: number) => ({ passes: Math.max(1, Math.ceil((across - mower.overlapM) / effective - 1e-9)), passLength });
  const dirs = direction === 'lengthwise' ? [one(lengthM, widthM)] : direction === 'side_to_side' ? [one(widthM, lengthM)] : direction === 'criss_cross' ? [one(lengthM, widthM), one(widthM, lengthM)] : fail('invalid_direction', `stripe direction must be lengthwise, side_to_side or criss_cross (got ${JSON.stringify(direction)})`);
  const passes = dirs.map((d) => d.passes);
  const passLengthsM = dirs.map((d) => d.passLength);
  const turns = dirs.reduce((s, d) => s + Math.max(0, d.passes - 1), 0);
  const distanceM = dirs.reduce((s, d) => s + d.passes * d.passLength, 0);
  const hours = distanceM / 1000 / mower.speedKmh + (turns * mower.turnTimeS) / 3600;
  return { direction, passes, passLengthsM, turns, distanceM, hours };
}

/** A point in degrees. */
export interface LatLng {
  lat: number;
  lng: number;
}

/** Mean Earth radius, km (IUGG R1 = 6371.0088 km), as @turf/distance uses. */
export const EARTH_RADIUS_KM = 6371.0088;

/** Great-circle distance (km) by the haversine formula on a sphere of radius R1. */
export function greatCircleKm(a: LatLng, b: LatLng): number {
  for (const p of [a, b]) {
    requireRange(p.lat, -90, 90, 'invalid_latitude', 'latitude (°)');
    requireRange(p.lng, -180, 180, 'invalid_longitude', 'longitude (°)');
  }
  const r = Math.PI / 180;
  const dLat = (b.lat - a.lat) * r;
  const dLng = (b.lng - a.lng) * r;
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(a.lat * r) * Math.cos(b.lat * r) * Math.sin(dLng / 2) ** 2;
  return 2 * EARTH_RADIUS_KM * Math.asin(Math.min(1, Math.sqrt(h)));
}

export interface TravelSettings {
  /** Road distance ÷ great-circle distance (department setting). */
  roadFactor: number;
  speedKmh: number;
  /** Minutes to load and unload the trailer per move. */
  loadUnloadMin: number;
}

export interface TrailerTrip {
  greatCircleKm: number;
  roadKm: number;
  driveHours: number;
  loadUnloadHours: number;
  hours: number;
}

/** Trailer move between sites: great-circle km × road factor ÷ speed, plus load/unload time. */
export function trailerTrip(from: LatLng, to: LatLng, settings: TravelSettings): TrailerTrip {
  requireRange(settings.roadFactor, 1, 5, 'invalid_road_factor', 'road factor');
  requirePositive(settings.speedKmh, 'invalid_speed', 'travel speed (km/h)');
  requireNonNegative(settings.loadUnloadMin, 'invalid_duration', 'load/unload time (min)');
  const gc = greatCircleKm(from, to);
  const roadKm = gc * settings.roadFactor;
  const driveHours = roadKm / settings.speedKmh;
  const loadUnloadHours = settings.loadUnloadMin / 60;
  return { greatCircleKm: gc, roadKm, driveHours, loadUnloadHours, hours: driveHours + loadUnloadHours };
}

export interface CrewLoad {
  crewId: string | number;
  plannedHours: number;
  availableHours: number;
  /** planned ÷ available. */
  utilisation: number;
  overloaded: boolean;
  spareHours: number;
}

/** A crew's planned hours for a week against its available hours. */
export function crewWeekLoad(crewId: string | number, taskHours: readonly number[], availableHours: number): CrewLoad {
  requirePositive(availableHours, 'invalid_hours', 'available crew hours');
  let planned = 0;
  for (const h of taskHours) planned += requireNonNegative(h, 'invalid_hours', 'task hours');
  return {
    crewId,
    plannedHours: planned,
    availableHours,
    utilisation: planned / availableHours,
    overloaded: planned > availableHours + 1e-9,
    spareHours: availableHours - planned,
  };
}
