/**
 * Field outline geometry: geodesic area, the bearing of a field's long axis, and the outline
 * in the field's own frame.
 */
import turfArea from '@turf/area';
import { DomainError } from './errors.ts';
import type { Polygon } from './schemas/common.ts';

/** Area of a GeoJSON polygon in square metres (geodesic, by @turf/area). */
export function polygonAreaM2(polygon: Polygon): number {
  return turfArea({ type: 'Feature', properties: {}, geometry: polygon as GeoJSON.Polygon });
}

type XY = [number, number];

/** The outer ring in local metres (x east, y north) around its mean point; fine at field scale. */
function localMetres(polygon: Polygon): XY[] {
  const { pts, lat0, lng0, mLat, mLng } = localOrigin(polygon);
  return pts.map((p) => [(p[0] - lng0) * mLng, (p[1] - lat0) * mLat]);
}

/** The ring's mean point and metres per degree there (the series for the WGS 84 ellipsoid). */
function localOrigin(polygon: Polygon) {
  const ring = polygon.coordinates[0];
  if (!ring || ring.length < 4) throw new DomainError('geometry/invalid_polygon', 'A field outline needs at least three corners');
  const pts = ring.slice(0, -1);
  const lat0 = pts.reduce((s, p) => s + p[1], 0) / pts.length;
  const lng0 = pts.reduce((s, p) => s + p[0], 0) / pts.length;
  const phi = (lat0 * Math.PI) / 180;
  const mLat = 111_132.92 - 559.82 * Math.cos(2 * phi) + 1.175 * Math.cos(4 * phi);
  const mLng = 111_412.84 * Math.cos(phi) - 93.5 * Math.cos(3 * phi);
  return { pts, lat0, lng0, mLat, mLng };
}

/**
 * Convex hull by Andrew's monotone chain, O(n log n), counter-clockwise without collinear
 * points (A. M. Andrew, "Another efficient algorithm for convex hulls in two dimensions",
 * Information Processing Letters 9 (1979) 216–219).
 */
export function convexHull(points: XY[]): XY[] {
  const pts = [...points].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  if (pts.length < 3) return pts;
  const cross = (o: XY, a: XY, b: XY) => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
  const lower: XY[] = [];
  for (const p of pts) {
    while (lower.length >= 2 && cross(lower[lower.length - 2]!, lower[lower.length - 1]!, p) <= 0) lower.pop();
    lower.push(p);
  }
  const upper: XY[] = [];
  for (const p of pts.reverse()) {
    while (upper.length >= 2 && cross(upper[upper.length - 2]!, upper[upper.length - 1]!, p) <= 0) upper.pop();
    upper.push(p);
  }
  return lower.slice(0, -1).concat(upper.slice(0, -1));
}

export interface LongAxis {
  /** Bearing of the long axis in degrees from true north, 0 ≤ bearing < 180. */
  bearingDeg: number;
  /** Sides of the smallest enclosing rectangle, metres. */
  lengthM: number;
  widthM: number;
  /**
   * True when the long axis runs closer to east–west than to north–south: the low sun is
   * then in players' eyes at one end (common practice prefers north–south).
   */
  eastWest: boolean;
}

/**
 * The long axis of a field outline, from the minimum-area enclosing rectangle of its convex
 * hull. One side of that rectangle lies on a hull edge (H. Freeman and R. Shapira, "Determining
 * the minimum-area encasing rectangle for an arbitrary closed curve", Communications of the ACM
 * 18 (1975) 409–413); the rectangles of all edges are found in one turn of rotating calipers
 * (G. Toussaint, "Solving geometric problems with the rotating calipers", Proc. IEEE MELECON
 * 1983), O(h) after the O(n log n) hull instead of O(h²).
 */
