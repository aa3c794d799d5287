/**
 * The foreman's week on an ordinary working day: generating a week again after applying and
 * confirming it adds no second painting for a booking (nor a third the week after), and a
 * rain-out cancels a day's work with a reason the crew sees and puts it back into the plan.
 */
import { and, eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { auditLog, crews, fieldEvents, fields, sites, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { useTestApi } from '../support/app.ts';
import { addCrew } from '../support/fixture.ts';

// Wednesday 27 May 2026, mid-afternoon in the department: the fixture's weather runs 4 May – 7 June.
const api = useTestApi({}, { now: () => new Date('2026-05-27T19:00:00Z') });
const WEEK = '2026-05-25';
const NEXT = '2026-06-01';

type Item = { fieldId: number; task: string; plannedDate: string; crewId: number | null; reason: string };
type Order = Item & { id: number; status: string; details: Record<string, unknown>; notes: string };

describe('generating a week again', () => {
  test('should not paint a booking a second time after apply and confirm, nor a third time the week after', async () => {
    const fieldId = api.fixture.fields.northSoccer;
    const [f] = await api.database.db.select({ siteId: fields.siteId, districtId: sites.districtId }).from(fields).innerJoin(sites, eq(sites.id, fields.siteId)).where(eq(fields.id, fieldId));
    // A game on Monday 1 June: its lines go on the Friday before.
    const [event] = await api.database.db.insert(fieldEvents).values({ fieldId, siteId: f!.siteId, districtId: f!.districtId, kind: 'game', title: 'Cup game', startsOn: NEXT, startTime: '10:00' }).returning();
    const foreman = await api.signIn('foreman');
    const districtId = api.fixture.districts.north;
    const first = await foreman.post('/api/week-plans/generate').send({ districtId, weekStart: WEEK });
    expect(first.status).toBe(200);
    const forEvent = (first.body.board.orders as Order[]).filter((o) => o.task === 'paint_lines' && o.details.eventId === event!.id);
    expect(forEvent.map((o) => o.plannedDate)).toEqual(['2026-05-29']);
    expect((await foreman.post('/api/week-plans/confirm').send({ districtId, weekStart: WEEK })).status).toBe(200);

    const again = await foreman.post('/api/week-plans/generate').send({ districtId, weekStart: WEEK });
    expect(again.status).toBe(200);
    expect((again.body.diff.added as Item[]).filter((a) => a.task === 'paint_lines')).toEqual([]);
    const paintsNow = (again.body.board.orders as Order[]).filter((o) => o.task === 'paint_lines' && o.fieldId === fieldId);
    expect(paintsNow.filter((o) => o.details.eventId === event!.id)).toHaveLength(1);

    // The week of the game: Friday's painting serves it, and the level's 10-day repaint is not up before 8 June.
    const next = await foreman.post('/api/week-plans/generate').send({ districtId, weekStart: NEXT, dryRun: true });
    expect(next.status).toBe(200);
    expect((next.body.diff.added as Item[]).filter((a) => a.task === 'paint_lines' && a.fieldId === fieldId)).toEqual([]);
  });
});

describe('a rain-out', () => {
  const THURSDAY = '2026-05-28';

  test('should refuse a crew lead, a missing reason and a crew of another district', async () => {
    const districtId = api.fixture.districts.north;
    const crew = await api.signIn('crew');
    expect((await crew.post('/api/week-plans/rain-out').send({ districtId, date: THURSDAY, reason: 'Storms' })).status).toBe(403);
    const foreman = await api.signIn('foreman');
    const noReason = await foreman.post('/api/week-plans/rain-out').send({ districtId, date: THURSDAY, reason: ' ' });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.details.issues[0].path).toBe('body.reason');
    const otherCrew = await foreman.post('/api/week-plans/rain-out').send({ districtId, date: THURSDAY, crewId: api.fixture.crews.south, reason: 'Storms' });
    expect(otherCrew.status).toBe(400);
    expect(otherCrew.body.error.details.issues[0].path).toBe('body.crewId');
  });

  test("should cancel the crew's day with the reason, show it on the crew's Today, and plan the work again on other days", async () => {
    const districtId = api.fixture.districts.north;
    const crewId = api.fixture.crews.north;
    const foreman = await api.signIn('foreman');
    const board = (await foreman.get('/api/week-plans').query({ districtId, weekStart: WEEK })).body as { orders: Order[] };
    const onThursday = board.orders.filter((o) => o.plannedDate === THURSDAY && o.crewId === crewId && ['planned', 'assigned'].includes(o.status));
    expect(onThursday.length).toBeGreaterThan(0);

    const res = await foreman.post('/api/week-plans/rain-out').send({ districtId, date: THURSDAY, crewId, reason: 'Thunderstorms all day, fields waterlogged' });
    expect(res.status).toBe(200);
    expect(res.body.cancelled).toBe(onThursday.length);
    const rows = await api.database.db.select().from(workOrders).where(and(eq(workOrders.plannedDate, THURSDAY), eq(workOrders.crewId, crewId)));
    for (const r of rows.filter((r) => onThursday.some((o) => o.id === r.id))) {
      expect(r.status).toBe('skipped');
      expect(r.details.cancelled).toMatchObject({ reason: 'Thunderstorms all day, fields waterlogged' });
    }
    const audits = await api.database.db.select().from(auditLog).where(eq(auditLog.entity, 'rain_out')).orderBy(auditLog.id);
    expect(audits).toHaveLength(1);
    expect(audits[0]!.after).toMatchObject({ date: THURSDAY, crewId, reason: 'Thunderstorms all day, fields waterlogged' });

    // The crew lead's Today of that day: the jobs are there, cancelled, with the reason.
    const crew = await api.signIn('crew');
    const today = await crew.get('/api/work-orders').query({ from: THURSDAY, to: THURSDAY });
    const mine = (today.body.items as Order[]).filter((o) => onThursday.some((t) => t.id === o.id));
    expect(mine).toHaveLength(onThursday.length);
    for (const o of mine) expect(o).toMatchObject({ status: 'skipped', details: { cancelled: { reason: 'Thunderstorms all day, fields waterlogged' } } });

    // Re-planning: nothing new on the rained-out day, the cancelled checks and feed back on another working day.
    const replan = await foreman.post('/api/week-plans/generate').send({ districtId, weekStart: WEEK });
    expect(replan.status).toBe(200);
    const live = (replan.body.board.orders as Order[]).filter((o) => o.status !== 'skipped');
    expect(live.filter((o) => o.plannedDate === THURSDAY && o.crewId === crewId)).toEqual([]);
    const again = onThursday.filter((o) => o.task === 'field_check' || o.task === 'feed');
    expect(again.length).toBeGreaterThan(0);
    for (const cancelled of again) {
      expect(live.some((o) => o.fieldId === cancelled.fieldId && o.task === cancelled.task && o.plannedDate !== THURSDAY && o.plannedDate >= '2026-05-27')).toBe(true);
    }
  });
});

describe('generating a week again when a crew does not work the watering day', () => {
  // A database of its own: the crews' days and a field's system change here.
  const own = useTestApi({}, { now: () => new Date('2026-05-27T19:00:00Z') });
  const PAST = '2026-05-18';
  const offFriday = ['mon', 'tue', 'wed', 'thu', 'sat'] as const;

  test('should propose nothing after apply and confirm, nor when a crew is added before generating again', async () => {
    const districtId = own.fixture.districts.north;
    await own.database.db.update(fields).set({ irrigation: 'quick_coupler' }).where(eq(fields.id, own.fixture.fields.northSoccer));
    await own.database.db.update(crews).set({ workDays: [...offFriday] }).where(eq(crews.id, own.fixture.crews.north));
    const foreman = await own.signIn('foreman');
    const first = await foreman.post('/api/week-plans/generate').send({ districtId, weekStart: PAST });
    expect(first.status).toBe(200);
    // Friday's run goes to the crew's Thursday, its reason still naming Friday.
    const water = (first.body.board.orders as Order[]).filter((o) => o.task === 'irrigate' && o.fieldId === own.fixture.fields.northSoccer);
    expect(water.some((o) => o.plannedDate === '2026-05-21' && /Friday/.test(o.reason))).toBe(true);
    expect((await foreman.post('/api/week-plans/confirm').send({ districtId, weekStart: PAST })).status).toBe(200);

    const again = await foreman.post('/api/week-plans/generate').send({ districtId, weekStart: PAST, dryRun: true });
    expect(again.status).toBe(200);
    expect(again.body.diff.summary).toMatchObject({ added: 0, changed: 0, removed: 0 });

    // A crew added in the meantime (off on Fridays too) takes nothing that is already planned.
    const extra = await addCrew(own.database.db, districtId, 'Second North Crew');
    await own.database.db.update(crews).set({ workDays: [...offFriday], hoursPerDay: 9 }).where(eq(crews.id, extra));
    const withCrew = await foreman.post('/api/week-plans/generate').send({ districtId, weekStart: PAST, dryRun: true });
    expect(withCrew.status).toBe(200);
    expect(withCrew.body.diff.added).toEqual([]);
    expect(withCrew.body.diff.summary).toMatchObject({ added: 0, changed: 0, removed: 0 });
  });
});
