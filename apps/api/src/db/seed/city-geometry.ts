/**
 * Plane geometry for the invented demo city: field outlines drawn in metres on a local
 * tangent plane and turned into GeoJSON longitude/latitude with a local projection.
 *
 * Local frames use x = metres east, y = metres north. A field shape is first drawn with its
 * long axis along +y, turned by a bearing (degrees clockwise from north) and then projected
 * at the latitude of its site (metres per degree of longitude shrink with cos(latitude)).
 */
import type { Polygon } from '@swardwise/domain';
import type { Rng } from './prng.ts';

/** Mean earth radius, the one @turf/area and @turf/distance use, so areas come back as drawn. */
const EARTH_RADIUS_M = 6_371_008.8;
const METRES_PER_DEGREE_LAT = (EARTH_RADIUS_M * Math.PI) / 180;

export type Vec = [number, number];
export interface LatLng {
  lat: number;
  lng: number;
}
export type Position = [number, number];

const DEG = Math.PI / 180;

/** Rounds a coordinate to 7 decimals (about 1 cm), which keeps the JSON small and stable. */
function roundCoord(value: number): number {
  return Math.round(value * 1e7) / 1e7;
}

/** The point `east` / `north` metres from `origin`, as a GeoJSON [lng, lat] position. */
export function offsetPosition(origin: LatLng, east: number, north: number): Position {
  const lat = origin.lat + north / METRES_PER_DEGREE_LAT;
  const lng = origin.lng + east / (METRES_PER_DEGREE_LAT * Math.cos(origin.lat * DEG));
  return [roundCoord(lng), roundCoord(lat)];
}

/** The point `east` / `north` metres from `origin`, as { lat, lng }. */
export function offsetLatLng(origin: LatLng, east: number, north: number): LatLng {
  const [lng, lat] = offsetPosition(origin, east, north);
  return { lat, lng };
}

/** A ring of local points as a closed GeoJSON polygon around `origin`. */
export function ringToPolygon(origin: LatLng, ring: Vec[]): Polygon {
  const positions = ring.map(([x, y]) => offsetPosition(origin, x, y));
  const first = positions[0];
  if (!first) throw new Error('a ring needs points');
  positions.push([first[0], first[1]]);
  return { type: 'Polygon', coordinates: [positions] };
}

/** Turns local points clockwise by `bearingDeg` (the +y axis ends up pointing at that bearing). */
function rotate(points: Vec[], bearingDeg: number, about: Vec = [0, 0]): Vec[] {
  const t = bearingDeg * DEG;
  const c = Math.cos(t);
  const s = Math.sin(t);
  return points.map(([x, y]) => {
    const dx = x - about[0];
    const dy = y - about[1];
    return [about[0] + dx * c + dy * s, about[1] - dx * s + dy * c];
  });
}

function translate(points: Vec[], dx: number, dy: number): Vec[] {
  return points.map(([x, y]) => [x + dx, y + dy]);
}

interface Box {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

function boundsOf(points: Vec[]): Box {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const [x, y] of points) {
    minX = Math.min(minX, x);
    minY = Math.min(minY, y);
    maxX = Math.max(maxX, x);
    maxY = Math.max(maxY, y);
  }
  return { minX, minY, maxX, maxY };
}

/** Shoelace area of an open ring of local points (positive when counter-clockwise). */
function planarArea(ring: Vec[]): number {
  let sum = 0;
  for (let i = 0; i < ring.length; i++) {
    const a = ring[i]!;
    const b = ring[(i + 1) % ring.length]!;
    sum += a[0] * b[1] - b[0] * a[1];
  }
  return sum / 2;
}

/** A playing rectangle, long axis along +y, centred on the origin, counter-clockwise. */
export function rectangleShape(lengthM: number, widthM: number): Vec[] {
  const l = lengthM / 2;
  const w = widthM / 2;
  return [
    [-w, -l],
    [w, -l],
    [w, l],
    [-w, l],
  ];
}

/**
 * A ball-field fan: home plate at the origin (the ring's first point), foul lines at 45° either
 * side of the centre line (+y), an outfield fence from foul pole to foul pole whose distance
 * from home grows smoothly from `foulLineM` at the poles to `centerFieldM` in straightaway centre.
 */
