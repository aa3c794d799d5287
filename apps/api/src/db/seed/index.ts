/**
 * Seeds the invented demo city once: on first start of an empty database. Running it
 * again changes nothing (a marker row in `settings` records that it ran).
 */
import { eq } from 'drizzle-orm';
import { DEFAULT_PARAMETERS, DEFAULT_STANDARDS, DEFAULT_TIME_ZONE, LEVELS, addDaysIso, localToday, hocFor, hoursPerMowingPolygon, mondayOf, mowerTypeFor, weekdayOf, type Level } from '@swardwise/domain';
import type { Db } from '../client.ts';
import { crews, districts, equipment, fieldChecks, fieldEvents, fields, settings, sites, standards, users, userSites, weatherDays, weatherStations, workOrders } from '../schema/index.ts';
import { outlineFacts } from '../../services/fields.ts';
import { hashPassword } from '../../services/users.ts';
import { buildDemoCity, type DemoCity } from './demo-city.ts';
import { demoFieldEvents } from './demo-events.ts';
import { demoCheckRow, demoFieldHistory } from './demo-history.ts';
import { buildDemoSeason } from './demo-season.ts';
import { insertDemoSeason } from './demo-season-insert.ts';

/** Settings key of the row that records the demo city was seeded. */
export const DEMO_MARKER = 'demo_city';
const MARKER = DEMO_MARKER;

export interface SeedSummary {
  districts: number;
  sites: number;
  fields: number;
  crews: number;
  users: number;
  weatherDays: number;
  fieldChecks: number;
  workOrders: number;
  fieldEvents: number;
}

let demoCity: DemoCity | undefined;

/** True when this database holds the invented demo city (and so its published sign-ins). */
export async function hasDemoCity(db: Db): Promise<boolean> {
  const [marker] = await db.select({ key: settings.key }).from(settings).where(eq(settings.key, DEMO_MARKER));
  return Boolean(marker);
}

/**
 * Returns what was inserted, or null when the demo city (or any data) is already there.
 * `today` is the department's date (the server passes its clock's), `timeZone` its zone; the demo city's by default.
 */
export async function seedDemoCity(db: Db, today: string = localToday(DEFAULT_TIME_ZONE), timeZone: string = DEFAULT_TIME_ZONE): Promise<SeedSummary | null> {
  const [marker] = await db.select().from(settings).where(eq(settings.key, MARKER));
  if (marker) return null;
  const existing = await db.select({ id: districts.id }).from(districts).limit(1);
  if (existing.length) return null; // a real installation's data is never mixed with the demo

  // Built once per process (it is pure): tests make many fresh demo databases.
  const city = (demoCity ??= buildDemoCity());
  // The season of history up to yesterday and the coming week's forecast, laid around today.
  const season = buildDemoSeason(city, today);
  // One hash per distinct password: the demo shares a password per role.
  const hashes = new Map<string, string>();
  for (const password of new Set(city.users.map((u) => u.password))) hashes.set(password, await hashPassword(password));

  return db.transaction(async (tx) => {
    const { districtIds, siteIds } = await insertPlaces(tx, city);
    const { fieldIds, checks } = await insertFields(tx, city, season, today, siteIds);
    const weatherDayCount = await insertWeather(tx, city, season);
    const crewIds = await insertCrewsAndFleet(tx, city, districtIds);
    const crewUsers = await insertUsers(tx, city, hashes, { districtIds, siteIds, crewIds });
    const siteOf = new Map(city.sites.map((s) => [s.key, s]));
    const ids: SeedIds = { districtIds, siteIds, fieldIds, crewIds, siteOf };
    const orders = await insertStartingWork(tx, city, today, ids);
    const seasonRows = await insertDemoSeason(tx, city, season, {
      fieldIds,
      siteIdOf: (key) => siteIds.get(key)!,
      districtIdOf: (key) => districtIds.get(siteOf.get(key)!.districtCode)!,
      crewIdOf: (name) => crewIds.get(name)!,
      crewUserOf: (name) => crewUsers.get(name) ?? null,
    }, timeZone);
    const bookings = await insertBookings(tx, city, season, today, ids);

    const summary: SeedSummary = {
      districts: city.districts.length,
      sites: city.sites.length,
      fields: city.fields.length,
      crews: city.crews.length,
      users: city.users.length,
      weatherDays: weatherDayCount,
      fieldChecks: checks + seasonRows.fieldChecks,
      workOrders: orders + seasonRows.workOrders,
      fieldEvents: bookings,
    };
    await tx.insert(settings).values({ key: MARKER, value: { seededAt: new Date().toISOString(), note: city.city.note, ...summary } });
    return summary;
  });
}

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
type Season = ReturnType<typeof buildDemoSeason>;
/** Ids of the rows inserted, by the demo's own keys (codes, site keys, crew names). */
interface SeedIds {
  districtIds: Map<string, number>;
  siteIds: Map<string, number>;
  fieldIds: number[];
  crewIds: Map<string, number>;
  siteOf: Map<string, DemoCity['sites'][number]>;
}

