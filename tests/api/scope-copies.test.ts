import { eq } from 'drizzle-orm';
import type supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { addDaysIso, DEFAULT_TIME_ZONE, localToday } from '@swardwise/domain';
import { fieldEvents, fields, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { fieldBody, giveWork, rectangle } from '../support/fixture.ts';
import { startTestApi, type TestApi } from '../support/app.ts';

/**
 * Work orders and bookings copy their field's site and district. Moving a field to another
 * site, or a site to another district, must take the copies along: the new foreman or
 * partner sees and controls the rows, the old one is refused.
 */
let api: TestApi;
type Agent = ReturnType<typeof supertest.agent>;
let admin: Agent;
let foreman: Agent;
let foremanSouth: Agent;
let partner: Agent;

beforeAll(async () => {
  api = await startTestApi();
  admin = await api.signIn('admin');
  foreman = await api.signIn('foreman');
  foremanSouth = await api.signIn('foremanSouth');
  partner = await api.signIn('partner');
});
afterAll(() => api.close());

const SOON = addDaysIso(localToday(process.env.DEPARTMENT_TIME_ZONE || DEFAULT_TIME_ZONE), 4);
let n = 0;

/** A new field at a site with one work order of the site's district crew and one booking. */
async function fieldWithWork(siteId: number, crewId: number) {
  n += 1;
  const created = await admin.post('/api/fields').send(fieldBody(siteId, `Moving field ${n}`, rectangle(37.62 + n * 0.001, -66.47, 60, 90)));
  expect(created.status).toBe(201);
  const fieldId = created.body.field.id as number;
  const orderId = await giveWork(api.database.db, fieldId, crewId, 1);
  const booking = await admin.post('/api/field-events').send({ fieldId, kind: 'game', title: `Invented game ${n}`, startsOn: SOON });
  expect(booking.status).toBe(201);
  return { fieldId, orderId, bookingId: booking.body.event.id as number };
}

const order = async (id: number) => (await api.database.db.select().from(workOrders).where(eq(workOrders.id, id)))[0]!;
const booking = async (id: number) => (await api.database.db.select().from(fieldEvents).where(eq(fieldEvents.id, id)))[0]!;
const version = async (fieldId: number) => (await api.database.db.select().from(fields).where(eq(fields.id, fieldId)))[0]!.version;
const bookingIds = async (agent: Agent, fieldId: number) => ((await agent.get(`/api/field-events?fieldId=${fieldId}`)).body.items ?? []).map((e: { id: number }) => e.id);

/** The agent reads and changes the order and the booking. */
async function expectControl(agent: Agent, rows: { orderId: number; bookingId: number; fieldId: number }, canWrite = true) {
  expect((await agent.get(`/api/work-orders/${rows.orderId}`)).status).toBe(200);
  expect(await bookingIds(agent, rows.fieldId)).toContain(rows.bookingId);
  if (canWrite) {
    const b = await booking(rows.bookingId);
    expect((await agent.patch(`/api/field-events/${rows.bookingId}`).send({ version: b.version, notes: `changed ${b.version}` })).status).toBe(200);
  }
}

/** The agent neither reads nor changes the order and the booking. */
async function expectRefused(agent: Agent, rows: { orderId: number; bookingId: number; fieldId: number }) {
  expect((await agent.get(`/api/work-orders/${rows.orderId}`)).status).toBe(403);
  expect(await bookingIds(agent, rows.fieldId)).not.toContain(rows.bookingId);
  const b = await booking(rows.bookingId);
  expect((await agent.patch(`/api/field-events/${rows.bookingId}`).send({ version: b.version, notes: 'not mine' })).status).toBe(403);
  expect((await agent.delete(`/api/field-events/${rows.bookingId}?version=${b.version}`)).status).toBe(403);
  const o = await order(rows.orderId);
  expect((await agent.delete(`/api/work-orders/${rows.orderId}?version=${o.version}`)).status).toBe(403);
}

type Rows = Awaited<ReturnType<typeof fieldWithWork>>;

/** `owner` reads and changes the order and the booking; `other` does neither. */
async function expectHeldBy(owner: Agent, other: Agent, rows: Rows) {
  await expectControl(owner, rows);
  await expectRefused(other, rows);
}

/** The order and the booking carry the field's site and district now. */
async function expectCopies(rows: Rows, scope: { siteId: number; districtId: number }) {
  expect(await order(rows.orderId)).toMatchObject(scope);
  expect(await booking(rows.bookingId)).toMatchObject(scope);
}

describe('moving a field to another site', () => {
  test('should take its work and bookings to the new district: the new foreman controls them, the old one is refused', async () => {
    const { sites, districts, crews } = api.fixture;
    const rows = await fieldWithWork(sites.northPark, crews.north);
    await expectHeldBy(foreman, foremanSouth, rows);

    const moved = await admin.patch(`/api/fields/${rows.fieldId}`).send({ version: await version(rows.fieldId), siteId: sites.southPark });
    expect(moved.status).toBe(200);
    await expectCopies(rows, { siteId: sites.southPark, districtId: districts.south });
    // The north crew may not work in the south district: the open order waits for a south crew.
    expect(await order(rows.orderId)).toMatchObject({ crewId: null, status: 'planned' });

    await expectHeldBy(foremanSouth, foreman, rows);
  });

  test('should give a partner the work and bookings of a field moved onto his site, and take those of a field moved off it', async () => {
    const { sites, crews } = api.fixture;
    const onto = await fieldWithWork(sites.northPark, crews.north);
    const off = await fieldWithWork(sites.northSchool, crews.north);
    expect((await partner.get(`/api/work-orders/${onto.orderId}`)).status).toBe(403);
    expect((await partner.get(`/api/work-orders/${off.orderId}`)).status).toBe(200);

    await admin.patch(`/api/fields/${onto.fieldId}`).send({ version: await version(onto.fieldId), siteId: sites.northSchool }).expect(200);
    await admin.patch(`/api/fields/${off.fieldId}`).send({ version: await version(off.fieldId), siteId: sites.northPark }).expect(200);

    expect((await partner.get(`/api/work-orders/${onto.orderId}`)).status).toBe(200);
    expect(await bookingIds(partner, onto.fieldId)).toContain(onto.bookingId);
    // Within one district the crew stays on the work.
    expect(await order(onto.orderId)).toMatchObject({ siteId: sites.northSchool, crewId: crews.north, status: 'assigned' });

    expect((await partner.get(`/api/work-orders/${off.orderId}`)).status).toBe(403);
    expect(await bookingIds(partner, off.fieldId)).not.toContain(off.bookingId);
    const b = await booking(off.bookingId);
    expect((await partner.delete(`/api/field-events/${off.bookingId}?version=${b.version}`)).status).toBe(403);
  });
});

describe('moving a site to another district', () => {
  test('should take the work and bookings of its fields along: the new foreman controls them, the old one is refused', async () => {
    const { sites, districts, crews } = api.fixture;
    const rows = await fieldWithWork(sites.northSchool, crews.north);
    await expectControl(foreman, rows);
    const site = (await admin.get(`/api/sites/${sites.northSchool}`)).body.site;
    const moved = await api.signIn('head').then((head) => head.patch(`/api/sites/${sites.northSchool}`).send({ version: site.version, districtId: districts.south }));
    expect(moved.status).toBe(200);

    await expectCopies(rows, { siteId: sites.northSchool, districtId: districts.south });
    expect(await order(rows.orderId)).toMatchObject({ crewId: null });
    await expectHeldBy(foremanSouth, foreman, rows);
    // The partner's site is the same site: he keeps seeing it.
    expect((await partner.get(`/api/work-orders/${rows.orderId}`)).status).toBe(200);

    // And back: the copies follow again.
    const again = (await admin.get(`/api/sites/${sites.northSchool}`)).body.site;
    await admin.patch(`/api/sites/${sites.northSchool}`).send({ version: again.version, districtId: districts.north }).expect(200);
    expect(await order(rows.orderId)).toMatchObject({ districtId: districts.north });
    await expectHeldBy(foreman, foremanSouth, rows);
  });

  test('should keep done work with its crew as history while moving its scope', async () => {
    const { sites, districts, crews } = api.fixture;
    const rows = await fieldWithWork(sites.northPark, crews.north);
    await api.database.db.update(workOrders).set({ status: 'done', doneAt: new Date() }).where(eq(workOrders.id, rows.orderId));
    await admin.patch(`/api/fields/${rows.fieldId}`).send({ version: await version(rows.fieldId), siteId: sites.southPark }).expect(200);
    expect(await order(rows.orderId)).toMatchObject({ districtId: districts.south, siteId: sites.southPark, crewId: crews.north, status: 'done' });
  });
});

describe('imports and moves', () => {
  test('should refuse a sites import that would move a site to another district, row by row', async () => {
    const head = await api.signIn('head');
    const file = Buffer.from('site,district,kind,owner,address,lat,lng,notes\nTest Park North,south,,,,,,\n');
    const res = await head.post('/api/imports').field('kind', 'sites_csv').attach('file', file, 'sites.csv');
    expect(res.status).toBe(201);
    expect(res.body.import.rows[0].errors).toEqual([{ column: 'district', message: expect.stringMatching(/moving a site is done on its page/) }]);
    expect((await head.post(`/api/imports/${res.body.import.id}/commit`)).status).toBe(409);
  });
});
