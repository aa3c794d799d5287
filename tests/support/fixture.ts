/**
 * A small city built row by row for API tests: two districts, three sites, four fields,
 * two crews and one user per role (plus a second foreman and a deactivated account).
 */
import { addDaysIso, DEFAULT_STANDARDS, DEFAULT_TIME_ZONE, LEVELS, localToday, type CreateFieldInput, type Polygon, type Role } from '@swardwise/domain';
import type { Db } from '../../apps/api/src/db/client.ts';
import { eq } from 'drizzle-orm';
import { crews, districts, equipment, fields, sites, standards, users, userSites, weatherDays, weatherStations, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { hashPassword } from '../../apps/api/src/services/users.ts';
import { polygonAreaM2 } from '@swardwise/domain';

export const PASSWORD = 'correct-horse-42';

/** A closed ring around the box of `dLat` × `dLng` degrees with its south-west corner at (lat, lng). */
function box(lat: number, lng: number, dLat: number, dLng: number): Polygon {
  return { type: 'Polygon', coordinates: [[[lng, lat], [lng + dLng, lat], [lng + dLng, lat + dLat], [lng, lat + dLat], [lng, lat]]] };
}

/** A rectangle of `widthM` × `lengthM` metres with its south-west corner at (lat, lng), long axis north–south. */
export function rectangle(lat: number, lng: number, widthM: number, lengthM: number): Polygon {
  // Metres per degree on the WGS84 ellipsoid at this latitude (the usual series expansion).
  const phi = (lat * Math.PI) / 180;
  const mPerDegLat = 111_132.92 - 559.82 * Math.cos(2 * phi) + 1.175 * Math.cos(4 * phi);
  const mPerDegLng = 111_412.84 * Math.cos(phi) - 93.5 * Math.cos(3 * phi);
  return box(lat, lng, lengthM / mPerDegLat, widthM / mPerDegLng);
}

const square = (lat: number, lng: number, sizeDeg: number) => box(lat, lng, sizeDeg, sizeDeg);

/** The body of `POST /api/fields` for an invented field: a soccer pitch of tall fescue on native soil unless `overrides` say otherwise. */
export function fieldBody(siteId: number, name: string, geometry: Polygon, overrides: Partial<CreateFieldInput> = {}) {
  return { siteId, name, sport: 'soccer', grass: 'tall_fescue', rootzone: 'native_soil', irrigation: 'none', maintenanceLevel: 3, clippings: 'returned', geometry, ...overrides };
}

export interface Fixture {
  districts: { north: number; south: number };
  sites: { northPark: number; northSchool: number; southPark: number };
  fields: { northSoccer: number; northLawn: number; northSchoolFootball: number; southBaseball: number };
  crews: { north: number; south: number };
  users: Record<'admin' | 'head' | 'foreman' | 'foremanSouth' | 'crew' | 'partner' | 'inactive', { id: number; email: string; role: Role }>;
  /** One station with daily weather from `weather.start` to `weather.end` (a few weeks of late spring). */
  weather: { stationId: number; start: string; end: string };
}

/** Weather of the test city: a few weeks of invented, steadily warming late-spring days. */
const FIXTURE_WEATHER = { start: '2026-05-04', days: 35 } as const;

export async function buildFixture(db: Db): Promise<Fixture> {
  const [north] = await db
    .insert(districts)
    .values({ code: 'north', name: 'Test North', boundary: square(37.6, -66.5, 0.05), yardName: 'North yard', yardLat: 37.61, yardLng: -66.49 })
    .returning();
  const [south] = await db
    .insert(districts)
    .values({ code: 'south', name: 'Test South', boundary: square(37.5, -66.5, 0.05), yardName: 'South yard', yardLat: 37.51, yardLng: -66.49 })
    .returning();

  const site = async (districtId: number, name: string, kind: 'park' | 'school', lat: number, lng: number) => {
    const [row] = await db
      .insert(sites)
      .values({ districtId, name, kind, owner: kind === 'school' ? 'school_district' : 'city', address: '', lat, lng })
      .returning();
    return row!.id;
  };
  const northPark = await site(north!.id, 'Test Park North', 'park', 37.62, -66.48);
  const northSchool = await site(north!.id, 'Test High School', 'school', 37.63, -66.47);
  const southPark = await site(south!.id, 'Test Park South', 'park', 37.52, -66.48);

  const field = async (siteId: number, name: string, sport: 'soccer' | 'lawn' | 'football' | 'baseball', geometry: Polygon, level: 1 | 2 | 3 | 4) => {
    const [row] = await db
      .insert(fields)
      .values({
        siteId,
        name,
        sport,
        grass: 'tall_fescue',
        rootzone: 'native_soil',
        irrigation: 'automatic',
        maintenanceLevel: level,
        clippings: 'returned',
        geometry,
        areaM2: polygonAreaM2(geometry),
      })
      .returning();
    return row!.id;
  };
  const northSoccer = await field(northPark, 'Soccer 1', 'soccer', rectangle(37.62, -66.48, 68, 105), 2);
  const northLawn = await field(northPark, 'Great Lawn', 'lawn', rectangle(37.621, -66.478, 80, 60), 4);
  const northSchoolFootball = await field(northSchool, 'Stadium', 'football', rectangle(37.63, -66.47, 48.8, 109.7), 1);
  const southBaseball = await field(southPark, 'Diamond', 'baseball', rectangle(37.52, -66.48, 100, 100), 3);

  const [crewNorth] = await db.insert(crews).values({ districtId: north!.id, name: 'North Crew', hoursPerDay: 8, members: ['A. Tester'] }).returning();
  const [crewSouth] = await db.insert(crews).values({ districtId: south!.id, name: 'South Crew', hoursPerDay: 8, members: [] }).returning();

  const passwordHash = await hashPassword(PASSWORD);
  const user = async (key: string, role: Role, scope: { districtId?: number; crewId?: number; active?: boolean } = {}) => {
    const email = `${key.toLowerCase()}@test.example`;
    const [row] = await db
      .insert(users)
      .values({ email, name: `Test ${key}`, role, passwordHash, districtId: scope.districtId ?? null, crewId: scope.crewId ?? null, active: scope.active ?? true })
      .returning();
    return { id: row!.id, email, role };
  };
  const admin = await user('admin', 'admin');
  const head = await user('head', 'head');
  const foreman = await user('foreman', 'foreman', { districtId: north!.id });
  const foremanSouth = await user('foremanSouth', 'foreman', { districtId: south!.id });
  const crew = await user('crew', 'crew', { districtId: north!.id, crewId: crewNorth!.id });
  const partner = await user('partner', 'partner');
  await db.insert(userSites).values({ userId: partner.id, siteId: northSchool });
  const inactive = await user('inactive', 'foreman', { districtId: north!.id, active: false });

  // The four levels of the Standards as a new installation starts with them.
  await db.insert(standards).values(LEVELS.map((level) => ({ level, data: DEFAULT_STANDARDS[level] })));
  const [station] = await db.insert(weatherStations).values({ code: 'test-wx', name: 'Test Weather', lat: 37.58, lng: -66.48, elevationM: 120 }).returning();
  const weather = Array.from({ length: FIXTURE_WEATHER.days }, (_, i) => ({
    stationId: station!.id,
    date: addDaysIso(FIXTURE_WEATHER.start, i),
    kind: 'observed' as const,
    tmaxC: 22 + i * 0.15 + (i % 3),
    tminC: 11 + i * 0.1,
    rhMaxPct: 88,
    rhMinPct: 45,
    windMs: 2,
    sunshineH: 9,
    rainMm: i % 6 === 0 ? 12 : 0,
    source: 'test',
  }));
  await db.insert(weatherDays).values(weather);

  return {
    weather: { stationId: station!.id, start: FIXTURE_WEATHER.start, end: addDaysIso(FIXTURE_WEATHER.start, FIXTURE_WEATHER.days - 1) },
    districts: { north: north!.id, south: south!.id },
    sites: { northPark, northSchool, southPark },
    fields: { northSoccer, northLawn, northSchoolFootball, southBaseball },
    crews: { north: crewNorth!.id, south: crewSouth!.id },
    users: { admin, head, foreman, foremanSouth, crew, partner, inactive },
  };
}

/** Gives a crew a work order on a field (a mowing, `daysFromToday` from the department's today in the default zone the test API uses). */
export async function giveWork(db: Db, fieldId: number, crewId: number, daysFromToday = 0): Promise<number> {
  const today = localToday(DEFAULT_TIME_ZONE);
  const [field] = await db
    .select({ siteId: fields.siteId, districtId: sites.districtId })
    .from(fields)
    .innerJoin(sites, eq(sites.id, fields.siteId))
    .where(eq(fields.id, fieldId));
  const [row] = await db
    .insert(workOrders)
    .values({
      fieldId,
      siteId: field!.siteId,
      districtId: field!.districtId,
      task: 'mow',
      weekStart: today,
      plannedDate: addDaysIso(today, daysFromToday),
      crewId,
      plannedHours: 1,
      status: 'assigned',
      origin: 'manual',
    })
    .returning({ id: workOrders.id });
  return row!.id;
}

/** Adds a unit of equipment (its district, kind and name, and what else `values` sets) and answers its id. */
export async function addEquipment(db: Db, values: typeof equipment.$inferInsert): Promise<number> {
  const [row] = await db.insert(equipment).values(values).returning({ id: equipment.id });
  return row!.id;
}

/** Adds a crew to a district (for tests that need two crews in one district). */
export async function addCrew(db: Db, districtId: number, name: string): Promise<number> {
  const [row] = await db.insert(crews).values({ districtId, name, hoursPerDay: 8, members: [] }).returning({ id: crews.id });
  return row!.id;
}

/** Adds an active user who signs in with `PASSWORD` (see `TestApi.signInAs`). */
export async function addUser(
  db: Db,
  key: string,
  role: Role,
  scope: { districtId?: number; crewId?: number; siteIds?: number[] } = {},
): Promise<{ id: number; email: string; role: Role }> {
  const email = `${key.toLowerCase()}@test.example`;
  const [row] = await db
    .insert(users)
    .values({ email, name: `Test ${key}`, role, passwordHash: await hashPassword(PASSWORD), districtId: scope.districtId ?? null, crewId: scope.crewId ?? null })
    .returning({ id: users.id });
  if (scope.siteIds?.length) await db.insert(userSites).values(scope.siteIds.map((siteId) => ({ userId: row!.id, siteId })));
  return { id: row!.id, email, role };
}
