import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import { describe, expect, test } from 'vitest';
import { auditLog, equipment, fieldChecks, fields, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { addEquipment, giveWork } from '../support/fixture.ts';
import { useTestApi } from '../support/app.ts';
import { useTempDir } from '../support/temp-dir.ts';

const api = useTestApi({ UPLOADS_DIR: useTempDir('swardwise-crew-work-') });

const db = () => api.database.db;
const order = async (id: number) => (await db().select().from(workOrders).where(eq(workOrders.id, id)))[0]!;
const northWork = (days = 0) => giveWork(db(), api.fixture.fields.northSoccer, api.fixture.crews.north, days);
const jpeg = () => sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 40, g: 140, b: 60 } } }).jpeg().toBuffer();
const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000).toISOString();

describe('the crew’s note and photos reach the office', () => {
  test('should carry a report’s note and photo on the order, the field’s work history and Records', async () => {
    const id = await northWork();
    const crew = await api.signIn('crew');
    expect((await crew.post(`/api/work-orders/${id}/photos`).attach('photo', await jpeg(), { filename: 'goalmouth.jpg', contentType: 'image/jpeg' })).status).toBe(201);
    const report = await crew.post(`/api/work-orders/${id}/reports`).send({ status: 'done', actualHours: 1.3, note: 'Goalmouth worn bare at the south end' });
    expect(report.status).toBe(201);

    const foreman = await api.signIn('foreman');
    const answer = await foreman.get(`/api/work-orders/${id}`);
    expect(answer.body.updates).toEqual([expect.objectContaining({ status: 'done', note: 'Goalmouth worn bare at the south end', createdByName: expect.any(String) })]);
    expect(answer.body.photos).toHaveLength(1);

    const history = await foreman.get(`/api/fields/${api.fixture.fields.northSoccer}/work`);
    expect(history.status).toBe(200);
    const entry = history.body.items.find((e: { order: { id: number } }) => e.order.id === id);
    expect(entry).toBeDefined();
    expect(entry.updates.map((u: { note: string }) => u.note)).toContain('Goalmouth worn bare at the south end');
    expect(entry.photos[0].url).toBe(`/api/work-orders/${id}/photos/${answer.body.photos[0].id}`);
    expect((await foreman.get(entry.photos[0].url)).status).toBe(200);

    const records = await foreman.get('/api/records').query({ from: report.body.order.plannedDate, to: report.body.order.plannedDate });
    expect(records.status).toBe(200);
    const note = records.body.crewNotes.find((n: { orderId: number }) => n.orderId === id);
    expect(note).toMatchObject({ fieldName: 'Soccer 1', notes: ['Goalmouth worn bare at the south end'], photos: [{ id: answer.body.photos[0].id }] });
  });

  test('should page the field’s history newest first and keep it inside the caller’s scope', async () => {
    const field = api.fixture.fields.northSoccer;
    const crew = await api.signIn('crew');
    const ids = [await northWork(-3), await northWork(-2), await northWork(-1)];
    for (const [i, id] of ids.entries()) {
      await crew.post(`/api/work-orders/${id}/reports`).send({ status: 'done', actualHours: 1, note: `job ${i}`, reportedAt: hoursAgo(72 - i * 24) });
    }
    const foreman = await api.signIn('foreman');
    const first = await foreman.get(`/api/fields/${field}/work`).query({ pageSize: 2 });
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ page: 1, pageSize: 2 });
    expect(first.body.total).toBeGreaterThanOrEqual(3);
    expect(first.body.items).toHaveLength(2);
    const all = (await foreman.get(`/api/fields/${field}/work`).query({ pageSize: 50 })).body.items.map((e: { order: { id: number } }) => e.order.id);
    // The three of this test appear newest first.
    expect(all.filter((x: number) => ids.includes(x))).toEqual([...ids].reverse());
    const second = await foreman.get(`/api/fields/${field}/work`).query({ pageSize: 2, page: 2 });
    expect(second.body.items[0].order.id).not.toBe(first.body.items[0].order.id);
    expect((await foreman.get(`/api/fields/${field}/work`).query({ page: 0 })).status).toBe(400);
    expect((await (await api.signIn('foremanSouth')).get(`/api/fields/${field}/work`)).status).toBe(403);
  });
});

