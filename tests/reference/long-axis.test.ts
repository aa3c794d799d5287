/**
 * The long axis by rotating calipers (`longAxis`, O(h) after the hull) against the
 * brute force it replaced (every hull edge against every hull point, O(h²)), on generated
 * outlines. Both find the minimum-area enclosing rectangle, which has a side on a hull edge
 * (H. Freeman and R. Shapira, Communications of the ACM 18 (1975) 409–413).
 */
import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { convexHull, longAxis, type Polygon } from '@swardwise/domain';
import { rectanglesOnEdges, type XY } from '../support/brute-force-axis.ts';


/**
 * The conversion to local metres exactly as `longAxis` had it before. The brute force runs on
 * the hull `longAxis` uses (`convexHull`), so only the search for the rectangle is compared.
 */
function localMetres(polygon: Polygon): XY[] {
  const pts = polygon.coordinates[0]!.slice(0, -1);
  const lat0 = pts.reduce((s, p) => s + p[1]!, 0) / pts.length;
  const lng0 = pts.reduce((s, p) => s + p[0]!, 0) / pts.length;
  const phi = (lat0 * Math.PI) / 180;
  const mLat = 111_132.92 - 559.82 * Math.cos(2 * phi) + 1.175 * Math.cos(4 * phi);
  const mLng = 111_412.84 * Math.cos(phi) - 93.5 * Math.cos(3 * phi);
  return pts.map((p) => [(p[0]! - lng0) * mLng, (p[1]! - lat0) * mLat]);
}

const bearingOf = (axisAngle: number) => {
  let bearing = (90 - (axisAngle * 180) / Math.PI) % 180;
  if (bearing < 0) bearing += 180;
  if (bearing >= 180 - 1e-9) bearing = 0;
  return bearing;
};

/** The previous brute force: the rectangle on every hull edge, measured against every hull point. */
function bruteForce(polygon: Polygon) {
  const hull = convexHull(localMetres(polygon));
  if (hull.length < 3) return null;
  const candidates: { area: number; bearing: number; lengthM: number; widthM: number }[] = [];
  let best = { area: Infinity, angle: 0, w: 0, h: 0 };
  for (const { angle, w, h } of rectanglesOnEdges(hull)) {
    candidates.push({ area: w * h, bearing: bearingOf(w >= h ? angle : angle + Math.PI / 2), lengthM: Math.max(w, h), widthM: Math.min(w, h) });
    if (w * h < best.area - 1e-9) best = { area: w * h, angle, w, h };
  }
  const chosen = { bearing: bearingOf(best.w >= best.h ? best.angle : best.angle + Math.PI / 2), lengthM: Math.max(best.w, best.h), widthM: Math.min(best.w, best.h), area: best.area };
  return { chosen, candidates };
}

const bearingGap = (a: number, b: number) => {
  const d = Math.abs(a - b) % 180;
  return Math.min(d, 180 - d);
};

/** Corners on a 1e-6° grid (about 0.1 m, a survey's precision) up to about ±150 m around a point anywhere a city might be. */
const step = fc.integer({ min: -1500, max: 1500 });
const outline = fc
  .record({
    lat: fc.double({ min: -60, max: 60, noNaN: true }),
    lng: fc.double({ min: -179, max: 179, noNaN: true }),
    offsets: fc.array(fc.tuple(step, step), { minLength: 3, maxLength: 80 }),
  })
  .map(({ lat, lng, offsets }): Polygon => {
    const ring = offsets.map(([dx, dy]) => [lng + dx * 1e-6, lat + dy * 1e-6] as [number, number]);
    return { type: 'Polygon', coordinates: [[...ring, ring[0]!]] };
  });

/** Many points on a wobbly circle: every one on the hull, where the brute force is slowest. */
const roundOutline = fc
  .record({
    lat: fc.double({ min: -60, max: 60, noNaN: true }),
    n: fc.integer({ min: 3, max: 400 }),
    rx: fc.double({ min: 0.0002, max: 0.002, noNaN: true }),
    ry: fc.double({ min: 0.0002, max: 0.002, noNaN: true }),
    turn: fc.double({ min: 0, max: Math.PI, noNaN: true }),
  })
  .map(({ lat, n, rx, ry, turn }): Polygon => {
    const ring: [number, number][] = [];
    for (let i = 0; i < n; i++) {
      const t = (2 * Math.PI * i) / n;
      const x = rx * Math.cos(t);
      const y = ry * Math.sin(t);
      ring.push([10 + x * Math.cos(turn) - y * Math.sin(turn), lat + x * Math.sin(turn) + y * Math.cos(turn)]);
    }
    return { type: 'Polygon', coordinates: [[...ring, ring[0]!]] };
  });

function expectSameAxis(polygon: Polygon) {
  const ref = bruteForce(polygon);
  if (!ref) {
    expect(() => longAxis(polygon)).toThrow(/three corners/);
    return;
  }
  const got = longAxis(polygon);
  const scale = Math.max(ref.chosen.area, 1e-6);
  expect(Math.abs(got.lengthM * got.widthM - ref.chosen.area) / scale).toBeLessThan(1e-9);
  if (bearingGap(got.bearingDeg, ref.chosen.bearing) > 1e-6) {
    // Only where the brute force had rectangles of the same area (a tie) may the choice differ.
    const tied = ref.candidates.filter((c) => Math.abs(c.area - ref.chosen.area) / scale < 1e-9);
    expect(tied.some((c) => bearingGap(c.bearing, got.bearingDeg) < 1e-6 || Math.abs(c.lengthM - c.widthM) < 1e-9 * c.lengthM)).toBe(true);
  } else {
    expect(Math.abs(got.lengthM - ref.chosen.lengthM)).toBeLessThan(1e-6 * Math.max(1, ref.chosen.lengthM));
    expect(Math.abs(got.widthM - ref.chosen.widthM)).toBeLessThan(1e-6 * Math.max(1, ref.chosen.lengthM));
  }
}

describe('longAxis by rotating calipers', () => {
  test('should equal the brute-force long axis on random outlines', () => {
    fc.assert(fc.property(outline, expectSameAxis), { numRuns: 500 });
  });

  test('should equal the brute-force long axis on outlines with every point on the hull', () => {
    fc.assert(fc.property(roundOutline, expectSameAxis), { numRuns: 200 });
  });
});
