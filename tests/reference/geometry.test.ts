/**
 * Field polygon area: the domain's `polygonAreaM2` (by @turf/area) against GeographicLib's
 * geodesic polygon area on the WGS84 ellipsoid (`geographiclib-geodesic`).
 * They differ because @turf/area works on a sphere (radius 6,378,137 m, the WGS84 equatorial
 * radius) while GeographicLib integrates on the flattened ellipsoid, whose curvature changes
 * with latitude. The same lon/lat outline therefore reads about 0.45 % larger on the sphere at
 * the equator, agrees near 35°, and reads about 0.56 % smaller at 60° (seen here for a
 * 105 × 68 m pitch). For field areas that is well inside what a turf crew can measure.
 */
import { describe, expect, test } from 'vitest';
import { Geodesic } from 'geographiclib-geodesic';
import { polygonAreaM2 } from '@swardwise/domain';
import type { Polygon } from '@swardwise/domain';
import * as e from '@swardwise/domain/engine';

const wgs = Geodesic.WGS84;

/** A length × width rectangle on the ellipsoid starting at a corner, long side along `azimuth`. */
function rectangle(lat: number, lng: number, lengthM: number, widthM: number, azimuth: number): Polygon {
  const a = { lat, lon: lng };
  const b = wgs.Direct(a.lat, a.lon, azimuth, lengthM);
  const c = wgs.Direct(b.lat2!, b.lon2!, azimuth + 90, widthM);
  const d = wgs.Direct(a.lat, a.lon, azimuth + 90, widthM);
  const ring: [number, number][] = [
    [a.lon, a.lat],
    [d.lon2!, d.lat2!],
    [c.lon2!, c.lat2!],
    [b.lon2!, b.lat2!],
    [a.lon, a.lat],
  ];
  return { type: 'Polygon', coordinates: [ring] };
}

function geodesicArea(p: Polygon): number {
  const poly = wgs.Polygon(false);
  const ring = p.coordinates[0]!;
  for (const [lon, lat] of ring.slice(0, -1)) poly.AddPoint(lat!, lon!);
  return Math.abs(poly.Compute(false, true).area!);
}

describe('polygon area: @turf/area (sphere) vs GeographicLib (WGS84 ellipsoid)', () => {
  test.each([0, 20, 40, -33, 60])('should agree within 0.6 percent for a 105 × 68 m pitch at latitude %d', (lat) => {
    const p = rectangle(lat, 10, 105, 68, 15);
    const ellipsoid = geodesicArea(p);
    const sphere = polygonAreaM2(p);
    expect(ellipsoid).toBeCloseTo(105 * 68, -1);
    expect(Math.abs(sphere - ellipsoid) / ellipsoid).toBeLessThan(0.006);
  });

  test('should read larger on the sphere at the equator and smaller at 60° (the curvature difference)', () => {
    const at = (lat: number) => {
      const p = rectangle(lat, 10, 105, 68, 15);
      return polygonAreaM2(p) / geodesicArea(p);
    };
    expect(at(0)).toBeGreaterThan(1.003);
    expect(at(60)).toBeLessThan(0.997);
    expect(at(0)).toBeGreaterThan(at(40));
    expect(at(40)).toBeGreaterThan(at(60));
  });

  test('should give mowing hours that differ by the same small ratio', () => {
    const p = rectangle(40, -88, 105, 68, 0);
    const mower = e.DEFAULT_PARAMETERS.mowers.rotary;
    const ratio = e.hoursPerMowingPolygon(p, mower) / e.hoursPerMowing(geodesicArea(p), mower);
    expect(Math.abs(ratio - 1)).toBeLessThan(0.005);
  });
});