describe('reopening a finished job', () => {
  test('should let the crew lead reopen his job the same day, back to its open state, with the earlier report kept', async () => {
    const id = await northWork();
    const crew = await api.signIn('crew');
    await crew.post(`/api/work-orders/${id}/reports`).send({ status: 'done', actualHours: 1.3, note: 'tapped by mistake' });
    const res = await crew.post(`/api/work-orders/${id}/reopen`).send({ reason: 'Not finished yet' });
    expect(res.status).toBe(200);
    expect(res.body.order).toMatchObject({ id, status: 'assigned', actualHours: null, doneAt: null });
    const row = await order(id);
    expect(row.status).toBe('assigned');
    const detail = (await crew.get(`/api/work-orders/${id}`)).body;
    expect(detail.updates.map((u: { status: string; note: string }) => [u.status, u.note])).toEqual([
      ['done', 'tapped by mistake'],
      ['assigned', 'Reopened (was done): Not finished yet'],
    ]);
    const audit = await db().select().from(auditLog).where(and(eq(auditLog.entity, 'work_order'), eq(auditLog.entityId, id))).orderBy(auditLog.id);
    const reopened = audit.find((a) => a.before?.status === 'done' && a.after?.status === 'assigned');
    expect(reopened?.actorId).toBe(api.fixture.users.crew.id);
    // The order can be logged again.
    expect((await crew.post(`/api/work-orders/${id}/reports`).send({ status: 'done', actualHours: 1.5 })).status).toBe(201);
  });

  test('should refuse the crew lead a job finished on an earlier day and let the foreman reopen it', async () => {
    const id = await northWork(-1);
    const crew = await api.signIn('crew');
    await crew.post(`/api/work-orders/${id}/reports`).send({ status: 'done', actualHours: 1, reportedAt: hoursAgo(30) });
    const refused = await crew.post(`/api/work-orders/${id}/reopen`).send({});
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/foreman/);
    expect((await order(id)).status).toBe('done');
    const foreman = await api.signIn('foreman');
    const res = await foreman.post(`/api/work-orders/${id}/reopen`).send({ reason: 'Lines not finished' });
    expect(res.status).toBe(200);
    expect((await order(id)).status).toBe('assigned');
    const audit = await db().select().from(auditLog).where(and(eq(auditLog.entity, 'work_order'), eq(auditLog.entityId, id))).orderBy(auditLog.id);
    expect(audit.some((a) => a.actorId === api.fixture.users.foreman.id && a.before?.status === 'done' && a.after?.status === 'assigned')).toBe(true);
  });

  test('should refuse an open job, another district’s foreman and a stale version', async () => {
    const id = await northWork();
    const foreman = await api.signIn('foreman');
    const open = await foreman.post(`/api/work-orders/${id}/reopen`).send({});
    expect(open.status).toBe(409);
    expect(open.body.error.code).toBe('work_report/not_finished');
    await (await api.signIn('crew')).post(`/api/work-orders/${id}/reports`).send({ status: 'skipped', note: 'Rain' });
    expect((await (await api.signIn('foremanSouth')).post(`/api/work-orders/${id}/reopen`).send({})).status).toBe(403);
    expect((await foreman.post(`/api/work-orders/${id}/reopen`).send({ version: 1 })).status).toBe(409);
    expect((await foreman.post(`/api/work-orders/${id}/reopen`).send({ reason: 42 })).status).toBe(400);
    expect((await order(id)).status).toBe('skipped');
  });

  test('should take a reopened done job’s hours back off the mower’s meter', async () => {
    const mower = await addEquipment(db(), { districtId: api.fixture.districts.north, crewId: api.fixture.crews.north, kind: 'rotary_mower', name: 'Reopen rotary', hourMeterH: 50 });
    const id = await northWork();
    await db().update(workOrders).set({ equipmentId: mower }).where(eq(workOrders.id, id));
    const crew = await api.signIn('crew');
    await crew.post(`/api/work-orders/${id}/reports`).send({ status: 'done', actualHours: 2 });
    await crew.post(`/api/work-orders/${id}/reopen`).send({});
    expect((await db().select().from(equipment).where(eq(equipment.id, mower)))[0]!.hourMeterH).toBe(50);
  });
});

describe('Today: the field’s status and where it is', () => {
  test('should carry the field’s status, reason and centre on each job', async () => {
    const id = await northWork();
    const items = (await (await api.signIn('crew')).get('/api/work-orders')).body.items;
    const job = items.find((o: { id: number }) => o.id === id);
    expect(job).toMatchObject({ fieldStatus: 'open', fieldStatusNote: '' });
    // The fixture's Soccer 1: 68 m × 105 m from its south-west corner at 37.62, −66.48, so its centre is 52.5 m north and 34 m east of it.
    expect(job.fieldLat).toBeCloseTo(37.62047, 4);
    expect(job.fieldLng).toBeCloseTo(-66.47961, 4);
  });

  test('should refuse done and started on a closed field with the reason, and take a skip', async () => {
    const field = api.fixture.fields.northSchoolFootball;
    const id = await giveWork(db(), field, api.fixture.crews.north);
    await db().update(fields).set({ status: 'closed', statusNote: 'Standing water after the storm' }).where(eq(fields.id, field));
    try {
      const crew = await api.signIn('crew');
      const done = await crew.post(`/api/work-orders/${id}/reports`).send({ status: 'done', actualHours: 1 });
      expect(done.status).toBe(409);
      expect(done.body.error.code).toBe('work_report/field_closed');
      expect(done.body.error.message).toMatch(/Standing water after the storm/);
      expect((await crew.post(`/api/work-orders/${id}/reports`).send({ status: 'started' })).status).toBe(409);
      expect((await order(id)).status).toBe('assigned');
      const job = (await crew.get(`/api/work-orders/${id}`)).body.order;
      expect(job).toMatchObject({ fieldStatus: 'closed', fieldStatusNote: 'Standing water after the storm' });
      expect((await crew.post(`/api/work-orders/${id}/reports`).send({ status: 'skipped', note: 'Field closed: standing water' })).status).toBe(201);
    } finally {
      await db().update(fields).set({ status: 'open', statusNote: '' }).where(eq(fields.id, field));
    }
  });
});

