import { eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { CAUTIONS, DEFAULT_STANDARDS, addDaysIso, hocFor, levelIntervalDays, mowerTypeFor, type Level } from '@swardwise/domain';
import { fields, sites, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { giveWork } from '../support/fixture.ts';
import { type TestApi, useTestApi } from '../support/app.ts';

const api = useTestApi();

const inSeason = '2026-05-20'; // a Wednesday inside the fixture's weather
const fieldRow = async (id: number) => (await api.database.db.select().from(fields).where(eq(fields.id, id)))[0]!;

describe('GET /api/fields/:id/needs', () => {
  test('should let each role read only the fields it may read', async () => {
    const { northSoccer, northSchoolFootball, southBaseball, northLawn } = api.fixture.fields;
    // A crew lead sees the fields his crew has work on.
    await giveWork(api.database.db, northSoccer, api.fixture.crews.north, 0);
    const cases: [Parameters<TestApi['signIn']>[0], number, number][] = [
      ['admin', southBaseball, 200],
      ['head', northSoccer, 200],
      ['foreman', northSoccer, 200],
      ['foreman', southBaseball, 403],
      ['foremanSouth', southBaseball, 200],
      ['crew', northSoccer, 200],
      ['crew', southBaseball, 403],
      ['crew', northLawn, 403],
      ['partner', northSchoolFootball, 200],
      ['partner', northSoccer, 403],
    ];
    for (const [who, id, status] of cases) {
      const agent = await api.signIn(who);
      const res = await agent.get(`/api/fields/${id}/needs`).query({ date: inSeason });
      expect(res.status, `${who} → field ${id}`).toBe(status);
      if (status === 403) expect(res.body.error.code).toBe('auth/forbidden');
    }
  });

  test('should refuse a visitor who is not signed in', async () => {
    const supertest = (await import('supertest')).default;
    const res = await supertest(api.app).get(`/api/fields/${api.fixture.fields.northSoccer}/needs`);
    expect(res.status).toBe(401);
  });

  test('should give the HOC and mower the engine gives for the field and its level', async () => {
    const agent = await api.signIn('foreman');
    for (const id of [api.fixture.fields.northSoccer, api.fixture.fields.northLawn]) {
      const row = await fieldRow(id);
      const res = await agent.get(`/api/fields/${id}/needs`).query({ date: inSeason });
      expect(res.status).toBe(200);
      const expected = hocFor({ ...row, maintenanceLevel: row.maintenanceLevel as Level }, DEFAULT_STANDARDS);
      expect(res.body.needs.hoc.hocMm).toBe(expected);
      expect(res.body.needs.hoc.mowerKind).toBe(mowerTypeFor(expected));
      expect(res.body.needs.hoc.triggerHeightMm).toBeCloseTo(1.5 * expected, 9);
      expect(res.body.needs.hoc.source).toBe('standards_sport');
    }
  });

  test('should work out the week asked for without a fallback note', async () => {
    const agent = await api.signIn('foreman');
    const res = await agent.get(`/api/fields/${api.fixture.fields.northSoccer}/needs`).query({ date: inSeason });
    const n = res.body.needs;
    expect(n.week).toMatchObject({ start: '2026-05-18', end: '2026-05-24', days: 7, fallback: false });
    expect(n.weatherNote).toBeNull();
    expect(n.growth.gpDaily).toHaveLength(7);
    expect(n.growth.gpMean).toBeGreaterThan(0);
    expect(n.growth.gpMean).toBeLessThanOrEqual(1);
    expect(n.mowing.mowingsPerWeek).toBeGreaterThan(0);
    expect(n.labour.method).toBe('pass_plan');
    expect(n.labour.hoursPerWeek).toBeCloseTo(n.labour.hoursPerMowing * n.mowing.mowingsPerWeek, 9);
    expect(n.water.irrigated).toBe(true);
    expect(n.water.et0Method).toBe('penman_monteith');
    expect(n.water.etcMm).toBeCloseTo(n.water.kc * n.water.et0Mm, 9);
    expect(n.water.cautions).toContain(CAUTIONS.water);
    expect(n.feed.cautions).toContain(CAUTIONS.feed);
    expect(n.feed.applications.length).toBeGreaterThan(0);
    expect(n.lines.kept).toBe(true);
    expect(n.lines.cautions).toContain(CAUTIONS.lines);
    expect(n.level.workCompliance.tracked).toBe(true);
    expect(n.season.dates).toHaveLength(35);
    expect(n.season.gp).toHaveLength(35);
    expect(n.season.waterNeedMm).toHaveLength(35);
    for (const b of ['hoc', 'growth', 'mowing', 'labour', 'water', 'feed', 'lines', 'level']) {
      expect(n[b].inputs.length, b).toBeGreaterThan(0);
      expect(n[b].how.length, b).toBeGreaterThan(20);
    }
  });

  test('should say plainly when it falls back to the latest week with weather', async () => {
    const agent = await api.signIn('head');
    const res = await agent.get(`/api/fields/${api.fixture.fields.northSoccer}/needs`).query({ date: '2026-12-01' });
    expect(res.status).toBe(200);
    const n = res.body.needs;
    expect(n.week).toMatchObject({ start: '2026-06-01', end: api.fixture.weather.end, fallback: true });
    expect(n.weatherNote).toMatch(/no weather for the week of Nov 30, 2026 to Dec 6, 2026/);
    expect(n.weatherNote).not.toMatch(/\d{4}-\d{2}-\d{2}/);
    expect(n.weatherNote).toMatch(/latest week with weather/);
  });

  test('should say a lawn keeps no lines and an unirrigated level is not watered', async () => {
    const agent = await api.signIn('foreman');
    const res = await agent.get(`/api/fields/${api.fixture.fields.northLawn}/needs`).query({ date: inSeason });
    const n = res.body.needs;
    expect(n.lines.kept).toBe(false);
    expect(n.lines.repaints).toBe(0);
    expect(n.water.irrigated).toBe(false);
    expect(n.water.grossMm).toBe(0);
    expect(n.water.notIrrigatedReason).toMatch(/not irrigated/);
  });

  test('should follow the Standards: a new HOC for the level changes the needs', async () => {
    const head = await api.signIn('head');
    const id = api.fixture.fields.northSoccer; // level 2, soccer, tall fescue (cool-season)
    const list = await head.get('/api/standards');
    const level2 = list.body.levels.find((l: { level: number }) => l.level === 2);
    const patched = await head.patch('/api/standards/2').send({ version: level2.version, hocMm: { soccer: { cool: 41 } } });
    expect(patched.status).toBe(200);
    const res = await head.get(`/api/fields/${id}/needs`).query({ date: inSeason });
    expect(res.body.needs.hoc.hocMm).toBe(41);
    expect(res.body.needs.standards.version).toBe(level2.version + 1);
    // Put it back so the other tests see the defaults.
    await head.patch('/api/standards/2').send({ version: level2.version + 1, hocMm: { soccer: { cool: DEFAULT_STANDARDS[2].hocMm.soccer.cool } } });
  });

  test('should refuse a bad date or id with 400 and an unknown field with 404', async () => {
    const agent = await api.signIn('admin');
    for (const date of ['yesterday', '2026-02-30', '2026-5-1']) {
      const res = await agent.get(`/api/fields/${api.fixture.fields.northSoccer}/needs`).query({ date });
      expect(res.status, date).toBe(400);
      expect(res.body.error.details.issues[0].path).toBe('query.date');
    }
    expect((await agent.get('/api/fields/abc/needs')).status).toBe(400);
    expect((await agent.get('/api/fields/99999/needs')).status).toBe(404);
  });
});

describe('one figure per field: the field page, Records and the Standards', () => {
  test('should give the same mowing interval, mowings asked and done, and work done as the Standards and Records', async () => {
    const { db } = api.database;
    const id = api.fixture.fields.northSchoolFootball;
    const row = await fieldRow(id);
    const [site] = await db.select({ districtId: sites.districtId }).from(sites).where(eq(sites.id, row.siteId));
    const base = { fieldId: id, siteId: row.siteId, districtId: site!.districtId, weekStart: '2026-05-18', crewId: api.fixture.crews.north, plannedHours: 1, origin: 'manual' as const };
    await db.insert(workOrders).values([
      { ...base, task: 'mow', plannedDate: '2026-05-18', status: 'done', actualHours: 1.2, doneAt: new Date('2026-05-18T15:00:00Z') },
      { ...base, task: 'mow', plannedDate: '2026-05-21', status: 'assigned' },
      { ...base, task: 'field_check', plannedDate: '2026-05-19', status: 'done', actualHours: 0.5, doneAt: new Date('2026-05-19T15:00:00Z') },
      // An earlier week inside the four weeks the field page tallies.
      { ...base, weekStart: '2026-05-04', task: 'mow', plannedDate: '2026-05-05', status: 'skipped' },
    ]);
    const agent = await api.signIn('foreman');
    const n = (await agent.get(`/api/fields/${id}/needs`).query({ date: inSeason })).body.needs;
    const { from, to, tally } = n.level.workCompliance;
    expect([from, to]).toEqual([addDaysIso('2026-05-18', -21), '2026-05-24']);
    const records = (await agent.get('/api/records').query({ from, to })).body;
    const mine = records.byField.find((f: { fieldId: number }) => f.fieldId === id);
    const { fieldId: _f, fieldName: _n, siteName: _s, ...fromRecords } = mine;
    expect(tally).toEqual(fromRecords);
    expect(tally).toMatchObject({ mowingsAsked: 3, mowingsDone: 1, ordersDone: 2, ordersSkipped: 1 });
    // The week plan's mowings of the week asked for, as Records counts that week.
    const week = records.byWeek.find((w: { weekStart: string }) => w.weekStart === '2026-05-18');
    expect(n.mowing.plannedThisWeek).toEqual({ weekStart: '2026-05-18', asked: 2, done: 1 });
    expect(week.mowingsAsked).toBeGreaterThanOrEqual(2);

    // The interval the explanation gives is the Standards page's: the shorter of the longest interval and 7 ÷ least per week.
    const standards = (await agent.get('/api/standards')).body;
    const level = standards.levels.find((l: { level: number }) => l.level === row.maintenanceLevel).data;
    expect(n.mowing.intervalDays).toBe(levelIntervalDays(level));
    expect(n.mowing.inputs.find((i: { key: string }) => i.key === 'interval').value).toBe(levelIntervalDays(level));
    expect(n.mowing.how).toContain(`falls due ${levelIntervalDays(level)} days after the last`);
  });

  test('should never give a next mowing on or before the last mowing, whatever week the weather falls back to', async () => {
    const { db } = api.database;
    const id = api.fixture.fields.northLawn;
    for (const last of [api.fixture.weather.end, addDaysIso(api.fixture.weather.end, -1), addDaysIso(api.fixture.weather.end, 5)]) {
      await db.update(fields).set({ lastMowedOn: last }).where(eq(fields.id, id));
      const n = (await (await api.signIn('head')).get(`/api/fields/${id}/needs`).query({ date: '2026-12-02' })).body.needs;
      expect(n.mowing.lastMowedOn).toBe(last);
      if (n.mowing.nextMowingOn !== null) expect(n.mowing.nextMowingOn > last, `last mowed ${last}, next ${n.mowing.nextMowingOn}`).toBe(true);
      else expect(n.mowing.nextMowingNote).toBeTruthy();
    }
  });
});
