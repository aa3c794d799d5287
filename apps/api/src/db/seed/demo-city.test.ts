import { describe, expect, test } from 'vitest';
import { z } from 'zod';
import {
  createFieldSchema,
  GRASS_SEASON,
  passwordSchema,
  polygonAreaM2,
  polygonSchema,
  ROLES,
  type Polygon,
  type Role,
  type Sport,
} from '@swardwise/domain';
import { buildDemoCity, DEMO_PASSWORDS, DEMO_SIGN_INS, type DemoField } from './demo-city.ts';

// ----- helpers written here, independent of the module under test -----------------------------

type Pos = [number, number];
const R = 6_371_008.8;
const rad = (d: number) => (d * Math.PI) / 180;
const FT = 0.3048;
const YD = 0.9144;

function distanceM(a: Pos, b: Pos): number {
  const dLat = rad(b[1] - a[1]);
  const dLng = rad(b[0] - a[0]);
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(rad(a[1])) * Math.cos(rad(b[1])) * Math.sin(dLng / 2) ** 2;
  return 2 * R * Math.asin(Math.sqrt(h));
}

/** Initial bearing from a to b, degrees clockwise from north, 0–360. */
function bearingDeg(a: Pos, b: Pos): number {
  const y = Math.sin(rad(b[0] - a[0])) * Math.cos(rad(b[1]));
  const x = Math.cos(rad(a[1])) * Math.sin(rad(b[1])) - Math.sin(rad(a[1])) * Math.cos(rad(b[1])) * Math.cos(rad(b[0] - a[0]));
  return ((Math.atan2(y, x) * 180) / Math.PI + 360) % 360;
}

const ring = (p: Polygon): Pos[] => p.coordinates[0]!.map((q) => [q[0], q[1]] as Pos);