/** Districts, sites and the Standards the department starts from (the head edits them in the portal). */
async function insertPlaces(tx: Tx, city: DemoCity): Promise<Pick<SeedIds, 'districtIds' | 'siteIds'>> {
  const districtIds = new Map<string, number>();
  for (const d of city.districts) {
    const [row] = await tx
      .insert(districts)
      .values({ code: d.code, name: d.name, boundary: d.boundary, yardName: d.yard.name, yardLat: d.yard.lat, yardLng: d.yard.lng })
      .returning({ id: districts.id });
    districtIds.set(d.code, row!.id);
  }
  const siteIds = new Map<string, number>();
  const siteRows = await tx
    .insert(sites)
    .values(
      city.sites.map((s) => ({
        districtId: districtIds.get(s.districtCode)!,
        name: s.name,
        kind: s.kind,
        owner: s.owner,
        address: s.address,
        lat: s.lat,
        lng: s.lng,
        notes: s.notes,
      })),
    )
    .returning({ id: sites.id });
  city.sites.forEach((s, i) => siteIds.set(s.key, siteRows[i]!.id));

  await tx.insert(standards).values(LEVELS.map((level) => ({ level, data: DEFAULT_STANDARDS[level] })));

  return { districtIds, siteIds };
}

/** The fields, and the invented field checks of the season so far (none dated today or later), scored by the engine as a real check would be. */
async function insertFields(tx: Tx, city: DemoCity, season: Season, today: string, siteIds: Map<string, number>): Promise<{ fieldIds: number[]; checks: number }> {
  const history = demoFieldHistory(city);
  const fieldRows = await tx.insert(fields).values(
    city.fields.map((f, i) => ({
      siteId: siteIds.get(f.siteKey)!,
      name: f.name,
      sport: f.sport,
      grass: f.grass,
      rootzone: f.rootzone,
      irrigation: f.irrigation,
      maintenanceLevel: f.maintenanceLevel,
      hocOverrideMm: f.hocOverrideMm,
      clippings: f.clippings,
      status: f.status,
      statusNote: f.statusNote,
      weeklyUseHours: f.weeklyUseHours,
      geometry: f.geometry,
      ...outlineFacts(f.geometry),
      lastMowedOn: season.lastMowedOn[i] ?? history[i]!.lastMowedOn,
    })),
  ).returning({ id: fields.id });

  const checks = city.fields.flatMap((f, i) =>
    history[i]!.checks.filter((c) => c.checkedOn >= season.window.start && c.checkedOn < today).map((c) => {
      const hocMm = hocFor({ ...f, maintenanceLevel: f.maintenanceLevel as Level }, DEFAULT_STANDARDS);
      return demoCheckRow(fieldRows[i]!.id, c, hocMm, c.heightRatio * hocMm);
    }),
  );
  if (checks.length) await tx.insert(fieldChecks).values(checks);

  return { fieldIds: fieldRows.map((r) => r.id), checks: checks.length };
}

