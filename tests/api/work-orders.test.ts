import { eq } from 'drizzle-orm';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { addDaysIso, DEFAULT_TIME_ZONE, localToday } from '@swardwise/domain';
import { fields, sites } from '../../apps/api/src/db/schema/index.ts';
import { giveWork } from '../support/fixture.ts';
import { startTestApi, type TestApi } from '../support/app.ts';

let api: TestApi;
const ids: Record<string, number> = {};
beforeAll(async () => {
  api = await startTestApi();
  const { fields: f, crews } = api.fixture;
  ids.northToday = await giveWork(api.database.db, f.northSoccer, crews.north, 0);
  ids.schoolSoon = await giveWork(api.database.db, f.northSchoolFootball, crews.north, 3);
  ids.southToday = await giveWork(api.database.db, f.southBaseball, crews.south, 0);
  ids.northLater = await giveWork(api.database.db, f.northLawn, crews.north, 20);
});
afterAll(() => api.close());

const got = (res: { body: { items: { id: number }[] } }) => res.body.items.map((w) => w.id).sort((a, b) => a - b);
const sorted = (...xs: number[]) => [...xs].sort((a, b) => a - b);

describe('work orders by role', () => {
  test('should show a crew lead only his crew’s work in the coming week', async () => {
    const res = await (await api.signIn('crew')).get('/api/work-orders');
    expect(res.status).toBe(200);
    expect(got(res)).toEqual(sorted(ids.northToday!, ids.schoolSoon!));
    expect(res.body.items[0]).toMatchObject({ task: 'mow', crewName: 'North Crew', fieldName: 'Soccer 1', siteName: 'Test Park North' });
  });

  test('should give each order its site\u2019s address and its field\u2019s status, so a crew sheet can mark a closure', async () => {
    const { db } = api.database;
    await db.update(sites).set({ address: '1 Test Way' }).where(eq(sites.id, api.fixture.sites.northPark));
    await db.update(fields).set({ status: 'closed', statusNote: 'Reseeded' }).where(eq(fields.id, api.fixture.fields.northSoccer));
    const res = await (await api.signIn('crew')).get('/api/work-orders');
    const row = res.body.items.find((w: { id: number }) => w.id === ids.northToday);
    expect(row).toMatchObject({ siteAddress: '1 Test Way', fieldStatus: 'closed', fieldStatusNote: 'Reseeded' });
    await db.update(fields).set({ status: 'open', statusNote: '' }).where(eq(fields.id, api.fixture.fields.northSoccer));
  });

  test('should show a foreman his district, the head everything and a partner his site', async () => {
    expect(got(await (await api.signIn('foreman')).get('/api/work-orders'))).toEqual(sorted(ids.northToday!, ids.schoolSoon!));
    expect(got(await (await api.signIn('head')).get('/api/work-orders'))).toEqual(sorted(ids.northToday!, ids.schoolSoon!, ids.southToday!));
    expect(got(await (await api.signIn('partner')).get('/api/work-orders'))).toEqual([ids.schoolSoon]);
  });

  test('should take a longer range and refuse a bad one', async () => {
    const foreman = await api.signIn('foreman');
    const from = localToday(DEFAULT_TIME_ZONE);
    const to = addDaysIso(from, 30);
    expect(got(await foreman.get('/api/work-orders').query({ from, to }))).toEqual(sorted(ids.northToday!, ids.schoolSoon!, ids.northLater!));
    const back = await foreman.get('/api/work-orders').query({ from: to, to: from });
    expect(back.status).toBe(400);
    expect(back.body.error.details.issues[0].path).toBe('query.to');
    expect((await foreman.get('/api/work-orders').query({ from: 'soon' })).status).toBe(400);
    expect((await supertest(api.app).get('/api/work-orders')).status).toBe(401);
  });
});
