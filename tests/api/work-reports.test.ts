import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { count, eq, sql } from 'drizzle-orm';
import sharp from 'sharp';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { auditLog, equipment, fields, workOrders, workPhotos, workUpdates } from '../../apps/api/src/db/schema/index.ts';
import { addEquipment, giveWork } from '../support/fixture.ts';
import { startTestApi, type TestApi } from '../support/app.ts';

let api: TestApi;
let uploadsDir: string;
let mowerId: number;
beforeAll(async () => {
  uploadsDir = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-photos-'));
  api = await startTestApi({ UPLOADS_DIR: uploadsDir });
  mowerId = await addEquipment(api.database.db, { districtId: api.fixture.districts.north, crewId: api.fixture.crews.north, kind: 'rotary_mower', name: 'Test rotary', hourMeterH: 100 });
});
afterAll(async () => {
  await api.close();
  fs.rmSync(uploadsDir, { recursive: true, force: true });
});

const db = () => api.database.db;
const rows = async (table: typeof workUpdates | typeof workPhotos | typeof auditLog) => (await db().select({ n: count() }).from(table))[0]!.n;
const order = async (id: number) => (await db().select().from(workOrders).where(eq(workOrders.id, id)))[0]!;
const meter = async () => (await db().select().from(equipment).where(eq(equipment.id, mowerId)))[0]!.hourMeterH;
const lastMowed = async (fieldId: number) => (await db().select({ on: fields.lastMowedOn }).from(fields).where(eq(fields.id, fieldId)))[0]!.on;
const northWork = (days = 0) => giveWork(db(), api.fixture.fields.northSoccer, api.fixture.crews.north, days);
const done = (hours = 1.5, extra: Record<string, unknown> = {}) => ({ status: 'done', actualHours: hours, note: 'Cut and striped', ...extra });
let refs = 0;
const ref = () => `test-ref-${Date.now().toString(36)}-${++refs}`;

describe('work reports by role', () => {
  test('should let the crew log its own order and refuse another crew’s', async () => {
    const mine = await northWork();
    const south = await giveWork(db(), api.fixture.fields.southBaseball, api.fixture.crews.south);
    const crew = await api.signIn('crew');
    const res = await crew.post(`/api/work-orders/${mine}/reports`).send({ status: 'started' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ duplicate: false, order: { id: mine, status: 'started', version: 2, pinned: true }, update: { status: 'started' } });
    expect((await order(mine)).startedAt).not.toBeNull();
    const refused = await crew.post(`/api/work-orders/${south}/reports`).send(done());
    expect(refused.status).toBe(403);
    expect(refused.body.error.code).toBe('auth/forbidden');
    expect((await order(south)).status).toBe('assigned');
  });

  test('should let a foreman log in his district only, an admin anywhere, and refuse the head and a partner', async () => {
    const north = await northWork();
    const south = await giveWork(db(), api.fixture.fields.southBaseball, api.fixture.crews.south);
    const school = await giveWork(db(), api.fixture.fields.northSchoolFootball, api.fixture.crews.north);
    expect((await (await api.signIn('foreman')).post(`/api/work-orders/${north}/reports`).send(done())).status).toBe(201);
    expect((await (await api.signIn('foreman')).post(`/api/work-orders/${south}/reports`).send(done())).status).toBe(403);
    expect((await (await api.signIn('foremanSouth')).post(`/api/work-orders/${school}/reports`).send(done())).status).toBe(403);
    expect((await (await api.signIn('head')).post(`/api/work-orders/${school}/reports`).send(done())).status).toBe(403);
    // The partner may read the order at his school, not log it.
    const partner = await api.signIn('partner');
    expect((await partner.get(`/api/work-orders/${school}`)).status).toBe(200);
    expect((await partner.post(`/api/work-orders/${school}/reports`).send(done())).status).toBe(403);
    expect((await order(school)).status).toBe('assigned');
    expect((await (await api.signIn('admin')).post(`/api/work-orders/${south}/reports`).send(done())).status).toBe(201);
    expect((await supertest(api.app).post(`/api/work-orders/${south}/reports`).send(done())).status).toBe(401);
    expect((await (await api.signIn('admin')).post('/api/work-orders/999999/reports').send(done())).status).toBe(404);
  });

  test('should show one order with its updates and photos to those who may read it', async () => {
    const id = await northWork();
    const crew = await api.signIn('crew');
    await crew.post(`/api/work-orders/${id}/reports`).send({ status: 'started', reportedAt: '2026-06-01T07:30:00-04:00' });
    await crew.post(`/api/work-orders/${id}/reports`).send(done(2, { reportedAt: '2026-06-01T09:30:00-04:00' }));
    const res = await crew.get(`/api/work-orders/${id}`);
    expect(res.status).toBe(200);
    expect(res.body.order).toMatchObject({ id, fieldName: 'Soccer 1', siteName: 'Test Park North', crewName: 'North Crew', status: 'done', actualHours: 2, photoCount: 0 });
    expect(res.body.updates.map((u: { status: string }) => u.status)).toEqual(['started', 'done']);
    expect(res.body.photos).toEqual([]);
    expect((await (await api.signIn('head')).get(`/api/work-orders/${id}`)).status).toBe(200);
    expect((await (await api.signIn('foremanSouth')).get(`/api/work-orders/${id}`)).status).toBe(403);
    expect((await (await api.signIn('partner')).get(`/api/work-orders/${id}`)).status).toBe(403);
    expect((await crew.get('/api/work-orders/abc')).status).toBe(400);
  });
});

