/**
 * A crew-day's route: sites ordered from the district yard and back by nearest neighbour,
 * improved by 2-opt. Distances are great-circle km × road factor. Ties break by id so equal
 * inputs give equal routes. The input order is also 2-opted and the shorter tour kept, so a
 * planned route is never longer than the order the sites came in.
 */
import { fail, requirePositive, requireRange } from './check.ts';
import { greatCircleKm } from './labour.ts';
import type { LatLng } from './labour.ts';

export interface RouteStop extends LatLng {
  id: string | number;
}

export interface RouteOptions {
  roadFactor?: number;
  speedKmh?: number;
}

export interface PlannedRoute {
  /** Stop ids in visiting order (yard excluded). */
  order: Array<string | number>;
  /** Road km of each leg: yard → first, …, last → yard. */
  legsKm: number[];
  totalKm: number;
  driveHours: number;
}

const compareIds = (a: string | number, b: string | number): number => {
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  const sa = String(a);
  const sb = String(b);
  return sa < sb ? -1 : sa > sb ? 1 : 0;
};

/** Road km of the closed tour yard → stops (in order) → yard. */
export function tourLengthKm(yard: LatLng, stops: readonly LatLng[], roadFactor = 1): number {
  if (stops.length === 0) return 0;
  let km = greatCircleKm(yard, stops[0] as LatLng);
  for (let i = 1; i < stops.length; i++) km += greatCircleKm(stops[i - 1] as LatLng, stops[i] as LatLng);
  km += greatCircleKm(stops[stops.length - 1] as LatLng, yard);
  return km * roadFactor;
}

/** Orders a day's stops from the yard and back (nearest neighbour, then 2-opt). */
export function planRoute(yard: LatLng, stops: readonly RouteStop[], options: RouteOptions = {}): PlannedRoute {
  const roadFactor = requireRange(options.roadFactor ?? 1.3, 1, 5, 'invalid_road_factor', 'road factor');
  const speedKmh = requirePositive(options.speedKmh ?? 35, 'invalid_speed', 'travel speed (km/h)');
  const ids = new Set<string | number>();
  for (const s of stops) {
    if (ids.has(s.id)) fail('duplicate_stop', `stop ${String(s.id)} appears twice in the route`);
    ids.add(s.id);
  }
  const n = stops.length;
  // Node 0 is the yard; nodes 1..n are the stops. Full distance matrix (n is a day's sites).
  const pts: LatLng[] = [yard, ...stops];
  const d: Float64Array[] = pts.map((a) => Float64Array.from(pts, (b) => greatCircleKm(a, b)));
  const dist = (i: number, j: number): number => (d[i] as Float64Array)[j] as number;

  // Nearest neighbour from the yard, ties by id.
  const nn: number[] = [];
  const used = new Array<boolean>(n + 1).fill(false);
  let cur = 0;
  for (let step = 0; step < n; step++) {
    let best = -1;
    for (let j = 1; j <= n; j++) {
      if (used[j]) continue;
      if (best < 0) best = j;
      else {
        const diff = dist(cur, j) - dist(cur, best);
        if (diff < -1e-12 || (Math.abs(diff) <= 1e-12 && compareIds((stops[j - 1] as RouteStop).id, (stops[best - 1] as RouteStop).id) < 0)) best = j;
      }
    }
    used[best] = true;
    nn.push(best);
    cur = best;
  }
  const input = Array.from({ length: n }, (_, i) => i + 1);
  const a = twoOpt(nn, dist);
  const b = twoOpt(input, dist);
  const len = (t: number[]) => closedLength(t, dist);
  const la = len(a);
  const lb = len(b);
  const tour = lb < la - 1e-9 ? b : a;
  const legsKm: number[] = [];
  let prev = 0;
  for (const k of tour) {
    legsKm.push(dist(prev, k) * roadFactor);
    prev = k;
  }
  if (n > 0) legsKm.push(dist(prev, 0) * roadFactor);
  const totalKm = legsKm.reduce((s, v) => s + v, 0);
  return { order: tour.map((k) => (stops[k - 1] as RouteStop).id), legsKm, totalKm, driveHours: totalKm / speedKmh };
}

function closedLength(t: readonly number[], dist: (i: number, j: number) => number): number {
  if (t.length === 0) return 0;
  let s = dist(0, t[0] as number);
  for (let i = 1; i < t.length; i++) s += dist(t[i - 1] as number, t[i] as number);
  return s + dist(t[t.length - 1] as number, 0);
}

/** 2-opt on a closed tour anchored at the yard (node 0): reverse segments while that shortens it. */
function twoOpt(start: readonly number[], dist: (i: number, j: number) => number): number[] {
  const t = [0, ...start, 0];
  let improved = true;
  let guard = 0;
  while (improved && guard++ < 1000) {
    improved = false;
    for (let i = 1; i < t.length - 2; i++) {
      for (let k = i + 1; k < t.length - 1; k++) {
        const a = t[i - 1] as number;
        const b = t[i] as number;
        const c = t[k] as number;
        const e = t[k + 1] as number;
        const delta = dist(a, c) + dist(b, e) - dist(a, b) - dist(c, e);
        if (delta < -1e-10) {
          for (let x = i, y = k; x < y; x++, y--) {
            const tmp = t[x] as number;
            t[x] = t[y] as number;
            t[y] = tmp;
          }
          improved = true;
        }
      }
    }
  }
  return t.slice(1, -1);
}
