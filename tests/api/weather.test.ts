import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, beforeEach, describe, expect, test } from 'vitest';
import { addDaysIso, mondayOf } from '@swardwise/domain';
import { auditLog, weatherDays, weatherStations } from '../../apps/api/src/db/schema/index.ts';
import { startFakeWeather, type FakeWeather } from '../../apps/api/src/weather/fake-server.ts';
import { startTestApi, type TestApi } from '../support/app.ts';

let api: TestApi;
let fake: FakeWeather;
let stationId: number;

beforeAll(async () => {
  fake = await startFakeWeather({ today: '2027-05-10', slowMs: 1500 });
  api = await startTestApi({ WEATHER_API_URL: fake.url, WEATHER_API_KEY: fake.apiKey, WEATHER_TIMEOUT_MS: '500' });
  const [row] = await api.database.db.insert(weatherStations).values({ code: 'upload-wx', name: 'Upload test station', lat: 37.6, lng: -66.45, elevationM: 30 }).returning();
  stationId = row!.id;
});
afterAll(async () => {
  await api.close();
  await fake.close();
});
beforeEach(() => fake.setBehaviour('ok'));

const daysOf = async (id: number) => api.database.db.select().from(weatherDays).where(eq(weatherDays.stationId, id));

const CSV_HEADER = 'date,tmax_c,tmin_c,rh_max_pct,rh_min_pct,wind_ms,sunshine_h,solar_mj,rain_mm';

