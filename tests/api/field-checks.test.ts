import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import supertest from 'supertest';
import { describe, expect, test } from 'vitest';
import { DEFAULT_PARAMETERS, isoToDayNumber } from '@swardwise/domain';
import { auditLog, fieldCheckPhotos, fieldChecks, fields, sites, standards, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { addUser, giveWork } from '../support/fixture.ts';
import { useTestApi } from '../support/app.ts';
import { useTempDir } from '../support/temp-dir.ts';

const api = useTestApi({ UPLOADS_DIR: useTempDir('swardwise-field-checks-') });

const db = () => api.database.db;
const field = () => api.fixture.fields.northSoccer;
const checkCount = async () => (await db().select().from(fieldChecks)).length;
const jpeg = () => sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 40, g: 140, b: 60 } } }).jpeg().toBuffer();
const body = {
  turfCoverPct: 84,
  weedsPct: 6,
  bareWornPct: 10,
  bareAreas: ['goalmouths'],
  heightMm: 70,
  hardnessReadingsG: [62, 70, 118],
  hardnessDevice: 'portable_2_25kg',
  evenness: 4,
  divots: 4,
  tornLeafTips: false,
  notes: 'North goalmouth thin',
};

describe('staff log a field check from the field page', () => {
  test('should let the district’s foreman log a check without a work order, store the days since the cut and list it with the level’s target', async () => {
    await db().update(fields).set({ lastMowedOn: '2026-05-01' }).where(eq(fields.id, field()));
    const before = (await db().select().from(workOrders)).length;
    const foreman = await api.signIn('foreman');
    const res = await foreman.post(`/api/fields/${field()}/checks`).send(body);
    expect(res.status).toBe(201);
    expect(res.body.check).toMatchObject({ fieldId: field(), workOrderId: null, checkedBy: api.fixture.users.foreman.id, heightMm: 70, photos: [] });
    // 118 G on the 2.25 kg tester is above its 100 G limit: the close-field caution.
    expect(res.body.check.flags).toContain('close_field_caution');
    expect(res.body.cautions.join(' ')).toMatch(/head injury/);
    const [row] = await db().select().from(fieldChecks).where(eq(fieldChecks.id, res.body.check.id));
    expect(row!.daysSinceCut).toBe(isoToDayNumber(row!.checkedOn) - isoToDayNumber('2026-05-01'));
    expect((await db().select().from(workOrders)).length).toBe(before);
    const audit = await db().select().from(auditLog).where(and(eq(auditLog.entity, 'field_check'), eq(auditLog.entityId, row!.id))).orderBy(auditLog.id);
    expect(audit).toHaveLength(1);

    const listed = await foreman.get(`/api/fields/${field()}/checks`);
    expect(listed.status).toBe(200);
    expect(listed.body.items[0]).toMatchObject({ id: row!.id, daysSinceCut: row!.daysSinceCut, photos: [] });
    const [{ lvl }] = (await db().select({ lvl: fields.maintenanceLevel }).from(fields).where(eq(fields.id, field()))) as [{ lvl: number }];
    const [level] = await db().select().from(standards).where(eq(standards.level, lvl));
    expect(listed.body.targetScore).toBe(level!.data.targetScore);
  });

  test('should let an administrator log one too', async () => {
    expect((await (await api.signIn('admin')).post(`/api/fields/${field()}/checks`).send(body)).status).toBe(201);
  });

  test('should refuse a crew lead of another district, a partner, another district’s foreman and a signed-out caller before reading the body, writing nothing', async () => {
    const [south] = await db().select({ districtId: sites.districtId }).from(fields).innerJoin(sites, eq(sites.id, fields.siteId)).where(eq(fields.id, api.fixture.fields.southBaseball));
    const southLead = await addUser(db(), 'crewSouthLead', 'crew', { districtId: south!.districtId, crewId: api.fixture.crews.south });
    const n = await checkCount();
    const southCrew = await api.signInAs(southLead.email);
    // A bad body would be a 400 if it were read: a 403 says the caller was refused first.
    const refused = await southCrew.post(`/api/fields/${field()}/checks`).send({ turfCoverPct: 'lots' });
    expect(refused.status).toBe(403);
    expect((await southCrew.post(`/api/fields/${field()}/checks`).send(body)).status).toBe(403);
    const partner = await api.signIn('partner');
    // The partner's site is the school's: it may read that field but not log a check on it.
    expect((await partner.post(`/api/fields/${api.fixture.fields.northSchoolFootball}/checks`).send({})).status).toBe(403);
    expect((await partner.post(`/api/fields/${field()}/checks`).send(body)).status).toBe(403);
    expect((await (await api.signIn('foremanSouth')).post(`/api/fields/${field()}/checks`).send(body)).status).toBe(403);
    expect((await (await api.signIn('head')).post(`/api/fields/${field()}/checks`).send(body)).status).toBe(403);
    expect((await supertest(api.app).post(`/api/fields/${field()}/checks`).send(body)).status).toBe(401);
    expect(await checkCount()).toBe(n);
  });

  test('should answer a bad body with 400 and the message under its field, writing nothing', async () => {
    const n = await checkCount();
    const foreman = await api.signIn('foreman');
    const over = await foreman.post(`/api/fields/${field()}/checks`).send({ ...body, turfCoverPct: 90, bareWornPct: 20 });
    expect(over.status).toBe(400);
    expect(over.body.error.details.issues).toEqual(expect.arrayContaining([expect.objectContaining({ path: expect.stringMatching(/bareWornPct/), message: expect.stringMatching(/together at most 100 %/) })]));
    const noTester = await foreman.post(`/api/fields/${field()}/checks`).send({ ...body, hardnessDevice: null });
    expect(noTester.status).toBe(400);
    expect(noTester.body.error.details.issues[0]).toMatchObject({ path: expect.stringMatching(/hardnessDevice/), message: 'name the tester the readings were taken with' });
    const missing = await foreman.post(`/api/fields/${field()}/checks`).send({});
    expect(missing.status).toBe(400);
    expect(missing.body.error.message).toBeTruthy();
    expect((await foreman.post(`/api/fields/999999/checks`).send(body)).status).toBe(404);
    expect(await checkCount()).toBe(n);
  });
});

