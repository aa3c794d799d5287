import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { eq, inArray } from 'drizzle-orm';
import type supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { addDaysIso, DEFAULT_TIME_ZONE, localToday } from '@swardwise/domain';
import { fieldChecks, fieldEvents, fields, imports, workOrders, workPhotos, workUpdates } from '../../apps/api/src/db/schema/index.ts';
import { fieldBody, giveWork, rectangle } from '../support/fixture.ts';
import { startTestApi, type TestApi } from '../support/app.ts';

/**
 * A field with work on record is never deleted (its done work, reports, photos and checks are
 * the department's records): it is retired instead. Where a delete is allowed, the photo files
 * of its open work leave the uploads folder with their rows.
 */
let api: TestApi;
let uploads: string;
type Agent = ReturnType<typeof supertest.agent>;
let foreman: Agent;

beforeAll(async () => {
  uploads = fs.mkdtempSync(path.join(os.tmpdir(), 'sw-uploads-'));
  api = await startTestApi({ UPLOADS_DIR: uploads });
  foreman = await api.signIn('foreman');
});
afterAll(async () => {
  await api.close();
  fs.rmSync(uploads, { recursive: true, force: true });
});

// The fixture's weather runs 4 May – 7 June 2026.
const WEEK = '2026-05-25';
let n = 0;

async function newField(agent: Agent = foreman, siteId = api.fixture.sites.northPark) {
  n += 1;
  const res = await agent.post('/api/fields').send(fieldBody(siteId, `Temporary pitch ${n}`, rectangle(37.624 + n * 0.0012, -66.474, 60, 90), { maintenanceLevel: 2 }));
  expect(res.status).toBe(201);
  return res.body.field as { id: number; version: number; name: string };
}

/** A photo row of an order and its file in the uploads folder. */
async function photoOn(orderId: number) {
  const fileName = `wo${orderId}-test-${n}.jpg`;
  fs.writeFileSync(path.join(uploads, fileName), Buffer.from('not really a jpeg'));
  await api.database.db.insert(workPhotos).values({ workOrderId: orderId, fileName, mime: 'image/jpeg', width: 10, height: 10, bytes: 17 });
  return path.join(uploads, fileName);
}

async function booking(fieldId: number) {
  const res = await foreman.post('/api/field-events').send({ fieldId, kind: 'game', title: 'Invented game', startsOn: addDaysIso(localToday(process.env.DEPARTMENT_TIME_ZONE || DEFAULT_TIME_ZONE), 3) });
  expect(res.status).toBe(201);
  return res.body.event.id as number;
}

const rowsOf = async (fieldId: number) => {
  const db = api.database.db;
  const orders = await db.select().from(workOrders).where(eq(workOrders.fieldId, fieldId));
  const ids = orders.map((o) => o.id);
  return {
    field: (await db.select().from(fields).where(eq(fields.id, fieldId))).length,
    orders: orders.length,
    reports: ids.length ? (await db.select().from(workUpdates).where(inArray(workUpdates.workOrderId, ids))).length : 0,
    photos: ids.length ? (await db.select().from(workPhotos).where(inArray(workPhotos.workOrderId, ids))).length : 0,
    bookings: (await db.select().from(fieldEvents).where(eq(fieldEvents.fieldId, fieldId))).length,
    checks: (await db.select().from(fieldChecks).where(eq(fieldChecks.fieldId, fieldId))).length,
  };
};

