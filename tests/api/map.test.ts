import { eq } from 'drizzle-orm';
import { pino } from 'pino';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { DEFAULT_PARAMETERS, DEFAULT_STANDARDS, LEVELS, addDaysIso, dailyGrowthMm, hocFor, levelIntervalDays } from '@swardwise/domain';
import { createApp } from '../../apps/api/src/app.ts';
import { loadConfig } from '../../apps/api/src/config.ts';
import { createMailer } from '../../apps/api/src/mail/mailer.ts';
import { fieldChecks, fields, settings, standards, weatherDays, weatherStations } from '../../apps/api/src/db/schema/index.ts';
import { fieldBody, giveWork, rectangle, PASSWORD } from '../support/fixture.ts';
import { startTestApi, type TestApi } from '../support/app.ts';

let api: TestApi;

// A station beside the fixture city with 61 days at a mean of 20 °C (GP = 1 for cool-season grass).
const WEATHER_FIRST = '2026-06-01';
const WEATHER_LAST = '2026-07-31';

beforeAll(async () => {
  api = await startTestApi();
  const { db } = api.database;
  await db.insert(standards).values(LEVELS.map((level) => ({ level, data: DEFAULT_STANDARDS[level] }))).onConflictDoNothing();
  const [near] = await db.insert(weatherStations).values({ code: 'near', name: 'Near', lat: 37.61, lng: -66.48, elevationM: 10 }).returning();
  // A second station far away whose weather would never make grass grow: picking it would fail the overdue checks.
  const [far] = await db.insert(weatherStations).values({ code: 'far', name: 'Far', lat: 40, lng: -70, elevationM: 10 }).returning();
  const days = [];
  for (let d = WEATHER_FIRST; d <= WEATHER_LAST; d = addDaysIso(d, 1)) {
    days.push({ stationId: near!.id, date: d, kind: 'observed' as const, tmaxC: 26, tminC: 14, source: 'test' });
    days.push({ stationId: far!.id, date: d, kind: 'observed' as const, tmaxC: -10, tminC: -20, source: 'test' });
  }
  await db.insert(weatherDays).values(days);
  await db.insert(settings).values({ key: 'basemap', value: { type: 'FeatureCollection', features: [{ type: 'Feature', properties: { kind: 'lake' }, geometry: null }] } });
});
afterAll(() => api.close());

const ids = (res: { body: { fields: { id: number }[] } }) => res.body.fields.map((f) => f.id).sort((a, b) => a - b);
type MapFieldBody = { id: number; checkDueOn: string | null; checkState: string; mowDueOn: string | null; mowDueState: string; mowWaitingForGrowth: boolean; overdue: boolean | null; overdueSince: string | null; daysSinceMowing: number | null; predictedHeightMm: number | null; hocMm: number; score: number | null; eastWest: boolean };
const fieldOf = (res: { body: { fields: MapFieldBody[] } }, id: number) => res.body.fields.find((f) => f.id === id)!;