/** The weather stations, their days of the season and the forecast, and the base map. */
async function insertWeather(tx: Tx, city: DemoCity, season: Season): Promise<number> {
  const stationIds = new Map<string, number>();
  for (const st of city.weatherStations) {
    const [row] = await tx
      .insert(weatherStations)
      .values({ code: st.code, name: st.name, lat: st.lat, lng: st.lng, elevationM: st.elevationM })
      .returning({ id: weatherStations.id });
    stationIds.set(st.code, row!.id);
  }
  const days = season.weather.map((w) => ({
    stationId: stationIds.get(w.stationCode)!,
    date: w.date,
    kind: w.kind,
    tmaxC: w.tmaxC,
    tminC: w.tminC,
    rhMaxPct: w.rhMaxPct,
    rhMinPct: w.rhMinPct,
    windMs: w.windMs,
    sunshineH: w.sunshineH,
    rainMm: w.rainMm,
    source: 'demo',
  }));
  for (let i = 0; i < days.length; i += 500) await tx.insert(weatherDays).values(days.slice(i, i + 500));
  await tx.insert(settings).values({ key: 'basemap', value: city.basemap });

  return days.length;
}

/** The crews, and an invented fleet: each crew has a reel and a rotary mower; each district a flail mower, a line marker and a spreader in its yard pool. */
async function insertCrewsAndFleet(tx: Tx, city: DemoCity, districtIds: Map<string, number>): Promise<Map<string, number>> {
  const crewIds = new Map<string, number>();
  for (const c of city.crews) {
    const [row] = await tx
      .insert(crews)
      .values({ districtId: districtIds.get(c.districtCode)!, name: c.name, hoursPerDay: c.hoursPerDay, members: c.members })
      .returning({ id: crews.id });
    crewIds.set(c.name, row!.id);
  }

  const fleet: (typeof equipment.$inferInsert)[] = [];
  for (const d of city.districts) {
    const code = d.code.slice(0, 2).toUpperCase();
    const districtId = districtIds.get(d.code)!;
    city.crews
      .filter((c) => c.districtCode === d.code)
      .forEach((c, k) => {
        const crewId = crewIds.get(c.name)!;
        fleet.push(
          { districtId, crewId, kind: 'reel_mower', name: `${code}-R${k + 1} triplex reel`, cuttingWidthM: 2.8, speedKmh: 6, fieldEfficiency: 0.8, hocMinMm: 6.35, hocMaxMm: 38.1, hourMeterH: 410 + k * 95, sharpenIntervalH: 100, lastSharpenedAtH: 330 + k * 95 },
          { districtId, crewId, kind: 'rotary_mower', name: `${code}-M${k + 1} 72-inch rotary`, cuttingWidthM: 1.83, speedKmh: 8, fieldEfficiency: 0.8, hocMinMm: 25.4, hocMaxMm: 127, hourMeterH: 620 + k * 40, sharpenIntervalH: 50, lastSharpenedAtH: 600 + k * 40 },
        );
      });
    fleet.push(
      { districtId, kind: 'flail_mower', name: `${code}-F1 flail`, cuttingWidthM: 2.2, speedKmh: 7, fieldEfficiency: 0.75, hocMinMm: 38.1, hocMaxMm: 152.4, hourMeterH: 280 },
      { districtId, kind: 'line_marker', name: `${code}-L1 line marker`, hourMeterH: 120 },
      { districtId, kind: 'spreader', name: `${code}-S1 rotary spreader`, hourMeterH: 60 },
    );
  }
  await tx.insert(equipment).values(fleet);

  return crewIds;
}

/** The demo's people (one hash per distinct password); returns each crew's first user, its crew lead. */
async function insertUsers(tx: Tx, city: DemoCity, hashes: Map<string, string>, ids: Pick<SeedIds, 'districtIds' | 'siteIds' | 'crewIds'>): Promise<Map<string, number>> {
  const { districtIds, siteIds, crewIds } = ids;
  const crewUsers = new Map<string, number>();
  for (const u of city.users) {
    const [row] = await tx
      .insert(users)
      .values({
        email: u.email,
        name: u.name,
        role: u.role,
        passwordHash: hashes.get(u.password)!,
        districtId: u.districtCode ? districtIds.get(u.districtCode)! : null,
        crewId: u.crewName ? crewIds.get(u.crewName)! : null,
      })
      .returning({ id: users.id });
    if (u.crewName && !crewUsers.has(u.crewName)) crewUsers.set(u.crewName, row!.id);
    if (u.siteKeys.length) {
      await tx.insert(userSites).values(u.siteKeys.map((key) => ({ userId: row!.id, siteId: siteIds.get(key)! })));
    }
  }

  return crewUsers;
}

