/**
 * The department clock: with the server's clock late on a Sunday evening in Chicago (already
 * Monday in UTC) and at the US daylight-saving changes, "today", the current week and the date
 * a job was done are the department's local dates. And the time zone is an administrator's
 * setting: read, changed (audited, versioned), refused when it is no zone.
 */
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { mondayOf } from '@swardwise/domain';
import { loadConfig } from '../../apps/api/src/config.ts';
import { auditLog, fields, settings, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { DepartmentClock, TIME_ZONE_KEY } from '../../apps/api/src/services/clock.ts';
import { startTestApi, type TestApi } from '../support/app.ts';

let api: TestApi;
// Sunday 31 May 2026, 23:30 in Chicago (CDT, UTC−5): 04:30 on Monday 1 June in UTC.
// The fixture's weather runs 4 May – 7 June 2026, so the week of 25 May has weather.
const SUNDAY_NIGHT = new Date('2026-06-01T04:30:00Z');
let now = SUNDAY_NIGHT;

beforeAll(async () => {
  api = await startTestApi({}, { now: () => now });
});
afterAll(() => api.close());

const db = () => api.database.db;

/** A mowing for the north crew on `date`, due that day. */
async function mowingOn(date: string): Promise<number> {
  const [row] = await db()
    .insert(workOrders)
    .values({
      fieldId: api.fixture.fields.northSoccer,
      siteId: api.fixture.sites.northPark,
      districtId: api.fixture.districts.north,
      task: 'mow',
      weekStart: mondayOf(date),
      plannedDate: date,
      crewId: api.fixture.crews.north,
      plannedHours: 1,
      status: 'assigned',
      origin: 'manual',
      details: { dueBy: date },
    })
    .returning({ id: workOrders.id });
  return row!.id;
}

const lastMowed = async () => (await db().select({ on: fields.lastMowedOn }).from(fields).where(eq(fields.id, api.fixture.fields.northSoccer)))[0]!.on;

describe('the department clock at 23:30 on a Sunday in Chicago (Monday in UTC)', () => {
  test('should give the signed-in session the department’s time zone', async () => {
    const crew = await api.signIn('crew');
    expect((await crew.get('/api/auth/me')).body).toMatchObject({ timeZone: 'America/Chicago', user: { role: 'crew' } });
    expect(api.clock.today()).toBe('2026-05-31');
    expect(api.clock.weekStart()).toBe('2026-05-25');
  });

  test('should start the crew’s work orders on the local date', async () => {
    const sunday = await mowingOn('2026-05-31');
    const nextSunday = await mowingOn('2026-06-07');
    const res = await (await api.signIn('crew')).get('/api/work-orders');
    expect(res.status).toBe(200);
    const ids = res.body.items.map((o: { id: number }) => o.id);
    // Today and the six days after it: 31 May – 6 June (UTC would give 1 – 7 June).
    expect(ids).toContain(sunday);
    expect(ids).not.toContain(nextSunday);
  });

  test('should list bookings from the local date on', async () => {
    const foreman = await api.signIn('foreman');
    const booked = await foreman.post('/api/field-events').send({ fieldId: api.fixture.fields.northSoccer, kind: 'game', title: 'Invented late game', startsOn: '2026-05-31' });
    expect(booked.status).toBe(201);
    const list = await foreman.get('/api/field-events');
    expect(list.body.items.map((e: { id: number }) => e.id)).toContain(booked.body.event.id);
  });

  test('should keep new week-plan work on the local Sunday of the week under way', async () => {
    const foreman = await api.signIn('foreman');
    const res = await foreman.post('/api/week-plans/generate').send({ districtId: api.fixture.districts.north, weekStart: '2026-05-25', dryRun: true });
    expect(res.status).toBe(200);
    const added = res.body.diff.added as { plannedDate: string }[];
    expect(added.length).toBeGreaterThan(0);
    // The week is still under way locally: the days before today are past. (In UTC the week
    // would be over and the work spread from Monday 25 May.)
    for (const o of added) expect(o.plannedDate).toBe('2026-05-31');
  });

  test('should show needs and the map as of the local date', async () => {
    const foreman = await api.signIn('foreman');
    const needs = await foreman.get(`/api/fields/${api.fixture.fields.northSoccer}/needs`);
    expect(needs.status).toBe(200);
    expect(needs.body.needs).toMatchObject({ requestedDate: '2026-05-31', week: { start: '2026-05-25' } });
    const map = await foreman.get('/api/map');
    expect(map.body.requested).toBe('2026-05-31');
  });

  test('should count a job done at 23:30 local on that local date', async () => {
    const id = await mowingOn('2026-05-31');
    const crew = await api.signIn('crew');
    const done = await crew.post(`/api/work-orders/${id}/reports`).send({ status: 'done', actualHours: 1, note: 'Cut under the lights' });
    expect(done.status).toBe(201);
    expect(await lastMowed()).toBe('2026-05-31');
    const records = await (await api.signIn('foreman')).get('/api/records').query({ districtId: api.fixture.districts.north, from: '2026-05-25', to: '2026-05-31' });
    expect(records.status).toBe(200);
    expect(records.body.asOf).toBe('2026-05-31');
    // Done on its due day, so not late (the UTC date would be 1 June: a day late).
    expect(records.body.lateMowings.map((l: { id: number }) => l.id)).not.toContain(id);
    expect(records.body.totals.mowingsDone).toBe(1);
    expect(records.body.totals.mowingsLate).toBe(0);
  });
});

describe('the department clock at the US daylight-saving changes (America/Chicago)', () => {
  test.each([
    // 8 March 2026: 02:00 CST becomes 03:00 CDT.
    ['2026-03-08T07:59:00Z', '01:59 CST, just before the change', '2026-03-08', '2026-03-02'],
    ['2026-03-08T08:00:00Z', '03:00 CDT, just after it', '2026-03-08', '2026-03-02'],
    ['2026-03-09T04:30:00Z', '23:30 CDT on the Sunday of the change', '2026-03-08', '2026-03-02'],
    ['2026-03-09T05:30:00Z', '00:30 CDT on the Monday after', '2026-03-09', '2026-03-09'],
    // 1 November 2026: 02:00 CDT becomes 01:00 CST, so 01:30 happens twice.
    ['2026-11-01T06:30:00Z', 'the first 01:30 (CDT)', '2026-11-01', '2026-10-26'],
    ['2026-11-01T07:30:00Z', 'the second 01:30 (CST)', '2026-11-01', '2026-10-26'],
    ['2026-11-02T05:30:00Z', '23:30 CST on the Sunday of the change', '2026-11-01', '2026-10-26'],
    ['2026-11-02T06:30:00Z', '00:30 CST on the Monday after', '2026-11-02', '2026-11-02'],
  ])('should take %s (%s) as %s, week of %s', async (instant, _label, today, weekStart) => {
    now = new Date(instant);
    expect(api.clock.today()).toBe(today);
    expect(api.clock.weekStart()).toBe(weekStart);
    const foreman = await api.signIn('foreman');
    const records = await foreman.get('/api/records').query({ from: weekStart, to: today });
    expect(records.body.asOf).toBe(today);
    expect((await foreman.get('/api/map')).body.requested).toBe(today);
    const orders = await (await api.signIn('crew')).get('/api/work-orders');
    expect(orders.status).toBe(200);
  });

  test('should date a job done at 23:30 on the evening the clocks went back by that evening', async () => {
    now = new Date('2026-11-02T05:30:00Z');
    const sunday = await mowingOn('2026-11-01');
    const monday = await mowingOn('2026-11-02');
    const crew = await api.signIn('crew');
    const ids = (await crew.get('/api/work-orders')).body.items.map((o: { id: number }) => o.id);
    expect(ids).toEqual(expect.arrayContaining([sunday, monday]));
    expect((await crew.post(`/api/work-orders/${sunday}/reports`).send({ status: 'done', actualHours: 1, note: '' })).status).toBe(201);
    expect(await lastMowed()).toBe('2026-11-01');
    const records = await (await api.signIn('foreman')).get('/api/records').query({ districtId: api.fixture.districts.north, from: '2026-10-26', to: '2026-11-01' });
    expect(records.body.lateMowings.map((l: { id: number }) => l.id)).not.toContain(sunday);
    const [row] = await db().select({ doneAt: workOrders.doneAt }).from(workOrders).where(eq(workOrders.id, sunday));
    expect(row!.doneAt!.toISOString()).toBe('2026-11-02T05:30:00.000Z');
  });
});

describe('the department time zone setting', () => {
  test('should let only an administrator read it, showing where it comes from', async () => {
    const admin = await api.signIn('admin');
    const res = await admin.get('/api/settings');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ timeZone: 'America/Chicago', source: 'default', defaultTimeZone: 'America/Chicago', version: 1 });
    for (const who of ['head', 'foreman', 'crew', 'partner'] as const) expect((await (await api.signIn(who)).get('/api/settings')).status).toBe(403);
  });

  test('should refuse a name that is no time zone, a missing version and a non-administrator, writing nothing', async () => {
    const admin = await api.signIn('admin');
    for (const body of [{ timeZone: 'Central Time', version: 1 }, { timeZone: 'Mars/Olympus_Mons', version: 1 }, { timeZone: '', version: 1 }, { timeZone: 'America/Denver' }, { version: 1 }]) {
      const res = await admin.patch('/api/settings').send(body);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('request/invalid');
    }
    const bad = await admin.patch('/api/settings').send({ timeZone: 'Mars/Olympus_Mons', version: 1 });
    expect(bad.body.error.details.issues[0]).toMatchObject({ path: 'body.timeZone', message: expect.stringMatching(/IANA time zone/) });
    // The head may not change it, and is refused before the body is looked at.
    expect((await (await api.signIn('head')).patch('/api/settings').send({ timeZone: 'not even checked' })).status).toBe(403);
    expect(await db().select().from(settings).where(eq(settings.key, TIME_ZONE_KEY))).toHaveLength(0);
    expect(api.clock.timeZone).toBe('America/Chicago');
  });

  test('should change the zone, audited, and move "today" with it at once', async () => {
    now = SUNDAY_NIGHT; // 23:30 on Sunday in Chicago, 00:30 on Monday in New York
    const admin = await api.signIn('admin');
    const res = await admin.patch('/api/settings').send({ timeZone: 'america/new_york', version: 1 });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ timeZone: 'America/New_York', source: 'setting', defaultTimeZone: 'America/Chicago', version: 2 });
    expect((await admin.get('/api/settings')).body).toMatchObject({ timeZone: 'America/New_York', version: 2 });
    const [entry] = await db().select().from(auditLog).where(and(eq(auditLog.entity, 'settings'), eq(auditLog.action, 'create'))).orderBy(auditLog.id);
    expect(entry).toMatchObject({ actorId: api.fixture.users.admin.id, before: { timeZone: 'America/Chicago' }, after: { timeZone: 'America/New_York', version: 2 } });

    const crew = await api.signIn('crew');
    expect((await crew.get('/api/auth/me')).body.timeZone).toBe('America/New_York');
    expect(api.clock.today()).toBe('2026-06-01');
    expect((await (await api.signIn('foreman')).get('/api/map')).body.requested).toBe('2026-06-01');

    // Someone else's change in between: the version read is stale.
    const stale = await admin.patch('/api/settings').send({ timeZone: 'America/Denver', version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('settings/version_conflict');
    const back = await admin.patch('/api/settings').send({ timeZone: 'America/Chicago', version: 2 });
    expect(back.body).toMatchObject({ timeZone: 'America/Chicago', version: 3 });
    expect(api.clock.today()).toBe('2026-05-31');
  });

  test('should take its default from DEPARTMENT_TIME_ZONE and refuse to start with one that is no zone', async () => {
    expect(loadConfig({ DEPARTMENT_TIME_ZONE: 'America/Denver' }).departmentTimeZone).toBe('America/Denver');
    expect(loadConfig({}).departmentTimeZone).toBe('America/Chicago');
    expect(() => loadConfig({ DEPARTMENT_TIME_ZONE: 'Central' })).toThrow(/DEPARTMENT_TIME_ZONE must be an IANA time zone/);
    // A stored zone this runtime does not know stops the start with the reason.
    await db().update(settings).set({ value: { timeZone: 'Atlantis/Capital', version: 4 } }).where(eq(settings.key, TIME_ZONE_KEY));
    await expect(new DepartmentClock(db(), 'America/Chicago').ready()).rejects.toThrow(/\("Atlantis\/Capital"\) is not an IANA time zone/);
    await db().update(settings).set({ value: { timeZone: 'America/Chicago', version: 3 } }).where(eq(settings.key, TIME_ZONE_KEY));
  });
});