describe('GET /api/map', () => {
  test('should refuse a caller who is not signed in', async () => {
    const res = await supertest(api.app).get('/api/map');
    expect(res.status).toBe(401);
    expect((await supertest(api.app).get('/api/map/basemap')).status).toBe(401);
  });

  test('should show the head every district, site and field', async () => {
    const agent = await api.signIn('head');
    const res = await agent.get('/api/map?asOf=2026-07-01');
    expect(res.status).toBe(200);
    expect(ids(res)).toEqual(Object.values(api.fixture.fields).sort((a, b) => a - b));
    expect(res.body.sites).toHaveLength(3);
    expect(res.body.districts.map((d: { id: number }) => d.id).sort()).toEqual([api.fixture.districts.north, api.fixture.districts.south].sort());
    expect(res.body.districts[0].boundary.type).toBe('Polygon');
    expect(res.body.fields[0].geometry.type).toBe('Polygon');
  });

  test('should show a foreman his district and a crew lead only the fields of his crew’s work', async () => {
    const { fields: f, districts, sites } = api.fixture;
    const foreman = await (await api.signIn('foreman')).get('/api/map?asOf=2026-07-01');
    expect(ids(foreman)).toEqual([f.northSoccer, f.northLawn, f.northSchoolFootball].sort((a, b) => a - b));
    expect(foreman.body.districts.map((d: { id: number }) => d.id)).toEqual([districts.north]);
    expect(foreman.body.sites.map((s: { id: number }) => s.id).sort()).toEqual([sites.northPark, sites.northSchool].sort());
    const crew = await api.signIn('crew');
    expect(ids(await crew.get('/api/map?asOf=2026-07-01'))).toEqual([]);
    await giveWork(api.database.db, f.northLawn, api.fixture.crews.north, 1);
    await giveWork(api.database.db, f.northSoccer, api.fixture.crews.south, 0);
    expect(ids(await crew.get('/api/map?asOf=2026-07-01'))).toEqual([f.northLawn]);
  });

  test('should show a partner only the fields of his own site and no district', async () => {
    const res = await (await api.signIn('partner')).get('/api/map?asOf=2026-07-01');
    expect(ids(res)).toEqual([api.fixture.fields.northSchoolFootball]);
    expect(res.body.sites.map((s: { id: number }) => s.id)).toEqual([api.fixture.sites.northSchool]);
    expect(res.body.districts).toEqual([]);
  });

  test('should flag a field mowed long ago as overdue from the engine and give the day it passed 1.5 × HOC', async () => {
    const { db } = api.database;
    const id = api.fixture.fields.northSoccer;
    await db.update(fields).set({ lastMowedOn: '2026-06-01' }).where(eq(fields.id, id));
    const res = await (await api.signIn('head')).get('/api/map?asOf=2026-06-20');
    const f = fieldOf(res, id);
    // Level 2 soccer on tall fescue; 5 mm/day at GP = 1 (20 °C mean).
    const hoc = hocFor({ sport: 'soccer', grass: 'tall_fescue', maintenanceLevel: 2 }, DEFAULT_STANDARDS);
    const perDay = dailyGrowthMm(DEFAULT_PARAMETERS.maxGrowthMmPerDay.tall_fescue, 20, 'cool');
    const daysToTrigger = Math.floor((0.5 * hoc) / perDay) + 1;
    expect(f.hocMm).toBeCloseTo(hoc, 1);
    expect(f.daysSinceMowing).toBe(19);
    expect(f.predictedHeightMm).toBeCloseTo(hoc + 19 * perDay, 0);
    expect(f.overdue).toBe(true);
    expect(f.overdueSince).toBe(addDaysIso('2026-06-01', daysToTrigger));
  });

  test('should not flag a field mowed on the day the map describes, nor one mowed a day earlier', async () => {
    const { db } = api.database;
    const { northLawn, northSchoolFootball } = api.fixture.fields;
    await db.update(fields).set({ lastMowedOn: '2026-06-20' }).where(eq(fields.id, northLawn));
    await db.update(fields).set({ lastMowedOn: '2026-06-19' }).where(eq(fields.id, northSchoolFootball));
    const res = await (await api.signIn('head')).get('/api/map?asOf=2026-06-20');
    expect(fieldOf(res, northLawn)).toMatchObject({ overdue: false, overdueSince: null, daysSinceMowing: 0 });
    expect(fieldOf(res, northSchoolFootball)).toMatchObject({ overdue: false, daysSinceMowing: 1 });
    // The same lawn left unmown to the end of the weather turns overdue.
    await db.update(fields).set({ lastMowedOn: '2026-06-01' }).where(eq(fields.id, northLawn));
    const later = await (await api.signIn('head')).get('/api/map?asOf=2026-07-31');
    expect(fieldOf(later, northLawn).overdue).toBe(true);
  });

  test('should fall back to the latest day with weather and say so', async () => {
    const res = await (await api.signIn('head')).get('/api/map?asOf=2026-12-01');
    expect(res.body.asOf).toBe(WEATHER_LAST);
    expect(res.body.requested).toBe('2026-12-01');
    expect(res.body.weatherNote).toContain('No weather after Jul 31, 2026');
    expect(res.body.weatherNote).not.toMatch(/\d{4}-\d{2}-\d{2}/);
    const inSeason = await (await api.signIn('head')).get('/api/map?asOf=2026-07-01');
    expect(inSeason.body.asOf).toBe('2026-07-01');
  });

  test('should give the latest surface score of each field', async () => {
    const { db } = api.database;
    const id = api.fixture.fields.southBaseball;
    const base = { fieldId: id, turfCoverPct: 90, weedsPct: 2, barePct: 3 };
    await db.insert(fieldChecks).values([
      { ...base, checkedOn: '2026-05-01', score: 61 },
      { ...base, checkedOn: '2026-06-15', score: 84.5 },
      { ...base, checkedOn: '2026-04-01', score: 40 },
    ]);
    const res = await (await api.signIn('head')).get('/api/map?asOf=2026-07-01');
    expect(fieldOf(res, id).score).toBe(84.5);
    expect(fieldOf(res, api.fixture.fields.northLawn).score).toBeNull();
  });

  test('should flag a field check overdue once the level\u2019s interval has passed, and give the next mowing by the one mowing policy', async () => {
    const { db } = api.database;
    const id = api.fixture.fields.northSchoolFootball;
    const level = (await db.select({ l: fields.maintenanceLevel }).from(fields).where(eq(fields.id, id)))[0]!.l as 1 | 2 | 3 | 4;
    const every = DEFAULT_STANDARDS[level].fieldCheckDays;
    await db.insert(fieldChecks).values({ fieldId: id, turfCoverPct: 90, weedsPct: 2, barePct: 3, checkedOn: '2026-06-01', score: 80 });
    await db.update(fields).set({ lastMowedOn: '2026-07-10' }).where(eq(fields.id, id));
    const long = fieldOf(await (await api.signIn('head')).get(`/api/map?asOf=${addDaysIso('2026-06-01', every + 10)}`), id);
    expect(long).toMatchObject({ checkDueOn: addDaysIso('2026-06-01', every), checkState: 'overdue' });
    const onTime = fieldOf(await (await api.signIn('head')).get(`/api/map?asOf=${addDaysIso('2026-06-01', every - 1)}`), id);
    expect(onTime).toMatchObject({ checkDueOn: addDaysIso('2026-06-01', every), checkState: 'ok' });
    expect(fieldOf(await (await api.signIn('head')).get('/api/map?asOf=2026-07-01'), api.fixture.fields.northLawn)).toMatchObject({ checkDueOn: null, checkState: 'never' });
    // Growing at GP 1: the next mowing falls due within the level's interval of the last one.
    const july = fieldOf(await (await api.signIn('head')).get('/api/map?asOf=2026-07-30'), id);
    expect(july).toMatchObject({ mowDueState: 'overdue', mowWaitingForGrowth: false });
    expect(july.mowDueOn! > '2026-07-10' && july.mowDueOn! <= addDaysIso('2026-07-10', levelIntervalDays(DEFAULT_STANDARDS[level]))).toBe(true);
  });

  test('should show a new east–west field at once with its flag', async () => {
    const agent = await api.signIn('foreman');
    await agent.get('/api/map?asOf=2026-07-01');
    const created = await agent.post('/api/fields').send(fieldBody(api.fixture.sites.northPark, 'Cross pitch', rectangle(37.625, -66.48, 105, 68)));
    expect(created.status).toBe(201);
    const res = await agent.get('/api/map?asOf=2026-07-01');
    expect(fieldOf(res, created.body.field.id)).toMatchObject({ eastWest: true, overdue: null, daysSinceMowing: null });
    expect(fieldOf(res, api.fixture.fields.northSoccer).eastWest).toBe(false);
  });

  test('should refuse a date that is not a calendar day with a 400', async () => {
    const agent = await api.signIn('head');
    for (const bad of ['2026-02-30', 'tomorrow']) {
      const res = await agent.get(`/api/map?asOf=${bad}`);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('request/invalid');
    }
  });
});