describe('photos of a field-page check', () => {
  test('should store a photo, list it with the check and serve it; refuse bad uploads and callers outside the district', async () => {
    const foreman = await api.signIn('foreman');
    const check = (await foreman.post(`/api/fields/${field()}/checks`).send(body)).body.check;
    const url = `/api/fields/${field()}/checks/${check.id}/photos`;
    const added = await foreman.post(url).field('clientRef', 'check-photo-0001').attach('photo', await jpeg(), { filename: 'goal.jpg', contentType: 'image/jpeg' });
    expect(added.status).toBe(201);
    const again = await foreman.post(url).field('clientRef', 'check-photo-0001').attach('photo', await jpeg(), { filename: 'goal.jpg', contentType: 'image/jpeg' });
    expect(again.status).toBe(200);
    expect(again.body.duplicate).toBe(true);
    const listed = await foreman.get(`/api/fields/${field()}/checks`);
    const item = listed.body.items.find((c: { id: number }) => c.id === check.id);
    expect(item.photos).toHaveLength(1);
    const image = await foreman.get(item.photos[0].url);
    expect(image.status).toBe(200);
    expect(image.headers['content-type']).toMatch(/image\/jpeg/);

    const notImage = await foreman.post(url).attach('photo', Buffer.from('not a photo at all'), { filename: 'x.jpg', contentType: 'image/jpeg' });
    expect(notImage.status).toBe(415);
    expect(notImage.body.error.code).toBe('work_photo/not_an_image');
    const noFile = await foreman.post(url).field('clientRef', 'check-photo-0002');
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.message).toMatch(/Choose a photo/);
    expect((await (await api.signIn('foremanSouth')).post(url).attach('photo', await jpeg(), { filename: 'x.jpg', contentType: 'image/jpeg' })).status).toBe(403);
    expect((await (await api.signIn('partner')).get(item.photos[0].url)).status).toBe(403);
    expect((await db().select().from(fieldCheckPhotos).where(eq(fieldCheckPhotos.fieldCheckId, check.id))).length).toBe(1);

    // A check logged on a work order keeps its photos with the order.
    const orderId = await giveWork(db(), field(), api.fixture.crews.north);
    await db().update(workOrders).set({ task: 'field_check' }).where(eq(workOrders.id, orderId));
    const onOrder = (await (await api.signIn('crew')).post(`/api/work-orders/${orderId}/field-check`).send(body)).body.check;
    const refused = await foreman.post(`/api/fields/${field()}/checks/${onOrder.id}/photos`).attach('photo', await jpeg(), { filename: 'x.jpg', contentType: 'image/jpeg' });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('field_check/photos_on_order');
  });

  test('should keep six photos of a check, each audited, and refuse a seventh with 409, storing nothing more', async () => {
    const foreman = await api.signIn('foreman');
    const check = (await foreman.post(`/api/fields/${field()}/checks`).send(body)).body.check;
    const url = `/api/fields/${field()}/checks/${check.id}/photos`;
    for (let i = 1; i <= 6; i++) expect((await foreman.post(url).field('clientRef', `check-limit-${i}`).attach('photo', await jpeg(), { filename: 'p.jpg', contentType: 'image/jpeg' })).status).toBe(201);
    const seventh = await foreman.post(url).field('clientRef', 'check-limit-7').attach('photo', await jpeg(), { filename: 'p.jpg', contentType: 'image/jpeg' });
    expect(seventh.status).toBe(409);
    expect(seventh.body.error).toMatchObject({ code: 'work_photo/too_many', message: 'A field check keeps at most 6 photos; this one has 6' });
    const stored = await db().select().from(fieldCheckPhotos).where(eq(fieldCheckPhotos.fieldCheckId, check.id));
    expect(stored).toHaveLength(6);
    const audited = await db().select().from(auditLog).where(eq(auditLog.entity, 'field_check_photo'));
    expect(audited.filter((a) => stored.some((p) => p.id === a.entityId)).map((a) => a.action)).toEqual(['create', 'create', 'create', 'create', 'create', 'create']);
  });
});