export function longAxis(polygon: Polygon): LongAxis {
  const hull = convexHull(localMetres(polygon));
  const h = hull.length;
  if (h < 3) throw new DomainError('geometry/invalid_polygon', 'A field outline needs three corners that are not on one line');
  const at = (i: number) => hull[i % h]!;
  let best = { area: Infinity, angle: 0, w: 0, h: 0 };
  // Calipers: the hull points farthest along the edge (right), across it (top) and back (left).
  let right = 1;
  let top = 1;
  let left = 1;
  for (let i = 0; i < h; i += 1) {
    const a = at(i);
    const b = at(i + 1);
    const angle = Math.atan2(b[1] - a[1], b[0] - a[0]);
    const c = Math.cos(angle);
    const s = Math.sin(angle);
    // Coordinates in the frame of the edge: x along it, y across it (the hull lies at y ≥ edge).
    const x = (p: XY) => p[0] * c + p[1] * s;
    const y = (p: XY) => -p[0] * s + p[1] * c;
    // Each caliper only moves forward round the hull: the projections are unimodal on a convex polygon.
    if (i === 0) right = 1;
    while (x(at(right + 1)) > x(at(right))) right += 1;
    if (i === 0) top = right;
    while (y(at(top + 1)) > y(at(top))) top += 1;
    if (i === 0) left = top;
    while (x(at(left + 1)) < x(at(left))) left += 1;
    const w = x(at(right)) - x(at(left));
    const height = y(at(top)) - Math.min(y(a), y(b));
    if (w * height < best.area - 1e-9) best = { area: w * height, angle, w, h: height };
  }
  // The long side runs along the edge direction when w ≥ h, else across it.
  const axisAngle = best.w >= best.h ? best.angle : best.angle + Math.PI / 2;
  // Math angle (from east, counter-clockwise) → compass bearing (from north, clockwise), folded to [0, 180).
  let bearing = (90 - (axisAngle * 180) / Math.PI) % 180;
  if (bearing < 0) bearing += 180;
  if (bearing >= 180 - 1e-9) bearing = 0;
  const fromNorth = Math.min(bearing, 180 - bearing);
  return { bearingDeg: bearing, lengthM: Math.max(best.w, best.h), widthM: Math.min(best.w, best.h), eastWest: fromNorth > 45 };
}

/** A field outline in its own frame, metres: x along the long axis, y across it, both from 0. */
export interface FieldFrame {
  /** Corners of the outer ring (not closed), metres. */
  points: Array<[number, number]>;
  /** Extent along x and y, metres (the long axis's enclosing rectangle). */
  lengthM: number;
  widthM: number;
  /** Bearing of the x axis, degrees from true north (as `longAxis`). */
  bearingDeg: number;
}

/**
 * The outline turned so its long axis (`longAxis`) runs along x: local metres (equirectangular
 * about the ring's mean point, fine at field scale) rotated by the axis bearing, then shifted so
 * the smallest x and y are 0. Plans in this frame (line plans, stripe passes) draw the same
 * whichever way the field lies on the map.
 */
export function fieldFrame(polygon: Polygon): FieldFrame {
  return frameOf(polygon).frame;
}

function frameOf(polygon: Polygon) {
  const axis = longAxis(polygon);
  // Compass bearing (from north, clockwise) → math angle (from east, counter-clockwise).
  const a = ((90 - axis.bearingDeg) * Math.PI) / 180;
  const c = Math.cos(a);
  const s = Math.sin(a);
  const turned = localMetres(polygon).map(([x, y]) => [x * c + y * s, -x * s + y * c] as [number, number]);
  const minX = Math.min(...turned.map((p) => p[0]));
  const minY = Math.min(...turned.map((p) => p[1]));
  const points = turned.map(([x, y]) => [x - minX, y - minY] as [number, number]);
  const frame: FieldFrame = { points, lengthM: Math.max(...points.map((p) => p[0])), widthM: Math.max(...points.map((p) => p[1])), bearingDeg: axis.bearingDeg };
  return { frame, c, s, minX, minY };
}

/**
 * The way back from `fieldFrame`: a point in the field's frame (metres along x and across y)
 * as a GeoJSON position [longitude, latitude] in degrees, by undoing the shift, the turn and
 * the local-metres projection. Line plans use it to put a layout on the map and to give the
 * set-out points as coordinates.
 */
export function fieldFrameToLngLat(polygon: Polygon): (x: number, y: number) => [number, number] {
  const { c, s, minX, minY } = frameOf(polygon);
  const { lat0, lng0, mLat, mLng } = localOrigin(polygon);
  return (x, y) => {
    const tx = x + minX;
    const ty = y + minY;
    // The turn is a rotation: its inverse is its transpose.
    const ex = tx * c - ty * s;
    const ny = tx * s + ty * c;
    return [lng0 + ex / mLng, lat0 + ny / mLat];
  };
}