describe('GET /api/map/basemap', () => {
  test('should answer the bundled basemap and no tile server by default', async () => {
    const res = await (await api.signIn('partner')).get('/api/map/basemap');
    expect(res.status).toBe(200);
    expect(res.body.basemap.type).toBe('FeatureCollection');
    expect(res.body.basemap.features).toHaveLength(1);
    expect(res.body).toMatchObject({ tileUrl: null, attribution: null });
  });

  test('should answer the configured tile server and allow its images', async () => {
    const config = loadConfig({ NODE_ENV: 'test', MAP_TILE_URL: 'https://{s}.tiles.example/{z}/{x}/{y}.png', MAP_ATTRIBUTION: '© Example tiles' });
    const logger = pino({ level: 'silent' });
    const { app } = createApp({ db: api.database.db, config, logger, sessionSecret: 'test-secret', mailer: createMailer(null, logger) });
    const agent = supertest.agent(app);
    await agent.post('/api/auth/sign-in').send({ email: api.fixture.users.head.email, password: PASSWORD }).expect(200);
    const res = await agent.get('/api/map/basemap');
    expect(res.body).toMatchObject({ tileUrl: 'https://{s}.tiles.example/{z}/{x}/{y}.png', attribution: '© Example tiles' });
    expect(res.headers['content-security-policy']).toContain('img-src \'self\' data: https://*.tiles.example');
  });
});