describe('the field’s growth calibration', () => {
  test('should compare each check’s growth since the cut with the engine’s prediction and give the factor and its confidence', async () => {
    const lawn = api.fixture.fields.northLawn;
    const foreman = await api.signIn('foreman');
    const empty = (await foreman.get(`/api/fields/${lawn}/growth-calibration`)).body.calibration;
    expect(empty).toMatchObject({ n: 0, factor: 1, confidence: 'none', usedForMowing: false });

    // Three checks inside the fixture's weather (May 4 – June 7), 4 to 6 days after a cut.
    const base = { fieldId: lawn, checkedBy: api.fixture.users.foreman.id, turfCoverPct: 90, weedsPct: 5, barePct: 5, score: 80 };
    await db().insert(fieldChecks).values([
      { ...base, checkedOn: '2026-05-20', daysSinceCut: 4, heightMm: empty.hocMm + 9 },
      { ...base, checkedOn: '2026-05-27', daysSinceCut: 6, heightMm: empty.hocMm + 16 },
      { ...base, checkedOn: '2026-06-03', daysSinceCut: 5, heightMm: empty.hocMm + 12 },
      { ...base, checkedOn: '2026-06-04', daysSinceCut: 40, heightMm: empty.hocMm + 60 },
    ]);
    const res = await foreman.get(`/api/fields/${lawn}/growth-calibration`);
    expect(res.status).toBe(200);
    const c = res.body.calibration;
    expect(c.n).toBe(3);
    expect(c.skipped).toEqual([expect.objectContaining({ checkedOn: '2026-06-04', reason: expect.stringMatching(/40 days after the cut/) })]);
    const observed = c.readings.reduce((s: number, r: { observedMm: number }) => s + r.observedMm, 0);
    const predicted = c.readings.reduce((s: number, r: { predictedMm: number }) => s + r.predictedMm, 0);
    expect(observed).toBeCloseTo(9 + 16 + 12, 3);
    expect(predicted).toBeGreaterThan(0);
    expect(c.factor).toBeCloseTo(observed / predicted, 9);
    expect(c.defaultRateMmPerDay).toBe(DEFAULT_PARAMETERS.maxGrowthMmPerDay.tall_fescue);
    expect(c.calibratedRateMmPerDay).toBeCloseTo(c.defaultRateMmPerDay * c.factor, 9);
    expect(['low', 'medium']).toContain(c.confidence);
    expect(c.stationName).toBe('Test Weather');

    expect((await (await api.signIn('partner')).get(`/api/fields/${lawn}/growth-calibration`)).status).toBe(403);
    expect((await (await api.signIn('foremanSouth')).get(`/api/fields/${lawn}/growth-calibration`)).status).toBe(403);
  });
});