describe('a crew logs a field check from Today', () => {
  const checkWork = async () => {
    const id = await northWork();
    await db().update(workOrders).set({ task: 'field_check' }).where(eq(workOrders.id, id));
    return id;
  };
  const body = {
    turfCoverPct: 82,
    weedsPct: 6,
    bareWornPct: 12,
    bareAreas: ['goalmouths', 'centre'],
    heightMm: 70,
    hardnessReadingsG: [60, 75, 112],
    hardnessDevice: 'portable_2_25kg',
    evenness: 4,
    divots: 3,
    tornLeafTips: true,
    notes: 'South goalmouth bare',
    actualHours: 0.5,
  };

  test('should store the check in field_checks with its score and flags, mark the job done and list it on the field', async () => {
    const id = await checkWork();
    const crew = await api.signIn('crew');
    const res = await crew.post(`/api/work-orders/${id}/field-check`).send(body);
    expect(res.status).toBe(201);
    const rows = await db().select().from(fieldChecks).where(eq(fieldChecks.workOrderId, id));
    expect(rows).toHaveLength(1);
    const row = rows[0]!;
    expect(row).toMatchObject({ fieldId: api.fixture.fields.northSoccer, turfCoverPct: 82, barePct: 12, bareAreas: ['goalmouths', 'centre'], hardnessReadings: [60, 75, 112], gmaxDevice: 'portable_2_25kg', divots: 3, tornLeafTips: true, checkedBy: api.fixture.users.crew.id });
    // real column: single precision.
    expect(row.gmax).toBeCloseTo((60 + 75 + 112) / 3, 4);
    expect(row.score).toBeGreaterThan(0);
    expect(row.score).toBeLessThan(100);
    // 112 G on the 2.25 kg tester is above the department's 100 G limit; the level's HOC of Soccer 1 is well under 70 ÷ 1.5 mm.
    expect(row.flags).toEqual(expect.arrayContaining(['close_field_caution', 'overdue_mowing', 'check_blade_sharpness', 'cover_below_target']));
    expect(res.body.cautions.join(' ')).toMatch(/head injury/);
    expect(res.body.advice.join(' ')).toMatch(/blades’ sharpness before suspecting disease/);
    expect((await order(id)).status).toBe('done');
    expect((await order(id)).actualHours).toBe(0.5);
    const listed = await (await api.signIn('foreman')).get(`/api/fields/${api.fixture.fields.northSoccer}/checks`);
    expect(listed.status).toBe(200);
    expect(listed.body.items[0]).toMatchObject({ id: row.id, workOrderId: id, checkedByName: expect.any(String) });
    const audit = await db().select().from(auditLog).where(and(eq(auditLog.entity, 'field_check'), eq(auditLog.entityId, row.id))).orderBy(auditLog.id);
    expect(audit).toHaveLength(1);
  });

  test('should refuse a bad check, a job that is not a check and another crew’s job, writing nothing', async () => {
    const id = await checkWork();
    const crew = await api.signIn('crew');
    const before = (await db().select().from(fieldChecks)).length;
    const bad = await crew.post(`/api/work-orders/${id}/field-check`).send({ ...body, turfCoverPct: 90, bareWornPct: 20 });
    expect(bad.status).toBe(400);
    const noTester = await crew.post(`/api/work-orders/${id}/field-check`).send({ ...body, hardnessDevice: null });
    expect(noTester.status).toBe(400);
    expect(noTester.body.error.details.issues[0].path).toMatch(/hardnessDevice/);
    const mow = await northWork();
    expect((await crew.post(`/api/work-orders/${mow}/field-check`).send(body)).status).toBe(409);
    const south = await giveWork(db(), api.fixture.fields.southBaseball, api.fixture.crews.south);
    expect((await crew.post(`/api/work-orders/${south}/field-check`).send(body)).status).toBe(403);
    expect((await db().select().from(fieldChecks)).length).toBe(before);
    expect((await order(id)).status).toBe('assigned');
  });
});