describe('what a done report changes', () => {
  test('should record the hours and the doer, run the mower’s hour meter and move the last mowing forward', async () => {
    const id = await northWork();
    await db().update(workOrders).set({ equipmentId: mowerId }).where(eq(workOrders.id, id));
    await db().update(fields).set({ lastMowedOn: '2026-05-20' }).where(eq(fields.id, api.fixture.fields.northSoccer));
    const meterBefore = await meter();
    const crew = await api.signIn('crew');
    const auditBefore = await rows(auditLog);
    // Late in the evening west of UTC: the crew's date, not the UTC date, is the mowing date.
    const res = await crew.post(`/api/work-orders/${id}/reports`).send(done(2.25, { reportedAt: '2026-06-02T20:30:00-05:00' }));
    expect(res.status).toBe(201);
    const row = await order(id);
    expect(row).toMatchObject({ status: 'done', actualHours: 2.25, doneBy: api.fixture.users.crew.id, version: 2 });
    expect(row.doneAt?.toISOString()).toBe('2026-06-03T01:30:00.000Z');
    expect(await meter()).toBeCloseTo(meterBefore + 2.25, 6);
    expect(await lastMowed(api.fixture.fields.northSoccer)).toBe('2026-06-02');
    const entities = (await db().select({ entity: auditLog.entity }).from(auditLog).where(sql`${auditLog.id} > 0`).orderBy(auditLog.id)).slice(auditBefore).map((a) => a.entity);
    expect(entities.sort()).toEqual(['equipment', 'field', 'work_order', 'work_update']);
  });

  test('should never move the last mowing back for an older report, nor for another task', async () => {
    await db().update(fields).set({ lastMowedOn: '2026-06-10' }).where(eq(fields.id, api.fixture.fields.northSoccer));
    const crew = await api.signIn('crew');
    const older = await northWork();
    expect((await crew.post(`/api/work-orders/${older}/reports`).send(done(1, { reportedAt: '2026-06-05T10:00:00Z' }))).status).toBe(201);
    expect(await lastMowed(api.fixture.fields.northSoccer)).toBe('2026-06-10');
    const paint = await northWork();
    await db().update(workOrders).set({ task: 'paint_lines' }).where(eq(workOrders.id, paint));
    expect((await crew.post(`/api/work-orders/${paint}/reports`).send(done(1, { reportedAt: '2026-06-20T10:00:00Z' }))).status).toBe(201);
    expect(await lastMowed(api.fixture.fields.northSoccer)).toBe('2026-06-10');
    const newer = await northWork();
    expect((await crew.post(`/api/work-orders/${newer}/reports`).send(done(1, { reportedAt: '2026-06-21T10:00:00Z' }))).status).toBe(201);
    expect(await lastMowed(api.fixture.fields.northSoccer)).toBe('2026-06-21');
  });

  test('should answer a repeated submission with the first result and write nothing', async () => {
    const id = await northWork();
    await db().update(workOrders).set({ equipmentId: mowerId }).where(eq(workOrders.id, id));
    const crew = await api.signIn('crew');
    const clientRef = ref();
    const first = await crew.post(`/api/work-orders/${id}/reports`).send(done(1.75, { clientRef }));
    expect(first.status).toBe(201);
    const counts = { updates: await rows(workUpdates), audit: await rows(auditLog), meter: await meter() };
    const again = await crew.post(`/api/work-orders/${id}/reports`).send(done(1.75, { clientRef }));
    expect(again.status).toBe(200);
    expect(again.body.duplicate).toBe(true);
    expect(again.body.update).toEqual(first.body.update);
    expect(again.body.order).toMatchObject({ id, status: 'done', version: first.body.order.version });
    expect({ updates: await rows(workUpdates), audit: await rows(auditLog), meter: await meter() }).toEqual(counts);
    // The same reference on another order is a mistake of the phone, not a retry.
    const other = await northWork();
    const taken = await crew.post(`/api/work-orders/${other}/reports`).send(done(1, { clientRef }));
    expect(taken.status).toBe(409);
    expect(taken.body.error.code).toBe('work_report/client_ref_taken');
  });

  test('should store a submission sent twice at once only once', async () => {
    const id = await northWork();
    const crew = await api.signIn('crew');
    const clientRef = ref();
    const before = await rows(workUpdates);
    const answers = await Promise.all([1, 2].map(() => crew.post(`/api/work-orders/${id}/reports`).send(done(1, { clientRef }))));
    expect(answers.map((a) => a.status).sort()).toEqual([200, 201]);
    expect(answers.map((a) => a.body.duplicate).sort()).toEqual([false, true]);
    expect(await rows(workUpdates)).toBe(before + 1);
  });

  test('should refuse a second done, a start or a skip after done, and a stale version', async () => {
    const id = await northWork();
    const crew = await api.signIn('crew');
    expect((await crew.post(`/api/work-orders/${id}/reports`).send(done(1, { version: 1 }))).status).toBe(201);
    const before = await rows(workUpdates);
    for (const body of [done(1), { status: 'started' }, { status: 'skipped', note: 'rain' }]) {
      const res = await crew.post(`/api/work-orders/${id}/reports`).send(body);
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('work_report/already_done');
      expect(res.body.error.message).toMatch(/already (logged as )?done/);
    }
    const stale = await northWork();
    expect((await crew.post(`/api/work-orders/${stale}/reports`).send({ status: 'started', version: 1 })).status).toBe(201);
    const res = await crew.post(`/api/work-orders/${stale}/reports`).send(done(1, { version: 1 }));
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('work_order/version_conflict');
    expect(await rows(workUpdates)).toBe(before + 1);
    expect((await order(stale)).status).toBe('started');
  });

  test('should let a skipped order be done later the same day', async () => {
    const id = await northWork();
    const crew = await api.signIn('crew');
    expect((await crew.post(`/api/work-orders/${id}/reports`).send({ status: 'skipped', note: 'Standing water on the north end' })).status).toBe(201);
    expect((await order(id)).status).toBe('skipped');
    expect((await crew.post(`/api/work-orders/${id}/reports`).send(done(1))).status).toBe(201);
    expect((await order(id)).status).toBe('done');
  });

  test('should refuse bad input with a 400 and its issue, writing nothing', async () => {
    const id = await northWork();
    const crew = await api.signIn('crew');
    const before = { updates: await rows(workUpdates), audit: await rows(auditLog) };
    const cases: [unknown, string][] = [
      [{ status: 'finished' }, 'body.status'],
      [{ status: 'done' }, 'body.actualHours'],
      [{ status: 'done', actualHours: -1 }, 'body.actualHours'],
      [{ status: 'done', actualHours: 25 }, 'body.actualHours'],
      [{ status: 'done', actualHours: 'two' }, 'body.actualHours'],
      [{ status: 'skipped' }, 'body.note'],
      [{ status: 'skipped', note: '   ' }, 'body.note'],
      [{ status: 'started', note: 'x'.repeat(2001) }, 'body.note'],
      [{ status: 'started', clientRef: 'bad ref!' }, 'body.clientRef'],
      [{ status: 'started', reportedAt: 'yesterday' }, 'body.reportedAt'],
      [{ status: 'started', reportedAt: new Date(Date.now() + 86_400_000).toISOString() }, 'body.reportedAt'],
      [{ status: 'started', version: 'one' }, 'body.version'],
    ];
    for (const [body, pathName] of cases) {
      const res = await crew.post(`/api/work-orders/${id}/reports`).send(body as object);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.details.issues.map((i: { path: string }) => i.path)).toContain(pathName);
    }
    const malformed = await crew.post(`/api/work-orders/${id}/reports`).set('Content-Type', 'application/json').send('{"status":');
    expect(malformed.status).toBe(400);
    expect({ updates: await rows(workUpdates), audit: await rows(auditLog) }).toEqual(before);
    expect((await order(id)).status).toBe('assigned');
  });
});