export function fanShape(foulLineM: number, centerFieldM: number, arcSegments = 24): Vec[] {
  const ring: Vec[] = [[0, 0]];
  for (let i = 0; i <= arcSegments; i++) {
    // From the right-field pole (+45°) to the left-field pole (−45°): counter-clockwise.
    const phi = (45 - (90 * i) / arcSegments) * DEG;
    const r = foulLineM + (centerFieldM - foulLineM) * Math.cos(2 * phi);
    ring.push([r * Math.sin(phi), r * Math.cos(phi)]);
  }
  return ring;
}

/**
 * An irregular lawn: a star-shaped outline (so never self-crossing) stretched along +y by
 * `aspect` and scaled to exactly `areaM2`.
 */
export function lawnShape(rng: Rng, areaM2: number, aspect: number, vertices = 12): Vec[] {
  const raw: number[] = [];
  for (let i = 0; i < vertices; i++) raw.push(0.78 + 0.44 * rng());
  // Smooth the radii with their neighbours so the outline looks like a mown edge, not a star.
  const radii = raw.map((r, i) => (r * 2 + raw[(i + vertices - 1) % vertices]! + raw[(i + 1) % vertices]!) / 4);
  const sx = 1 / Math.sqrt(aspect);
  const sy = Math.sqrt(aspect);
  const ring: Vec[] = radii.map((r, i) => {
    const t = ((i + 0.3 * (rng() - 0.5)) / vertices) * 2 * Math.PI;
    return [r * Math.cos(t) * sx, r * Math.sin(t) * sy];
  });
  const k = Math.sqrt(areaM2 / planarArea(ring));
  return ring.map(([x, y]) => [x * k, y * k]);
}

export interface SiteLayout {
  /** Each field's ring in metres east/north of the site point. */
  rings: Vec[][];
  /** The site outline: the fields' extent plus a margin, in the same frame. */
  outline: Vec[];
}

/**
 * Lays a site's field shapes out side by side in rows (with gaps, so none overlap), centres the
 * group on the site point and turns it to the site's bearing. Each shape may carry a small
 * bearing of its own (`jitterDeg`), applied before packing so the gaps still hold.
 */
export function layoutSite(
  shapes: { ring: Vec[]; jitterDeg: number }[],
  siteBearingDeg: number,
  options: { gapM?: number; rowGapM?: number; maxRowWidthM?: number; marginM?: number } = {},
): SiteLayout {
  const gap = options.gapM ?? 15;
  const rowGap = options.rowGapM ?? 25;
  const maxRowWidth = options.maxRowWidthM ?? 430;
  const margin = options.marginM ?? 20;

  const turned = shapes.map(({ ring, jitterDeg }) => {
    const b = boundsOf(ring);
    const centre: Vec = [(b.minX + b.maxX) / 2, (b.minY + b.maxY) / 2];
    const r = rotate(ring, jitterDeg, centre);
    return { ring: r, box: boundsOf(r) };
  });

  // Pack into rows, top row first.
  const rows: { items: typeof turned; width: number; height: number }[] = [];
  for (const item of turned) {
    const w = item.box.maxX - item.box.minX;
    const h = item.box.maxY - item.box.minY;
    const row = rows[rows.length - 1];
    if (row && row.width + gap + w <= maxRowWidth) {
      row.items.push(item);
      row.width += gap + w;
      row.height = Math.max(row.height, h);
    } else {
      rows.push({ items: [item], width: w, height: h });
    }
  }

  const placed: Vec[][] = [];
  let top = 0;
  for (const row of rows) {
    let left = -row.width / 2;
    const midY = top - row.height / 2;
    for (const item of row.items) {
      const w = item.box.maxX - item.box.minX;
      const cy = (item.box.minY + item.box.maxY) / 2;
      placed.push(translate(item.ring, left - item.box.minX, midY - cy));
      left += w + gap;
    }
    top -= row.height + rowGap;
  }

  // Centre the whole group on the site point.
  const all = boundsOf(placed.flat());
  const cx = (all.minX + all.maxX) / 2;
  const cy = (all.minY + all.maxY) / 2;
  const centred = placed.map((ring) => translate(ring, -cx, -cy));
  const box = boundsOf(centred.flat());
  const outline: Vec[] = [
    [box.minX - margin, box.minY - margin],
    [box.maxX + margin, box.minY - margin],
    [box.maxX + margin, box.maxY + margin],
    [box.minX - margin, box.maxY + margin],
  ];
  return {
    rings: centred.map((ring) => rotate(ring, siteBearingDeg)),
    outline: rotate(outline, siteBearingDeg),
  };
}