function pointInRing(pt: Pos, r: Pos[]): boolean {
  let inside = false;
  for (let i = 0, j = r.length - 1; i < r.length; j = i++) {
    const [xi, yi] = r[i]!;
    const [xj, yj] = r[j]!;
    if (yi > pt[1] !== yj > pt[1] && pt[0] < ((xj - xi) * (pt[1] - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

const cross = (o: Pos, a: Pos, b: Pos) => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);

/** Do segments ab and cd cross or touch? */
function segmentsIntersect(a: Pos, b: Pos, c: Pos, d: Pos): boolean {
  const d1 = cross(c, d, a);
  const d2 = cross(c, d, b);
  const d3 = cross(a, b, c);
  const d4 = cross(a, b, d);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) return true;
  const onSeg = (p: Pos, q: Pos, r: Pos) =>
    Math.min(p[0], q[0]) <= r[0] && r[0] <= Math.max(p[0], q[0]) && Math.min(p[1], q[1]) <= r[1] && r[1] <= Math.max(p[1], q[1]);
  return (d1 === 0 && onSeg(c, d, a)) || (d2 === 0 && onSeg(c, d, b)) || (d3 === 0 && onSeg(a, b, c)) || (d4 === 0 && onSeg(a, b, d));
}

const edges = (r: Pos[]): [Pos, Pos][] => r.slice(0, -1).map((p, i) => [p, r[i + 1]!]);

function bbox(r: Pos[]) {
  return {
    minX: Math.min(...r.map((p) => p[0])),
    maxX: Math.max(...r.map((p) => p[0])),
    minY: Math.min(...r.map((p) => p[1])),
    maxY: Math.max(...r.map((p) => p[1])),
  };
}

function polygonsOverlap(a: Pos[], b: Pos[]): boolean {
  const ba = bbox(a);
  const bb = bbox(b);
  if (ba.maxX < bb.minX || bb.maxX < ba.minX || ba.maxY < bb.minY || bb.maxY < ba.minY) return false;
  for (const [p, q] of edges(a)) for (const [r, s] of edges(b)) if (segmentsIntersect(p, q, r, s)) return true;
  return pointInRing(a[0]!, b) || pointInRing(b[0]!, a);
}

function lineCrossesRing(line: Pos[], r: Pos[]): boolean {
  for (let i = 0; i + 1 < line.length; i++) for (const [p, q] of edges(r)) if (segmentsIntersect(line[i]!, line[i + 1]!, p, q)) return true;
  return false;
}

/** FAO-56 daylight hours (eqs 24, 25, 34), written here again as an independent check. */
function daylightHours(latDeg: number, doy: number): number {
  const delta = 0.409 * Math.sin((2 * Math.PI * doy) / 365 - 1.39);
  const ws = Math.acos(-Math.tan(rad(latDeg)) * Math.tan(delta));
  return (24 / Math.PI) * ws;
}

function rectangleSides(r: Pos[]): { long: number; short: number; longBearing: number } {
  expect(r).toHaveLength(5);
  const [p0, p1, p2, p3] = r as [Pos, Pos, Pos, Pos];
  const a = distanceM(p0, p1);
  const b = distanceM(p1, p2);
  const c = distanceM(p2, p3);
  const d = distanceM(p3, p0);
  // Opposite sides equal and equal diagonals: a rectangle.
  expect(Math.abs(a - c) / a).toBeLessThan(0.005);
  expect(Math.abs(b - d) / b).toBeLessThan(0.005);
  const diag1 = distanceM(p0, p2);
  const diag2 = distanceM(p1, p3);
  expect(Math.abs(diag1 - diag2) / diag1).toBeLessThan(0.005);
  return a >= b ? { long: a, short: b, longBearing: bearingDeg(p0, p1) } : { long: b, short: a, longBearing: bearingDeg(p1, p2) };
}

/** Governing-body sizes (metres, long × short) of the rectangular sports. */
const RECT_SIZES: Partial<Record<Sport, [number, number][]>> = {
  soccer: [
    [105, 68], // full size (IFAB Law 1 range, common stadium size)
    [64, 46], // youth 9 v 9
    [50, 32], // youth 7 v 7
  ],
  football: [[380 * FT, 180 * FT]], // 360 × 160 ft plus a 10 ft border all round
  lacrosse: [[110 * YD, 60 * YD]],
  field_hockey: [[91.4, 55]],
};

const city = buildDemoCity();
const fieldsOf = (siteKey: string) => city.fields.filter((f) => f.siteKey === siteKey);
const siteOf = (f: DemoField) => city.sites.find((s) => s.key === f.siteKey)!;

describe('demo city', () => {
  test('should build the same city on every call', () => {
    expect(buildDemoCity()).toEqual(buildDemoCity());
    expect(JSON.stringify(buildDemoCity())).toBe(JSON.stringify(city));
  });

  test('should say it is invented and sit in open ocean at about 37.55° N, 66.40° W', () => {
    expect(city.city.note).toMatch(/invented/i);
    expect(city.city.center.lat).toBeCloseTo(37.55, 2);
    expect(city.city.center.lng).toBeCloseTo(-66.4, 2);
  });

  test('should have 3 districts, 20–30 sites, 50–70 fields, 2 crews per district and 2 stations', () => {
    expect(city.districts).toHaveLength(3);
    expect(city.sites.length).toBeGreaterThanOrEqual(20);
    expect(city.sites.length).toBeLessThanOrEqual(30);
    expect(city.fields.length).toBeGreaterThanOrEqual(50);
    expect(city.fields.length).toBeLessThanOrEqual(70);
    expect(city.weatherStations).toHaveLength(2);
    for (const d of city.districts) expect(city.crews.filter((c) => c.districtCode === d.code)).toHaveLength(2);
    expect(new Set(city.sites.map((s) => s.key)).size).toBe(city.sites.length);
    for (const s of city.sites) expect(fieldsOf(s.key).length).toBeGreaterThan(0);
  });

  test('should give districts valid boundaries that tile a city of about 10 × 8 km without overlapping', () => {
    for (const d of city.districts) expect(polygonSchema.safeParse(d.boundary).success).toBe(true);
    const totalKm2 = city.districts.reduce((sum, d) => sum + polygonAreaM2(d.boundary), 0) / 1e6;
    expect(totalKm2).toBeGreaterThan(75);
    expect(totalKm2).toBeLessThan(85);
    // Every sample point of the city's box lies in exactly one district.
    const all = city.districts.flatMap((d) => ring(d.boundary));
    const box = bbox(all);
    for (let i = 0; i < 23; i++)
      for (let j = 0; j < 19; j++) {
        const pt: Pos = [box.minX + ((i + 0.5) / 23) * (box.maxX - box.minX), box.minY + ((j + 0.5) / 19) * (box.maxY - box.minY)];
        expect(city.districts.filter((d) => pointInRing(pt, ring(d.boundary)))).toHaveLength(1);
      }
  });

  test('should put each yard, site and weather station inside the city and each yard and site in its own district', () => {
    for (const d of city.districts) expect(pointInRing([d.yard.lng, d.yard.lat], ring(d.boundary))).toBe(true);
    for (const s of city.sites) {
      const inside = city.districts.filter((d) => pointInRing([s.lng, s.lat], ring(d.boundary))).map((d) => d.code);
      expect(inside, s.key).toEqual([s.districtCode]);
    }
    for (const st of city.weatherStations)
      expect(city.districts.some((d) => pointInRing([st.lng, st.lat], ring(d.boundary)))).toBe(true);
    for (const d of city.districts) expect(city.sites.filter((s) => s.districtCode === d.code).length).toBeGreaterThanOrEqual(6);
  });

  test('should make schools campuses of the school district and parks and complexes city sites', () => {
    for (const s of city.sites) expect(s.owner).toBe(s.kind === 'school' ? 'school_district' : 'city');
    expect(city.sites.filter((s) => s.kind === 'school').length).toBeGreaterThanOrEqual(6);
    expect(city.sites.filter((s) => s.kind === 'complex').length).toBeGreaterThanOrEqual(2);
    for (const s of city.sites.filter((x) => x.kind === 'school')) expect(s.notes).toMatch(/School District/);
    for (const s of city.sites) expect(s.address).toMatch(/^\d+ \S.*, Sallowmere$/);
  });

  test('should give every field a record the field schema accepts', () => {
    for (const f of city.fields) {
      const { siteKey: _siteKey, ...rest } = f;
      const parsed = createFieldSchema.safeParse({ ...rest, siteId: 1 });
      expect(parsed.success, `${f.siteKey}/${f.name}: ${parsed.error?.message}`).toBe(true);
    }
    for (const s of city.sites) {
      const names = fieldsOf(s.key).map((f) => f.name);
      expect(new Set(names).size).toBe(names.length);
    }
  });

  test('should draw rectangular fields at their sport’s dimensions, area within 2 %', () => {
    let checked = 0;
    for (const f of city.fields) {
      const sizes = RECT_SIZES[f.sport];
      if (!sizes) continue;
      const { long, short } = rectangleSides(ring(f.geometry));
      const match = sizes.find(([L, W]) => Math.abs(long - L) / L < 0.01 && Math.abs(short - W) / W < 0.01);
      expect(match, `${f.siteKey}/${f.name} is ${long.toFixed(1)} × ${short.toFixed(1)} m`).toBeDefined();
      const [L, W] = match!;
      expect(Math.abs(polygonAreaM2(f.geometry) - L * W) / (L * W)).toBeLessThan(0.02);
      checked++;
    }
    expect(checked).toBeGreaterThanOrEqual(20);
    // A full-size soccer pitch is 105 × 68 m = 7140 m².
    const full = city.fields.filter((f) => f.sport === 'soccer' && Math.abs(polygonAreaM2(f.geometry) - 7140) / 7140 < 0.02);
    expect(full.length).toBeGreaterThanOrEqual(8);
  });

  test('should draw multi-use fields as rectangles of 0.3–0.7 ha', () => {
    const multi = city.fields.filter((f) => f.sport === 'multi_use');
    expect(multi.length).toBeGreaterThanOrEqual(3);
    for (const f of multi) {
      const { long, short } = rectangleSides(ring(f.geometry));
      expect(long).toBeGreaterThanOrEqual(60);
      expect(long).toBeLessThanOrEqual(110);
      expect(short).toBeGreaterThanOrEqual(40);
      expect(short).toBeLessThanOrEqual(70);
      const area = polygonAreaM2(f.geometry);
      expect(Math.abs(area - long * short) / (long * short)).toBeLessThan(0.02);
      expect(area).toBeGreaterThan(3000);
      expect(area).toBeLessThan(7000);
    }
  });

  test('should draw ball fields as fans: 325 ft (baseball) or 220 ft (softball) foul lines at a right angle', () => {
    const fans = city.fields.filter((f) => f.sport === 'baseball' || f.sport === 'softball');
    expect(fans.filter((f) => f.sport === 'baseball').length).toBeGreaterThanOrEqual(3);
    expect(fans.filter((f) => f.sport === 'softball').length).toBeGreaterThanOrEqual(3);
    for (const f of fans) {
      const r = ring(f.geometry);
      const home = r[0]!;
      const rightPole = r[1]!;
      const leftPole = r[r.length - 2]!;
      const foul = f.sport === 'baseball' ? 325 * FT : 220 * FT;
      expect(Math.abs(distanceM(home, rightPole) - foul) / foul).toBeLessThan(0.01);
      expect(Math.abs(distanceM(home, leftPole) - foul) / foul).toBeLessThan(0.01);
      expect(Math.abs(distanceM(leftPole, rightPole) - foul * Math.SQRT2) / (foul * Math.SQRT2)).toBeLessThan(0.01);
      const deepest = Math.max(...r.map((p) => distanceM(home, p)));
      if (f.sport === 'baseball') {
        expect(deepest).toBeGreaterThanOrEqual(foul * 0.99);
        expect(deepest).toBeLessThanOrEqual(410 * FT);
      } else {
        expect(deepest).toBeLessThan(foul * 1.01);
      }
      // Between the quarter circles of the foul line and of the deepest fence.
      const area = polygonAreaM2(f.geometry);
      expect(area).toBeGreaterThan((Math.PI / 4) * foul ** 2 * 0.98);
      expect(area).toBeLessThan((Math.PI / 4) * deepest ** 2 * 1.02);
    }
  });

  test('should draw park lawns as simple irregular polygons of 0.3–2 ha', () => {
    const lawns = city.fields.filter((f) => f.sport === 'lawn');
    expect(lawns.length).toBeGreaterThanOrEqual(6);
    for (const f of lawns) {
      const r = ring(f.geometry);
      expect(r.length).toBeGreaterThanOrEqual(9);
      const area = polygonAreaM2(f.geometry);
      expect(area).toBeGreaterThanOrEqual(3000 * 0.99);
      expect(area).toBeLessThanOrEqual(20000 * 1.01);
      const es = edges(r);
      for (let i = 0; i < es.length; i++)
        for (let j = i + 2; j < es.length; j++) {
          if (i === 0 && j === es.length - 1) continue; // neighbours through the closing point
          expect(segmentsIntersect(es[i]![0], es[i]![1], es[j]![0], es[j]![1]), `${f.siteKey}/${f.name} crosses itself`).toBe(false);
        }
    }
  });

  test('should keep every field near its site point and no two fields of a site overlapping', () => {
    for (const f of city.fields) {
      const s = siteOf(f);
      for (const p of ring(f.geometry)) expect(distanceM([s.lng, s.lat], p)).toBeLessThan(400);
    }
    for (const s of city.sites) {
      const fs = fieldsOf(s.key);
      for (let i = 0; i < fs.length; i++)
        for (let j = i + 1; j < fs.length; j++)
          expect(polygonsOverlap(ring(fs[i]!.geometry), ring(fs[j]!.geometry)), `${s.key}: ${fs[i]!.name} / ${fs[j]!.name}`).toBe(false);
    }
  });

  test('should detect an overlap with the same check when two fields do overlap', () => {
    const a = ring(city.fields[0]!.geometry);
    const shifted = a.map(([x, y]) => [x + 0.0001, y + 0.0001] as Pos); // about 9 m × 11 m away
    expect(polygonsOverlap(a, shifted)).toBe(true);
  });

  test('should run most long axes north–south and a few east–west', () => {
    const rects = city.fields.filter((f) => RECT_SIZES[f.sport] || f.sport === 'multi_use');
    const folded = rects.map((f) => rectangleSides(ring(f.geometry)).longBearing % 180);
    const northSouth = folded.filter((b) => b < 30 || b > 150).length;
    const eastWest = folded.filter((b) => b > 60 && b < 120).length;
    expect(northSouth / rects.length).toBeGreaterThan(0.7);
    expect(eastWest).toBeGreaterThanOrEqual(2);
  });

  test('should mix cool- and warm-season grasses, rootzones, irrigation, levels and statuses', () => {
    const grasses = new Set(city.fields.map((f) => f.grass));
    for (const g of ['tall_fescue', 'kentucky_bluegrass', 'perennial_ryegrass', 'bermudagrass', 'zoysiagrass'] as const) expect(grasses).toContain(g);
    const warm = city.fields.filter((f) => GRASS_SEASON[f.grass] === 'warm').length;
    expect(warm).toBeGreaterThanOrEqual(5);
    expect(city.fields.length - warm).toBeGreaterThanOrEqual(5);

    const native = city.fields.filter((f) => f.rootzone === 'native_soil').length;
    expect(native / city.fields.length).toBeGreaterThan(0.7);
    expect(city.fields.some((f) => f.rootzone === 'sand_based')).toBe(true);
    expect(city.fields.some((f) => f.rootzone === 'sand_capped')).toBe(true);
    for (const k of ['none', 'quick_coupler', 'automatic'] as const) expect(city.fields.some((f) => f.irrigation === k)).toBe(true);

    const showcase = city.fields.filter((f) => f.maintenanceLevel === 1);
    expect(showcase.length).toBeGreaterThanOrEqual(2);
    for (const f of showcase) {
      expect(f.clippings).toBe('removed');
      expect(siteOf(f).kind).toBe('complex');
    }
    for (const f of city.fields.filter((x) => x.maintenanceLevel === 4)) {
      expect(f.clippings).toBe('returned');
      expect(f.sport).toBe('lawn');
    }
    const community = city.fields.filter((f) => f.maintenanceLevel === 3).length;
    const competition = city.fields.filter((f) => f.maintenanceLevel === 2).length;
    expect(community).toBeGreaterThan(competition / 2);
    for (const f of city.fields.filter((x) => x.maintenanceLevel === 2)) expect(['complex', 'school']).toContain(siteOf(f).kind);

    const notOpen = city.fields.filter((f) => f.status !== 'open');
    expect(notOpen.some((f) => f.status === 'closed')).toBe(true);
    expect(notOpen.some((f) => f.status === 'restricted')).toBe(true);
    expect(notOpen.length).toBeLessThanOrEqual(8);
    for (const f of notOpen) expect(f.statusNote.length).toBeGreaterThan(10);
    for (const f of city.fields) {
      expect(f.weeklyUseHours).toBeGreaterThan(0);
      expect(f.weeklyUseHours).toBeLessThanOrEqual(40);
      if (f.hocOverrideMm !== null) {
        expect(f.hocOverrideMm).toBeGreaterThanOrEqual(10);
        expect(f.hocOverrideMm).toBeLessThanOrEqual(100);
      }
    }
  });

  test('should staff each crew with 2–4 people working 8–10 hours a day', () => {
    expect(new Set(city.crews.map((c) => c.name)).size).toBe(city.crews.length);
    for (const c of city.crews) {
      expect(c.hoursPerDay).toBeGreaterThanOrEqual(8);
      expect(c.hoursPerDay).toBeLessThanOrEqual(10);
      expect(c.members.length).toBeGreaterThanOrEqual(2);
      expect(c.members.length).toBeLessThanOrEqual(4);
      expect(city.districts.map((d) => d.code)).toContain(c.districtCode);
    }
  });

  test('should give every role its users with scopes that point at existing districts, crews and sites', () => {
    const count = (role: Role) => city.users.filter((u) => u.role === role).length;
    expect([count('admin'), count('head'), count('foreman'), count('crew'), count('partner')]).toEqual([1, 1, 3, 6, 3]);
    const districtCodes = new Set(city.districts.map((d) => d.code));
    const siteKeys = new Set(city.sites.map((s) => s.key));
    for (const u of city.users) {
      if (u.districtCode !== null) expect(districtCodes).toContain(u.districtCode);
      if (u.crewName !== null) expect(city.crews.find((c) => c.name === u.crewName)?.districtCode).toBe(u.districtCode);
      for (const k of u.siteKeys) expect(siteKeys).toContain(k);
      if (u.role === 'admin' || u.role === 'head') expect([u.districtCode, u.crewName, u.siteKeys]).toEqual([null, null, []]);
      if (u.role === 'foreman') expect([u.districtCode !== null, u.crewName, u.siteKeys]).toEqual([true, null, []]);
      if (u.role === 'crew') expect(u.crewName).not.toBeNull();
      if (u.role === 'partner') {
        expect(u.siteKeys.length).toBeGreaterThanOrEqual(1);
        expect(u.siteKeys.length).toBeLessThanOrEqual(3);
      }
    }
    // One foreman per district, one lead per crew.
    expect(new Set(city.users.filter((u) => u.role === 'foreman').map((u) => u.districtCode))).toEqual(districtCodes);
    expect(new Set(city.users.filter((u) => u.role === 'crew').map((u) => u.crewName))).toEqual(new Set(city.crews.map((c) => c.name)));
    // At least one partner sees only school campuses of a single district.
    const schoolOnly = city.users.filter((u) => {
      const ss = u.siteKeys.map((k) => city.sites.find((s) => s.key === k)!);
      return u.role === 'partner' && ss.length > 0 && ss.every((s) => s.kind === 'school') && new Set(ss.map((s) => s.districtCode)).size === 1;
    });
    expect(schoolOnly.length).toBeGreaterThanOrEqual(1);
  });

  test('should put every e-mail on swardwise.example and document one password per role', () => {
    const emails = city.users.map((u) => u.email);
    expect(new Set(emails).size).toBe(emails.length);
    for (const e of emails) {
      expect(z.email().safeParse(e).success).toBe(true);
      expect(e.endsWith('@swardwise.example')).toBe(true);
    }
    for (const u of city.users) expect(u.password).toBe(DEMO_PASSWORDS[u.role]);
    for (const role of ROLES) {
      expect(passwordSchema.safeParse(DEMO_PASSWORDS[role]).success).toBe(true);
      const signIn = DEMO_SIGN_INS[role];
      const u = city.users.find((x) => x.email === signIn.email);
      expect(u?.role).toBe(role);
      expect(u?.password).toBe(signIn.password);
      expect(city.users.find((x) => x.role === role)?.email).toBe(signIn.email);
    }
    expect(DEMO_SIGN_INS.admin.email).toBe('admin@swardwise.example');
    expect(DEMO_SIGN_INS.head.email).toBe('head@swardwise.example');
    expect(DEMO_SIGN_INS.foreman.email).toBe(`foreman.${city.districts[0]!.code}@swardwise.example`);
    expect(DEMO_SIGN_INS.crew.email).toMatch(/^crew\.[a-z0-9-]+@swardwise\.example$/);
    expect(DEMO_SIGN_INS.partner.email).toMatch(/^partner\.[a-z0-9-]+@swardwise\.example$/);
  });

  test('should give each station one physically consistent day for every date from 1 March to 30 November 2026', () => {
    for (const st of city.weatherStations) {
      const days = city.weather.filter((w) => w.stationCode === st.code);
      expect(days).toHaveLength(275);
      expect(days[0]!.date).toBe('2026-03-01');
      expect(days.at(-1)!.date).toBe('2026-11-30');
      days.forEach((w, i) => {
        const t = Date.parse(`${w.date}T00:00:00Z`);
        expect(t).toBe(Date.UTC(2026, 2, 1) + i * 86_400_000);
        const doy = Math.round((t - Date.UTC(2026, 0, 1)) / 86_400_000) + 1;
        expect(w.tminC).toBeLessThan(w.tmaxC);
        expect(w.tmaxC - w.tminC).toBeGreaterThanOrEqual(8 - 1e-9);
        expect(w.tmaxC - w.tminC).toBeLessThanOrEqual(14 + 1e-9);
        expect(w.rhMinPct).toBeGreaterThanOrEqual(0);
        expect(w.rhMinPct).toBeLessThanOrEqual(w.rhMaxPct);
        expect(w.rhMaxPct).toBeLessThanOrEqual(100);
        expect(w.windMs).toBeGreaterThanOrEqual(1);
        expect(w.windMs).toBeLessThanOrEqual(4);
        expect(w.sunshineH).toBeGreaterThanOrEqual(0);
        expect(w.sunshineH).toBeLessThanOrEqual(daylightHours(st.lat, doy));
        expect(w.rainMm).toBeGreaterThanOrEqual(0);
      });
    }
  });

  test('should make a transition-zone season: warm summer, cool shoulders, rain every 4–6 days', () => {
    for (const st of city.weatherStations) {
      const days = city.weather.filter((w) => w.stationCode === st.code);
      const meanOf = (month: string) => {
        const m = days.filter((w) => w.date.startsWith(`2026-${month}`));
        return m.reduce((s, w) => s + (w.tmaxC + w.tminC) / 2, 0) / m.length;
      };
      expect(meanOf('03')).toBeGreaterThan(2);
      expect(meanOf('03')).toBeLessThan(12);
      expect(meanOf('07')).toBeGreaterThan(21);
      expect(meanOf('07')).toBeLessThan(29);
      expect(meanOf('07') - meanOf('04')).toBeGreaterThan(6);
      expect(meanOf('07') - meanOf('11')).toBeGreaterThan(10);
      // Rain events: a wet day (≥ 1 mm) after a dry one.
      let events = 0;
      days.forEach((w, i) => {
        if (w.rainMm >= 1 && (i === 0 || days[i - 1]!.rainMm < 1)) events++;
      });
      const spacing = days.length / events;
      expect(spacing).toBeGreaterThanOrEqual(4);
      expect(spacing).toBeLessThanOrEqual(6.5);
      const total = days.reduce((s, w) => s + w.rainMm, 0);
      expect(total).toBeGreaterThan(500);
      expect(total).toBeLessThan(1300);
      const wetSun = days.filter((w) => w.rainMm >= 1).reduce((s, w) => s + w.sunshineH, 0) / days.filter((w) => w.rainMm >= 1).length;
      const drySun = days.filter((w) => w.rainMm === 0).reduce((s, w) => s + w.sunshineH, 0) / days.filter((w) => w.rainMm === 0).length;
      expect(wetSun).toBeLessThan(drySun);
    }
  });

  test('should ship a small offline basemap of streets, an expressway, the river, the lake and park outlines', () => {
    const bytes = Buffer.byteLength(JSON.stringify(city.basemap));
    expect(bytes).toBeLessThan(500_000);
    const feats = city.basemap.features;
    const kinds = (k: string) => feats.filter((f) => f.properties?.kind === k);
    expect(kinds('street').length).toBeGreaterThanOrEqual(10);
    expect(kinds('avenue').length).toBeGreaterThanOrEqual(2);
    expect(kinds('highway')).toHaveLength(1);
    expect(kinds('river')).toHaveLength(1);
    expect(kinds('lake')).toHaveLength(1);
    for (const f of [...kinds('street'), ...kinds('avenue'), ...kinds('highway')]) {
      expect(f.geometry.type).toBe('LineString');
      expect(typeof f.properties?.name).toBe('string');
    }
    const parks = kinds('park');
    expect(parks.map((p) => p.properties?.siteKey).sort()).toEqual(city.sites.map((s) => s.key).sort());
    for (const p of parks) {
      expect(p.geometry.type).toBe('Polygon');
      const outline = ring(p.geometry as Polygon);
      for (const f of fieldsOf(p.properties?.siteKey as string)) for (const v of ring(f.geometry)) expect(pointInRing(v, outline)).toBe(true);
    }
  });

  test('should keep park outlines clear of each other, the streets, the river and the lake', () => {
    const feats = city.basemap.features;
    const parks = feats.filter((f) => f.properties?.kind === 'park').map((f) => ring(f.geometry as Polygon));
    for (let i = 0; i < parks.length; i++) for (let j = i + 1; j < parks.length; j++) expect(polygonsOverlap(parks[i]!, parks[j]!)).toBe(false);
    const lines = feats
      .flatMap((f) => (f.geometry.type === 'LineString' ? [{ name: f.properties?.name as string, coords: f.geometry.coordinates as Pos[] }] : []));
    const lake = ring(feats.find((f) => f.properties?.kind === 'lake')!.geometry as Polygon);
    parks.forEach((park, i) => {
      for (const l of lines) expect(lineCrossesRing(l.coords, park), `${city.sites[i]?.key} × ${l.name}`).toBe(false);
      expect(polygonsOverlap(park, lake)).toBe(false);
    });
  });
});
