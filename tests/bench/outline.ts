/**
 * Outline benchmark: the long axis (hull + rotating calipers) of round outlines where every
 * position is on the hull (its worst case), against the brute force it replaced, and the
 * field routes with an outline at the bound (5,000 positions, answered) and far over it
 * (100,000, refused with a 400) on an in-memory PGlite. All data is invented.
 * Run: node --import tsx tests/bench/outline.ts
 */
import { performance } from 'node:perf_hooks';
import { longAxis, MAX_OUTLINE_POSITIONS, type Polygon } from '@swardwise/domain';
import { startTestApi } from '../support/app.ts';
import { rectanglesOnEdges, type XY } from '../support/brute-force-axis.ts';
import { fieldBody } from '../support/fixture.ts';


/** A closed ring of `n` positions on an ellipse; `round` to 6 decimals keeps 100,000 under the 2 MB body limit (and merges neighbours). */
function circle(n: number, lng = -66.47, lat = 37.64, round = true): Polygon {
  const r = (v: number) => (round ? Math.round(v * 1e6) / 1e6 : v);
  const pts = Array.from({ length: n - 1 }, (_, i) => {
    const t = (2 * Math.PI * i) / (n - 1);
    return [r(lng + 0.001 * Math.cos(t)), r(lat + 0.0008 * Math.sin(t))] as XY;
  });
  return { type: 'Polygon', coordinates: [[...pts, pts[0]!]] };
}

/** The previous long axis: every hull edge against every hull point (the hull is all of a circle's points). */
function bruteForceArea(polygon: Polygon): number {
  const pts = polygon.coordinates[0]!.slice(0, -1).map((p) => [p[0]! * 88_000, p[1]! * 111_000] as XY);
  return rectanglesOnEdges(pts).reduce((best, r) => Math.min(best, r.w * r.h), Infinity);
}

const pct = (xs: number[], p: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor((p / 100) * xs.length))]!;
const fmt = (xs: number[]) => `p50 ${pct(xs, 50).toFixed(1)} ms, max ${Math.max(...xs).toFixed(1)} ms`;
function time(runs: number, fn: () => unknown): number[] {
  const out: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    fn();
    out.push(performance.now() - t0);
  }
  return out;
}

for (const n of [MAX_OUTLINE_POSITIONS, 32_000, 100_000]) {
  const p = circle(n, -66.47, 37.64, false);
  console.log(`longAxis, ${n.toLocaleString('en-US')} positions all on the hull: ${fmt(time(10, () => longAxis(p)))}`);
}
for (const n of [MAX_OUTLINE_POSITIONS, 32_000]) {
  const p = circle(n, -66.47, 37.64, false);
  console.log(`previous brute force, ${n.toLocaleString('en-US')} positions: ${fmt(time(n > 10_000 ? 1 : 3, () => bruteForceArea(p)))}`);
}

const api = await startTestApi();
const agent = await api.signIn('foreman');
const body = (geometry: Polygon, i: number) => fieldBody(api.fixture.sites.northPark, `Bench lawn ${i}`, geometry, { sport: 'lawn', maintenanceLevel: 4 });
const atBound = circle(MAX_OUTLINE_POSITIONS);
const created: number[] = [];
const createTimes: number[] = [];
for (let i = 0; i < 10; i++) {
  const t0 = performance.now();
  const res = await agent.post('/api/fields').send(body(atBound, i));
  createTimes.push(performance.now() - t0);
  if (res.status !== 201) throw new Error(`create answered ${res.status}`);
  created.push(res.body.field.id);
}
console.log(`POST /api/fields, ${MAX_OUTLINE_POSITIONS.toLocaleString('en-US')} positions (201): ${fmt(createTimes)}`);
const patchTimes: number[] = [];
for (const [i, id] of created.entries()) {
  const t0 = performance.now();
  const res = await agent.patch(`/api/fields/${id}`).send({ version: 1, geometry: circle(MAX_OUTLINE_POSITIONS, -66.47 + 0.00001 * (i + 1)) });
  patchTimes.push(performance.now() - t0);
  if (res.status !== 200) throw new Error(`update answered ${res.status}`);
}
console.log(`PATCH /api/fields/:id outline, ${MAX_OUTLINE_POSITIONS.toLocaleString('en-US')} positions (200): ${fmt(patchTimes)}`);
const huge = JSON.stringify(body(circle(100_000, 1.5, 2.5), 0));
const refuseTimes: number[] = [];
for (let i = 0; i < 5; i++) {
  const t0 = performance.now();
  const res = await agent.post('/api/fields').set('content-type', 'application/json').send(huge);
  refuseTimes.push(performance.now() - t0);
  if (res.status !== 400) throw new Error(`oversized outline answered ${res.status}`);
}
console.log(`POST /api/fields, 100,000 positions (400, ${(huge.length / 1e6).toFixed(2)} MB body): ${fmt(refuseTimes)}`);
await api.close();