describe('deleting a field with work on record', () => {
  test.each(['done', 'started'] as const)('should refuse with 409 field/has_work_history when a work order is %s, and keep every row and file', async (status) => {
    const field = await newField();
    const orderId = await giveWork(api.database.db, field.id, api.fixture.crews.north, -1);
    await api.database.db.update(workOrders).set({ status, doneAt: status === 'done' ? new Date() : null }).where(eq(workOrders.id, orderId));
    await api.database.db.insert(workUpdates).values({ workOrderId: orderId, status, note: 'Mowed twice', reportedAt: new Date() });
    const file = await photoOn(orderId);
    await booking(field.id);
    const before = await rowsOf(field.id);

    const res = await foreman.delete(`/api/fields/${field.id}?version=${field.version}`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('field/has_work_history');
    expect(res.body.error.message).toMatch(/1 work order started or done/);
    expect(res.body.error.message).toMatch(/retire the field instead/);
    expect(await rowsOf(field.id)).toEqual(before);
    expect(before).toMatchObject({ field: 1, orders: 1, reports: 1, photos: 1, bookings: 1 });
    expect(fs.existsSync(file)).toBe(true);
  });

  test('should refuse when the field has field checks on record', async () => {
    const field = await newField();
    await api.database.db.insert(fieldChecks).values({ fieldId: field.id, checkedOn: '2026-05-20', turfCoverPct: 90, weedsPct: 2, barePct: 3, score: 82 });
    const res = await foreman.delete(`/api/fields/${field.id}?version=${field.version}`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('field/has_work_history');
    expect(res.body.error.message).toMatch(/1 field check/);
    expect((await rowsOf(field.id)).field).toBe(1);
  });

  test('should let the field be retired instead: listed as retired with its records, and left out of the week plan', async () => {
    const field = await newField();
    const generate = () => foreman.post('/api/week-plans/generate').send({ districtId: api.fixture.districts.north, weekStart: WEEK });
    const first = await generate();
    expect(first.status).toBe(200);
    const ordersOf = (board: { orders: { fieldId: number; status: string }[] }) => board.orders.filter((o) => o.fieldId === field.id);
    expect(ordersOf(first.body.board).length).toBeGreaterThan(0);

    const retired = await foreman.patch(`/api/fields/${field.id}`).send({ version: field.version, status: 'retired', statusNote: 'Built over by the new pavilion' });
    expect(retired.status).toBe(200);
    expect(retired.body.field.status).toBe('retired');
    const list = await foreman.get('/api/fields');
    expect(list.body.items.find((f: { id: number }) => f.id === field.id)).toMatchObject({ status: 'retired' });
    const map = await foreman.get('/api/map');
    expect(map.body.fields.find((f: { id: number }) => f.id === field.id)).toMatchObject({ status: 'retired' });

    // Re-generating takes its open generated work off the week and asks nothing new of it.
    const again = await generate();
    expect(again.status).toBe(200);
    expect(ordersOf(again.body.board)).toEqual([]);
    expect(again.body.board.orders.length).toBeGreaterThan(0);
  });
});

describe('deleting a field without work on record', () => {
  test('should delete it with its open work, reports, photos and bookings, and remove the photo files from disk', async () => {
    const field = await newField();
    const open = await giveWork(api.database.db, field.id, api.fixture.crews.north, 2);
    const skipped = await giveWork(api.database.db, field.id, api.fixture.crews.north, -2);
    await api.database.db.update(workOrders).set({ status: 'skipped' }).where(eq(workOrders.id, skipped));
    const files = [await photoOn(open), await photoOn(skipped)];
    const other = await photoOn(await giveWork(api.database.db, api.fixture.fields.northLawn, api.fixture.crews.north, 2));
    await booking(field.id);
    expect(await rowsOf(field.id)).toMatchObject({ field: 1, orders: 2, photos: 2, bookings: 1 });

    const res = await foreman.delete(`/api/fields/${field.id}?version=${field.version}`);
    expect(res.status).toBe(204);
    expect(await rowsOf(field.id)).toEqual({ field: 0, orders: 0, reports: 0, photos: 0, bookings: 0, checks: 0 });
    for (const file of files) expect(fs.existsSync(file), file).toBe(false);
    // Another field's photo stays.
    expect(fs.existsSync(other)).toBe(true);
  });

  test('should keep the photo files when the delete is refused for a stale version', async () => {
    const field = await newField();
    const file = await photoOn(await giveWork(api.database.db, field.id, api.fixture.crews.north, 2));
    expect((await foreman.delete(`/api/fields/${field.id}?version=${field.version + 1}`)).status).toBe(409);
    expect(fs.existsSync(file)).toBe(true);
    expect((await rowsOf(field.id)).photos).toBe(1);
  });
});

describe('undoing an import that created a field', () => {
  const header = 'site,field,sport,grass,rootzone,irrigation,level,clippings,hoc_mm,status,weekly_use_hours,geometry';
  const row = (name: string, lat: number) =>
    `Test Park North,${name},soccer,tall_fescue,native_soil,none,3,returned,,open,4,"${JSON.stringify(rectangle(lat, -66.471, 50, 80)).replace(/"/g, '""')}"`;
  const importField = async (name: string, lat: number) => {
    const preview = await foreman.post('/api/imports').field('kind', 'fields_csv').attach('file', Buffer.from(`${header}\n${row(name, lat)}\n`), 'fields.csv');
    expect(preview.status).toBe(201);
    await foreman.post(`/api/imports/${preview.body.import.id}/commit`).expect(200);
    const [created] = await api.database.db.select().from(fields).where(eq(fields.name, name));
    return { importId: preview.body.import.id as number, fieldId: created!.id };
  };

  test('should refuse the undo when work was done on the field since, and keep the import and the field', async () => {
    const { importId, fieldId } = await importField('Imported pitch A', 37.64);
    const orderId = await giveWork(api.database.db, fieldId, api.fixture.crews.north, -1);
    await api.database.db.update(workOrders).set({ status: 'done', doneAt: new Date() }).where(eq(workOrders.id, orderId));
    const file = await photoOn(orderId);

    const undo = await foreman.post(`/api/imports/${importId}/undo`);
    expect(undo.status).toBe(409);
    expect(undo.body.error.code).toBe('field/has_work_history');
    expect(await rowsOf(fieldId)).toMatchObject({ field: 1, orders: 1, photos: 1 });
    expect(fs.existsSync(file)).toBe(true);
    const [record] = await api.database.db.select().from(imports).where(eq(imports.id, importId));
    expect(record!.status).toBe('committed');
    // Retired, it stays with its record.
    await api.database.db.update(fields).set({ status: 'retired' }).where(eq(fields.id, fieldId));
  });

  test('should undo a field with only open work, and remove its photo files from disk', async () => {
    const { importId, fieldId } = await importField('Imported pitch B', 37.645);
    const file = await photoOn(await giveWork(api.database.db, fieldId, api.fixture.crews.north, 3));
    const undo = await foreman.post(`/api/imports/${importId}/undo`);
    expect(undo.status).toBe(200);
    expect(await rowsOf(fieldId)).toMatchObject({ field: 0, orders: 0, photos: 0 });
    expect(fs.existsSync(file)).toBe(false);
  });
});