/**
 * A few days of invented mowing work per crew from the day of seeding, so crew leads have work
 * (and the fields of it) to see; the foreman's week plan takes over from here.
 */
async function insertStartingWork(tx: Tx, city: DemoCity, today: string, ids: SeedIds): Promise<number> {
  const { districtIds, siteIds, fieldIds, crewIds, siteOf } = ids;
  const crewsByDistrict = new Map<string, number[]>();
  for (const c of city.crews) crewsByDistrict.set(c.districtCode, [...(crewsByDistrict.get(c.districtCode) ?? []), crewIds.get(c.name)!]);
  // The next five working days (Monday to Friday) from the day of seeding.
  const workDays: string[] = [];
  for (let d = today; workDays.length < 5; d = addDaysIso(d, 1)) if (!['sat', 'sun'].includes(weekdayOf(d))) workDays.push(d);
  const perDistrict = new Map<string, number>();
  const orders = city.fields.flatMap((f, i) => {
    const site = siteOf.get(f.siteKey)!;
    const districtCrews = crewsByDistrict.get(site.districtCode) ?? [];
    if (!districtCrews.length || f.status === 'closed') return [];
    const n = perDistrict.get(site.districtCode) ?? 0;
    perDistrict.set(site.districtCode, n + 1);
    const hocMm = hocFor({ ...f, maintenanceLevel: f.maintenanceLevel as Level }, DEFAULT_STANDARDS);
    const mower = DEFAULT_PARAMETERS.mowers[mowerTypeFor(hocMm, DEFAULT_PARAMETERS.mowerSettings)];
    return [
      {
        fieldId: fieldIds[i]!,
        siteId: siteIds.get(f.siteKey)!,
        districtId: districtIds.get(site.districtCode)!,
        task: 'mow' as const,
        weekStart: mondayOf(workDays[n % 5]!),
        plannedDate: workDays[n % 5]!,
        crewId: districtCrews[n % districtCrews.length]!,
        plannedHours: Math.round(hoursPerMowingPolygon(f.geometry, mower) * 100) / 100,
        status: 'assigned' as const,
        origin: 'manual' as const,
        pinned: true,
        reason: 'Demo work (invented) seeded with the city',
        details: { hocMm, mower: mower.kind },
      },
    ];
  });
  if (orders.length) await tx.insert(workOrders).values(orders);
  return orders.length;
}

/** Invented games, tournaments and practices across the season and around today; a field closed for a day after a storm is kept as a booking of the day ("other"). */
async function insertBookings(tx: Tx, city: DemoCity, season: Season, today: string, ids: SeedIds): Promise<number> {
  const { districtIds, siteIds, fieldIds, siteOf } = ids;
  const closures = season.closures.map((c) => ({ fieldIndex: c.fieldIndex, kind: 'other' as const, title: c.title, startsOn: c.startsOn, startTime: null, notes: c.notes }));
  const closedDays = new Set(closures.map((c) => `${c.fieldIndex}:${c.startsOn}`));
  const booked = demoFieldEvents(city, today, season).filter((e) => !closedDays.has(`${e.fieldIndex}:${e.startsOn}`));
  const bookings = [...booked, ...closures].map((e) => {
    const f = city.fields[e.fieldIndex]!;
    return {
      fieldId: fieldIds[e.fieldIndex]!,
      siteId: siteIds.get(f.siteKey)!,
      districtId: districtIds.get(siteOf.get(f.siteKey)!.districtCode)!,
      kind: e.kind,
      title: e.title,
      startsOn: e.startsOn,
      startTime: e.startTime,
      notes: e.notes,
    };
  });
  for (let i = 0; i < bookings.length; i += 500) await tx.insert(fieldEvents).values(bookings.slice(i, i + 500));

  return bookings.length;
}
