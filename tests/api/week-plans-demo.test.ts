/**
 * Week plan generation on the demo city: a warm midsummer week asks more mowings than a cool
 * early-spring week, and the mowing dates written for a field are the ones the turf engine
 * gives for that field and its station's weather.
 */
import { and, asc, eq, lte } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { addDaysIso, DEFAULT_TIME_ZONE, defineAbilityFor, greatCircleKm, planFieldWeek, prepareWeather, type Actor, type Level } from '@swardwise/domain';
import type { Database } from '../../apps/api/src/db/client.ts';
import { openTestDatabase } from '../support/app.ts';
import { districts, fields, sites, users, weatherDays, weatherStations, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { seedDemoCity } from '../../apps/api/src/db/seed/index.ts';
import { DepartmentClock } from '../../apps/api/src/services/clock.ts';
import { loadParameters, loadStandards } from '../../apps/api/src/services/standards.ts';
import { dailyWeatherOf } from '../../apps/api/src/services/weather.ts';
import { generateWeek } from '../../apps/api/src/services/week-plans.ts';

let database: Database;
let ctx: Parameters<typeof generateWeek>[0];
let districtId: number;
const WARM = '2026-07-13';
const COOL = '2026-03-23';

beforeAll(async () => {
  database = await openTestDatabase();
  await seedDemoCity(database.db);
  // The plan of weeks the seeded season already holds would keep that work: these tests ask
  // for the engine's own plan of an empty week.
  await database.db.delete(workOrders);
  const [d] = await database.db.select().from(districts).where(eq(districts.code, 'north'));
  districtId = d!.id;
  const [foreman] = await database.db.select().from(users).where(and(eq(users.role, 'foreman'), eq(users.districtId, districtId)));
  const actor: Actor = { id: foreman!.id, role: 'foreman', districtId, crewId: null, siteIds: [] };
  ctx = { db: database.db, actor, actorName: foreman!.name, ability: defineAbilityFor(actor), clock: new DepartmentClock(database.db, DEFAULT_TIME_ZONE) };
});
afterAll(() => database.close());

const mowsOf = async (weekStart: string) =>
  (await database.db.select().from(workOrders).where(and(eq(workOrders.districtId, districtId), eq(workOrders.weekStart, weekStart), eq(workOrders.task, 'mow')))).filter((o) => o.origin === 'generated');

describe('week plan on the demo city', () => {
  test('should ask more mowings in a warm week than in a cool one', async () => {
    await generateWeek(ctx, { districtId, weekStart: WARM, dryRun: false });
    await generateWeek(ctx, { districtId, weekStart: COOL, dryRun: false });
    const warm = await mowsOf(WARM);
    const cool = await mowsOf(COOL);
    expect(warm.length).toBeGreaterThan(cool.length);
    expect(warm.length).toBeGreaterThan(10);
  });

  test('should write the mowing dates the engine gives for a field and its weather', async () => {
    const warm = await mowsOf(WARM);
    const byField = new Map<number, string[]>();
    for (const o of warm) if (o.fieldId !== null) byField.set(o.fieldId, [...(byField.get(o.fieldId) ?? []), o.plannedDate].sort());
    const [fieldId, dates] = [...byField.entries()].sort((a, b) => b[1].length - a[1].length || a[0] - b[0])[0]!;
    const [f] = await database.db.select({ field: fields, lat: sites.lat, lng: sites.lng }).from(fields).innerJoin(sites, eq(sites.id, fields.siteId)).where(eq(fields.id, fieldId));
    // The nearest station and its unbroken run of days up to a week past Sunday, as the service reads it.
    const stations = await database.db.select().from(weatherStations);
    const station = stations.sort((a, b) => greatCircleKm(f!, a) - greatCircleKm(f!, b))[0]!;
    const rows = await database.db.select().from(weatherDays).where(and(eq(weatherDays.stationId, station.id), lte(weatherDays.date, addDaysIso(WARM, 13)))).orderBy(asc(weatherDays.date));
    const weather = prepareWeather(rows.map(dailyWeatherOf), { latDeg: station.lat, elevationM: station.elevationM, coastal: station.coastal === 1 });
    const { standards } = await loadStandards(database.db);
    const params = await loadParameters(database.db);
    const field = f!.field;
    const plan = planFieldWeek({
      field: {
        id: field.id,
        siteId: field.siteId,
        site: { lat: f!.lat, lng: f!.lng },
        sport: field.sport,
        grass: field.grass,
        areaM2: field.areaM2,
        geometry: field.geometry,
        maintenanceLevel: field.maintenanceLevel as Level,
        hocOverrideMm: field.hocOverrideMm,
        clippings: field.clippings,
        irrigation: field.irrigation,
        status: field.status,
        lastMowedOn: field.lastMowedOn,
        lastPaintedOn: null,
        lastFedOn: null,
        lastCheckedOn: null,
        events: [],
      },
      weather,
      weekStart: WARM,
      kept: [],
      workDays: ['mon', 'tue', 'wed', 'thu', 'fri'],
      standards,
      params,
    });
    const engineDates = plan.orders.filter((o) => o.task === 'mow').map((o) => o.askedDate);
    expect(engineDates.length).toBeGreaterThanOrEqual(2);
    expect(dates).toEqual(engineDates);
  });
});