describe('station file upload', () => {
  test('should preview a file with a per-row error list and write nothing', async () => {
    const foreman = await api.signIn('foreman');
    const csv = [CSV_HEADER, '2027-04-01,18.2,7.1,88,41,2.1,9.5,,0', '2027-04-02,12,15,90,50,2,5,,3.2', '2027-04-03,hot,8,80,40,2,8,,0', '2027-04-04,21,9,101,45,2,8,,0'].join('\n');
    const res = await foreman.post(`/api/weather/stations/${stationId}/csv`).attach('file', Buffer.from(csv), 'april.csv');
    expect(res.status).toBe(200);
    expect(res.body.committed).toBe(false);
    expect(res.body.summary).toEqual({ rows: 4, valid: 1, invalid: 3 });
    const errors = Object.fromEntries(res.body.rows.map((r: { line: number; errors: { column: string; message: string }[] }) => [r.line, r.errors]));
    expect(errors[2]).toEqual([]);
    expect(errors[3]).toEqual([{ column: 'tmin_c', message: 'the minimum temperature is above the maximum' }]);
    expect(errors[4]).toEqual([{ column: 'tmax_c', message: 'not a number' }]);
    expect(errors[5]![0].column).toBe('rh_max_pct');
    expect(await daysOf(stationId)).toHaveLength(0);
  });

  test('should refuse to commit a file with errors and keep the station as it was', async () => {
    const foreman = await api.signIn('foreman');
    const csv = [CSV_HEADER, '2027-04-01,18.2,7.1,88,41,2.1,9.5,,0', '2027-04-01,19,8,88,41,2.1,9.5,,0'].join('\n');
    const res = await foreman.post(`/api/weather/stations/${stationId}/csv?commit=true`).attach('file', Buffer.from(csv), 'dupes.csv');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('weather/csv_has_errors');
    expect(res.body.error.details.rows[0].errors[0].message).toMatch(/appears twice/);
    expect(await daysOf(stationId)).toHaveLength(0);
  });

  test('should write a clean file in full and audit it', async () => {
    const foreman = await api.signIn('foreman');
    const lines = [CSV_HEADER];
    for (let i = 0; i < 10; i += 1) lines.push(`${addDaysIso('2027-04-01', i)},${20 + i / 10},${8 + i / 10},85,40,2,8,,${i % 3 === 0 ? 4 : 0}`);
    const res = await foreman.post(`/api/weather/stations/${stationId}/csv?commit=true`).attach('file', Buffer.from(lines.join('\n')), 'clean.csv');
    expect(res.status).toBe(200);
    expect(res.body.committed).toBe(true);
    const days = await daysOf(stationId);
    expect(days).toHaveLength(10);
    expect(days.find((d) => d.date === '2027-04-04')).toMatchObject({ tmaxC: 20.3, rainMm: 4, source: 'csv', kind: 'observed' });
    const audit = await api.database.db.select().from(auditLog).where(eq(auditLog.entity, 'weather')).orderBy(auditLog.id);
    expect(audit.at(-1)!.after).toMatchObject({ source: 'csv', days: 10, from: '2027-04-01', to: '2027-04-10' });
    const range = await foreman.get(`/api/weather/stations/${stationId}/days?from=2027-03-30&to=2027-04-11`);
    expect(range.body.gaps).toEqual(['2027-03-30', '2027-03-31', '2027-04-11']);
  });

  test('should refuse a wrong file type, a missing column and a too-large file', async () => {
    const foreman = await api.signIn('foreman');
    const png = await foreman.post(`/api/weather/stations/${stationId}/csv`).attach('file', Buffer.from([0x89, 0x50, 0x4e, 0x47, 0, 1]), 'photo.png');
    expect(png.status).toBe(415);
    const cols = await foreman.post(`/api/weather/stations/${stationId}/csv`).attach('file', Buffer.from('day,high\n2027-04-01,20'), 'cols.csv');
    expect(cols.status).toBe(400);
    expect(cols.body.error.message).toMatch(/date, tmax_c, tmin_c/);
    const big = await foreman.post(`/api/weather/stations/${stationId}/csv`).attach('file', Buffer.alloc(3 * 1024 * 1024, 'a'), 'big.csv');
    expect(big.status).toBe(413);
    const none = await foreman.post(`/api/weather/stations/${stationId}/csv`).send({});
    expect(none.status).toBe(400);
  });

  test('should let crews and the head read but not upload, and keep partners out', async () => {
    const csv = `${CSV_HEADER}\n2027-06-01,25,14,80,40,2,9,,0`;
    for (const who of ['crew', 'head'] as const) {
      const agent = await api.signIn(who);
      expect((await agent.get('/api/weather/stations')).status, who).toBe(200);
      expect((await agent.post(`/api/weather/stations/${stationId}/csv?commit=true`).attach('file', Buffer.from(csv), 'x.csv')).status, who).toBe(403);
    }
    const partner = await api.signIn('partner');
    expect((await partner.get('/api/weather/stations')).status).toBe(403);
    expect((await daysOf(stationId)).some((d) => d.date === '2027-06-01')).toBe(false);
  });
});

