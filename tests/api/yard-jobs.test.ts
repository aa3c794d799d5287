import { and, eq, isNull } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { auditLog, equipment, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { startTestApi, type TestApi } from '../support/app.ts';
import { addCrew, addUser } from '../support/fixture.ts';

let api: TestApi;
// The fixture's weather runs 4 May – 7 June 2026.
const WEEK = '2026-05-25';
const RANGE = `from=${WEEK}&to=2026-05-31`;
let mowerId: number;
let otherLead: string;

type Order = { id: number; fieldId: number | null; siteId: number | null; task: string; plannedDate: string; crewId: number | null; equipmentId: number | null; equipmentName: string | null; siteName: string; status: string; version: number; details: Record<string, unknown> };

beforeAll(async () => {
  api = await startTestApi();
  const db = api.database.db;
  const second = await addCrew(db, api.fixture.districts.north, 'North Crew B');
  otherLead = (await addUser(db, 'leadB', 'crew', { districtId: api.fixture.districts.north, crewId: second })).email;
  const foreman = await api.signIn('foreman');
  // 410 h on the meter, sharpened at 380 h, every 25 h (rotary blades: 8–25 h, common practice, from memory): 30 h since, due.
  const res = await foreman.post('/api/equipment').send({
    districtId: api.fixture.districts.north, crewId: api.fixture.crews.north, kind: 'rotary_mower', name: 'Rotary 72 (M-4)', cuttingWidthM: 1.83, speedKmh: 8, fieldEfficiency: 0.8, hocMinMm: 25, hocMaxMm: 115,
    hourMeterH: 410, sharpenIntervalH: 25, lastSharpenedAtH: 380,
  });
  expect(res.status).toBe(201);
  mowerId = res.body.equipment.id;
});
afterAll(() => api.close());

const yardJobs = (orders: Order[]) => orders.filter((o) => o.task === 'sharpen_blades');

describe('blade sharpening at the yard', () => {
  let jobId: number;

  test('should put a sharpening job for a due mower on the board, at the yard, on the crew\u2019s first working day', async () => {
    const foreman = await api.signIn('foreman');
    const res = await foreman.post('/api/week-plans/generate').send({ districtId: api.fixture.districts.north, weekStart: WEEK });
    expect(res.status).toBe(200);
    const jobs = yardJobs(res.body.board.orders);
    expect(jobs).toHaveLength(1);
    expect(jobs[0]).toMatchObject({ fieldId: null, siteId: null, equipmentId: mowerId, equipmentName: 'Rotary 72 (M-4)', crewId: api.fixture.crews.north, plannedDate: WEEK, plannedHours: 0.75, status: 'planned' });
    expect(jobs[0]!.siteName).toMatch(/yard/i);
    expect(jobs[0]!.details).toMatchObject({ hoursSinceSharpening: 30, sharpenIntervalH: 25 });
    expect((jobs[0]!.details.cautions as string[]).join(' ')).toMatch(/gloves.*spark plug.*manufacturer/s);
    expect(res.body.diff.added.filter((a: { task: string }) => a.task === 'sharpen_blades')).toEqual([expect.objectContaining({ fieldId: null, fieldName: 'Rotary 72 (M-4)' })]);
    // The crew's Monday counts the yard job's hours and has no stop for it.
    const monday = res.body.board.crewDays.find((d: { crewId: number; date: string }) => d.crewId === api.fixture.crews.north && d.date === WEEK);
    expect(monday.orderIds[0]).toBe(jobs[0]!.id);
    jobId = jobs[0]!.id;
  });

  test('should keep the same job when the week is generated again', async () => {
    const foreman = await api.signIn('foreman');
    const res = await foreman.post('/api/week-plans/generate').send({ districtId: api.fixture.districts.north, weekStart: WEEK });
    expect(yardJobs(res.body.board.orders).map((o) => o.id)).toEqual([jobId]);
    expect(res.body.diff.added.some((a: { task: string }) => a.task === 'sharpen_blades')).toBe(false);
  });

  test('should show the job to the foreman and the mower\u2019s crew lead, not to another crew\u2019s lead or a partner', async () => {
    const foreman = await api.signIn('foreman');
    expect(yardJobs((await foreman.get(`/api/work-orders?${RANGE}`)).body.items).map((o) => o.id)).toEqual([jobId]);
    const lead = await api.signIn('crew');
    const mine = await lead.get(`/api/work-orders?${RANGE}`);
    expect(mine.status).toBe(200);
    expect(yardJobs(mine.body.items).map((o) => o.id)).toEqual([jobId]);
    expect((await lead.get(`/api/work-orders/${jobId}`)).status).toBe(200);
    const other = await api.signInAs(otherLead);
    expect(yardJobs((await other.get(`/api/work-orders?${RANGE}`)).body.items)).toEqual([]);
    expect([403, 404]).toContain((await other.get(`/api/work-orders/${jobId}`)).status);
    expect([403, 404]).toContain((await other.post(`/api/work-orders/${jobId}/reports`).send({ status: 'done', actualHours: 1 })).status);
    const partner = await api.signIn('partner');
    const seen = await partner.get(`/api/work-orders?${RANGE}`);
    expect(seen.status).toBe(200);
    expect(yardJobs(seen.body.items)).toEqual([]);
    expect([403, 404]).toContain((await partner.get(`/api/work-orders/${jobId}`)).status);
    expect(JSON.stringify((await partner.get('/api/partner/fields')).body)).not.toMatch(/sharpen/i);
  });

  test('should refuse a hand-made sharpening job on a field and a yard job moved to another machine', async () => {
    const foreman = await api.signIn('foreman');
    const onField = await foreman.post('/api/work-orders').send({ fieldId: api.fixture.fields.northSoccer, task: 'sharpen_blades', plannedDate: WEEK, plannedHours: 1 });
    expect(onField.status).toBe(400);
    const [job] = await api.database.db.select().from(workOrders).where(eq(workOrders.id, jobId));
    const moved = await foreman.patch(`/api/work-orders/${jobId}`).send({ version: job!.version, equipmentId: null });
    expect(moved.status).toBe(400);
  });

  test('should record the hour meter reading and reset the blades when the crew logs it done', async () => {
    const lead = await api.signIn('crew');
    const tooLow = await lead.post(`/api/work-orders/${jobId}/reports`).send({ status: 'done', actualHours: 0.75, hourMeterH: 400 });
    expect(tooLow.status).toBe(400);
    const res = await lead.post(`/api/work-orders/${jobId}/reports`).send({ status: 'done', actualHours: 0.75, hourMeterH: 412.5, note: 'Blades sharpened and balanced' });
    expect(res.status).toBe(201);
    expect(res.body.order).toMatchObject({ status: 'done', details: expect.objectContaining({ sharpenedAtH: 412.5, previousSharpenedAtH: 380 }) });
    const [unit] = await api.database.db.select().from(equipment).where(eq(equipment.id, mowerId));
    // The reading is the meter's; the bench time is not engine time.
    expect(unit).toMatchObject({ hourMeterH: 412.5, lastSharpenedAtH: 412.5 });
    const audits = await api.database.db.select().from(auditLog).where(and(eq(auditLog.entity, 'equipment'), eq(auditLog.entityId, mowerId))).orderBy(auditLog.id);
    expect(audits.at(-1)!.after).toMatchObject({ lastSharpenedAtH: 412.5 });
    const foreman = await api.signIn('foreman');
    const list = await foreman.get('/api/equipment');
    expect(list.body.items.find((e: { id: number }) => e.id === mowerId)).toMatchObject({ hoursSinceSharpening: 0, sharpeningDue: false, bladeState: 'ok' });
    // Generated again: the done job stays, no new one.
    const again = await foreman.post('/api/week-plans/generate').send({ districtId: api.fixture.districts.north, weekStart: WEEK });
    expect(yardJobs(again.body.board.orders).map((o) => [o.id, o.status])).toEqual([[jobId, 'done']]);
  });

  test('should not break records, audit words or the crew\u2019s lists on an order without a field', async () => {
    const foreman = await api.signIn('foreman');
    const records = await foreman.get(`/api/records?${RANGE}&districtId=${api.fixture.districts.north}`);
    expect(records.status).toBe(200);
    expect(records.body.byField.every((f: { fieldId: number | null }) => f.fieldId !== null)).toBe(true);
    expect(records.body.byCrew.find((c: { crewId: number }) => c.crewId === api.fixture.crews.north).ordersDone).toBeGreaterThanOrEqual(1);
    expect(records.body.crewNotes.find((n: { orderId: number }) => n.orderId === jobId)).toMatchObject({ fieldId: null, notes: ['Blades sharpened and balanced'] });
    const audit = await foreman.get('/api/audit?entity=work_order');
    expect(audit.status).toBe(200);
    expect(JSON.stringify(audit.body)).toContain('Sharpen blades \u2014 Rotary 72 (M-4) at the yard');
    const lead = await api.signIn('crew');
    expect((await lead.get(`/api/work-orders?${RANGE}`)).status).toBe(200);
    expect((await foreman.get(`/api/fields/${api.fixture.fields.northSoccer}/work`)).status).toBe(200);
    // Reopened by the foreman: the machine's last sharpening goes back.
    const [job] = await api.database.db.select().from(workOrders).where(isNull(workOrders.fieldId));
    expect((await foreman.post(`/api/work-orders/${job!.id}/reopen`).send({ reason: 'logged on the wrong machine' })).status).toBe(200);
    const [unit] = await api.database.db.select().from(equipment).where(eq(equipment.id, mowerId));
    expect(unit).toMatchObject({ hourMeterH: 412.5, lastSharpenedAtH: 380 });
  });
});