const png = (width: number, height: number) =>
  sharp({ create: { width, height, channels: 3, background: { r: 40, g: 140, b: 60 } } })
    .png()
    .toBuffer();

describe('work photos', () => {
  test('should shrink a large photo to 1600 px on the long side, as a JPEG without metadata', async () => {
    const id = await northWork();
    const crew = await api.signIn('crew');
    const big = await sharp({ create: { width: 3000, height: 2000, channels: 3, background: '#000', noise: { type: 'gaussian', mean: 128, sigma: 30 } } })
      .jpeg({ quality: 90 })
      .toBuffer();
    expect(big.length).toBeLessThan(12 * 1024 * 1024);
    const res = await crew.post(`/api/work-orders/${id}/photos`).attach('photo', big, { filename: '../../etc/passwd.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(201);
    expect(res.body.photo).toMatchObject({ width: 1600, height: 1067, url: `/api/work-orders/${id}/photos/${res.body.photo.id}` });
    const [row] = await db().select().from(workPhotos).where(eq(workPhotos.id, res.body.photo.id));
    expect(row!.fileName).toMatch(/^wo\d+-[0-9a-f-]+\.jpg$/);
    const stored = fs.readFileSync(path.join(uploadsDir, row!.fileName));
    expect(stored.length).toBeLessThan(big.length);
    expect(stored.length).toBe(row!.bytes);
    const meta = await sharp(stored).metadata();
    expect(meta).toMatchObject({ format: 'jpeg', width: 1600, height: 1067 });
    expect(meta.exif).toBeUndefined();

    const got = await crew.get(res.body.photo.url).buffer(true);
    expect(got.status).toBe(200);
    expect(got.headers['content-type']).toBe('image/jpeg');
    expect(Buffer.compare(got.body as Buffer, stored)).toBe(0);
    const detail = await crew.get(`/api/work-orders/${id}`);
    expect(detail.body.photos).toEqual([expect.objectContaining({ id: res.body.photo.id, width: 1600, height: 1067, url: res.body.photo.url })]);
    expect(detail.body.order.photoCount).toBe(1);
  });

  test('should turn a photo upright by its EXIF orientation and drop the tag', async () => {
    const id = await northWork();
    const crew = await api.signIn('crew');
    const sideways = await sharp({ create: { width: 300, height: 200, channels: 3, background: '#7a5' } })
      .jpeg()
      .withMetadata({ orientation: 6 })
      .toBuffer();
    expect((await sharp(sideways).metadata()).orientation).toBe(6);
    const res = await crew.post(`/api/work-orders/${id}/photos`).attach('photo', sideways, 'phone.jpg');
    expect(res.status).toBe(201);
    expect(res.body.photo).toMatchObject({ width: 200, height: 300 });
    const [row] = await db().select().from(workPhotos).where(eq(workPhotos.id, res.body.photo.id));
    const meta = await sharp(fs.readFileSync(path.join(uploadsDir, row!.fileName))).metadata();
    expect(meta.orientation).toBeUndefined();
  });

  test('should refuse a photo over 12 MB (413) and a file that is not a photo (415)', async () => {
    const id = await northWork();
    const crew = await api.signIn('crew');
    const before = await rows(workPhotos);
    const huge = Buffer.concat([await png(10, 10), Buffer.alloc(12 * 1024 * 1024 + 10)]);
    const tooBig = await crew.post(`/api/work-orders/${id}/photos`).attach('photo', huge, { filename: 'big.png', contentType: 'image/png' });
    expect(tooBig.status).toBe(413);
    expect(tooBig.body.error.code).toBe('work_photo/too_large');
    const text = await crew.post(`/api/work-orders/${id}/photos`).attach('photo', Buffer.from('not a photo at all'), { filename: 'field.png', contentType: 'image/png' });
    expect(text.status).toBe(415);
    expect(text.body.error.message).toMatch(/JPEG, PNG or WebP/);
    const gif = await sharp({ create: { width: 20, height: 20, channels: 3, background: '#fff' } }).gif().toBuffer();
    const gifRes = await crew.post(`/api/work-orders/${id}/photos`).attach('photo', gif, { filename: 'a.jpg', contentType: 'image/jpeg' });
    expect(gifRes.status).toBe(415);
    const none = await crew.post(`/api/work-orders/${id}/photos`).field('clientRef', ref());
    expect(none.status).toBe(400);
    expect(await rows(workPhotos)).toBe(before);
  });

  test('should store a photo uploaded twice at once only once', async () => {
    const id = await northWork();
    const crew = await api.signIn('crew');
    const image = await png(64, 48);
    const clientRef = ref();
    const answers = await Promise.all([1, 2].map(() => crew.post(`/api/work-orders/${id}/photos`).field('clientRef', clientRef).attach('photo', image, 'a.png')));
    expect(answers.map((a) => a.status).sort()).toEqual([200, 201]);
    expect(new Set(answers.map((a) => a.body.photo.id)).size).toBe(1);
    expect((await db().select({ n: count() }).from(workPhotos).where(eq(workPhotos.workOrderId, id)))[0]!.n).toBe(1);
    const served = await crew.get(answers[0]!.body.photo.url);
    expect(served.status).toBe(200);
  });

  test('should keep at most six photos on an order and store a retried upload once', async () => {
    const id = await northWork();
    const crew = await api.signIn('crew');
    const image = await png(64, 48);
    const firstRef = ref();
    const first = await crew.post(`/api/work-orders/${id}/photos`).field('clientRef', firstRef).attach('photo', image, 'a.png');
    expect(first.status).toBe(201);
    const again = await crew.post(`/api/work-orders/${id}/photos`).field('clientRef', firstRef).attach('photo', image, 'a.png');
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ duplicate: true, photo: { id: first.body.photo.id } });
    for (let i = 0; i < 5; i++) expect((await crew.post(`/api/work-orders/${id}/photos`).attach('photo', image, 'b.png')).status).toBe(201);
    const seventh = await crew.post(`/api/work-orders/${id}/photos`).attach('photo', image, 'c.png');
    expect(seventh.status).toBe(409);
    expect(seventh.body.error.message).toMatch(/at most 6 photos/);
    expect((await db().select({ n: count() }).from(workPhotos).where(eq(workPhotos.workOrderId, id)))[0]!.n).toBe(6);
  });

  test('should let only those who may log the order add photos, and those who may read it see them', async () => {
    const id = await northWork();
    const image = await png(32, 32);
    for (const role of ['head', 'partner', 'foremanSouth'] as const) {
      expect((await (await api.signIn(role)).post(`/api/work-orders/${id}/photos`).attach('photo', image, 'x.png')).status).toBe(403);
    }
    const foreman = await api.signIn('foreman');
    const added = await foreman.post(`/api/work-orders/${id}/photos`).attach('photo', image, 'x.png');
    expect(added.status).toBe(201);
    const url = added.body.photo.url as string;
    expect((await (await api.signIn('crew')).get(url)).status).toBe(200);
    expect((await (await api.signIn('head')).get(url)).status).toBe(200);
    expect((await (await api.signIn('foremanSouth')).get(url)).status).toBe(403);
    expect((await supertest(api.app).get(url)).status).toBe(401);
    const other = await northWork();
    expect((await foreman.get(`/api/work-orders/${other}/photos/${added.body.photo.id}`)).status).toBe(404);
  });
});