describe('hosted weather service', () => {
  test('should pull a range from the service, observed and forecast days apart', async () => {
    const foreman = await api.signIn('foreman');
    const res = await foreman.post(`/api/weather/stations/${stationId}/pull`).send({ from: '2027-05-05', to: '2027-05-14' });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ saved: 10, missing: [] });
    const days = (await daysOf(stationId)).filter((d) => d.date >= '2027-05-05' && d.date <= '2027-05-14');
    expect(days).toHaveLength(10);
    expect(days.filter((d) => d.kind === 'forecast').map((d) => d.date)).toEqual(['2027-05-11', '2027-05-12', '2027-05-13', '2027-05-14']);
    expect(days.every((d) => d.source === 'service' && d.tminC <= d.tmaxC)).toBe(true);
  });

  test('should give the same data for the same place and days (deterministic fake)', async () => {
    const foreman = await api.signIn('foreman');
    await foreman.post(`/api/weather/stations/${stationId}/pull`).send({ from: '2027-05-05', to: '2027-05-06' });
    const first = (await daysOf(stationId)).find((d) => d.date === '2027-05-05')!;
    await foreman.post(`/api/weather/stations/${stationId}/pull`).send({ from: '2027-05-05', to: '2027-05-06' });
    const second = (await daysOf(stationId)).find((d) => d.date === '2027-05-05')!;
    expect({ ...second, updatedAt: null }).toEqual({ ...first, updatedAt: null });
  });

  test('should report the days the service left out', async () => {
    fake.setBehaviour('gaps');
    const foreman = await api.signIn('foreman');
    const res = await foreman.post(`/api/weather/stations/${stationId}/pull`).send({ from: '2027-07-01', to: '2027-07-08' });
    expect(res.status).toBe(200);
    expect(res.body.missing).toEqual(['2027-07-03', '2027-07-07']);
    expect(res.body.saved).toBe(6);
  });

  test.each([
    ['slow', 'weather/timeout', /did not answer within/],
    ['error', 'weather/upstream_error', /answered with an error \(502\)/],
    ['not_json', 'weather/malformed', /not weather data/],
    ['malformed', 'weather/malformed_rows', /2 unusable day/],
  ] as const)('should answer a %s service with a clear 503 and write nothing', async (behaviour, code, message) => {
    fake.setBehaviour(behaviour);
    const foreman = await api.signIn('foreman');
    const before = (await daysOf(stationId)).length;
    const res = await foreman.post(`/api/weather/stations/${stationId}/pull`).send({ from: '2027-08-01', to: '2027-08-07' });
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe(code);
    expect(res.body.error.message).toMatch(message);
    expect(res.body.error.message).toMatch(/nothing was saved/);
    expect((await daysOf(stationId)).length).toBe(before);
  });

  test('should refuse a backwards or oversized range with 400', async () => {
    const foreman = await api.signIn('foreman');
    const back = await foreman.post(`/api/weather/stations/${stationId}/pull`).send({ from: '2027-05-10', to: '2027-05-01' });
    expect(back.status).toBe(400);
    expect(back.body.error.details.issues[0].path).toBe('body.to');
    const long = await foreman.post(`/api/weather/stations/${stationId}/pull`).send({ from: '2026-01-01', to: '2027-12-31' });
    expect(long.status).toBe(400);
    const missing = await foreman.post('/api/weather/stations/99999/pull').send({ from: '2027-05-01', to: '2027-05-02' });
    expect(missing.status).toBe(404);
  });
});

describe('weather service down', () => {
  test('should keep needs and the week plan answering on the last weather and show the days missing since then', async () => {
    // Only the fixture station keeps weather, ending weeks ago: the service has been down since.
    await api.database.db.delete(weatherDays).where(eq(weatherDays.stationId, stationId));
    fake.setBehaviour('slow');
    const foreman = await api.signIn('foreman');
    const today = api.clock.today();
    const pull = await foreman.post(`/api/weather/stations/${api.fixture.weather.stationId}/pull`).send({ from: addDaysIso(today, -6), to: today });
    expect(pull.status).toBe(503);
    expect(pull.body.error.code).toBe('weather/timeout');

    const gap = { since: addDaysIso(api.fixture.weather.end, 1), through: today, days: expect.any(Number) };
    const stations = await foreman.get('/api/weather/stations');
    expect(stations.status).toBe(200);
    const fixtureStation = stations.body.items.find((s: { id: number }) => s.id === api.fixture.weather.stationId);
    expect(fixtureStation.gap).toEqual(gap);
    expect(addDaysIso(fixtureStation.gap.since, fixtureStation.gap.days - 1)).toBe(today);

    const needs = await foreman.get(`/api/fields/${api.fixture.fields.northSoccer}/needs`);
    expect(needs.status).toBe(200);
    expect(needs.body.needs.weatherGap).toEqual(fixtureStation.gap);
    expect(needs.body.needs.week.fallback).toBe(true);
    expect(needs.body.needs.week.end).toBe(api.fixture.weather.end);
    expect(needs.body.needs.growth.growthMmWeek).toBeGreaterThan(0);

    const week = await foreman.post('/api/week-plans/generate').send({ districtId: api.fixture.districts.north, weekStart: mondayOf(today), dryRun: true });
    expect(week.status).toBeLessThan(300);
  });
});
