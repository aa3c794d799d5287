import { and, eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { workOrders } from '../../apps/api/src/db/schema/index.ts';
import { startTestApi, type TestApi } from '../support/app.ts';
import { getPdf, renderPdf } from '../support/pdf.ts';

let api: TestApi;
// A Wednesday inside the fixture's weather (4 May – 7 June 2026).
const NOW = new Date('2026-05-20T16:00:00Z');
const WEEK = '2026-05-25';
const GAME_ON = '2026-05-30'; // Saturday: prepared on Friday 29 May
const ids: Record<string, number> = {};

beforeAll(async () => {
  api = await startTestApi({}, { now: () => NOW });
  const foreman = await api.signIn('foreman');
  const stadium = await foreman.post('/api/field-events').send({ fieldId: api.fixture.fields.northSchoolFootball, kind: 'game', title: 'Homecoming', startsOn: GAME_ON, startTime: '19:00' });
  expect(stadium.status).toBe(201);
  ids.stadiumEvent = stadium.body.event.id;
  const soccer = await foreman.post('/api/field-events').send({ fieldId: api.fixture.fields.northSoccer, kind: 'game', title: 'League final', startsOn: GAME_ON });
  ids.soccerEvent = soccer.body.event.id;
  const south = await (await api.signIn('foremanSouth')).post('/api/field-events').send({ fieldId: api.fixture.fields.southBaseball, kind: 'game', title: 'South opener', startsOn: GAME_ON });
  ids.southEvent = south.body.event.id;
});
afterAll(() => api.close());

type Step = { step: string; workOrderId: number | null; plannedDate: string | null; status: string; crewName: string | null; plannedHours: number | null; done: boolean; publicLabel: string };
type Prep = { id: number; eventId: number; steps: Step[]; progress: { done: number; total: number }; colourant: unknown; pattern: string | null };

const colourant = { product: 'Test Green pigment', rateMlPerM2: 3, areaM2: 5350 };
const ordersOf = (prep: Prep) => prep.steps.map((s) => s.workOrderId!);

describe('a colourant job', () => {
  test('should need its product, rate and area, and keep them on the order', async () => {
    const foreman = await api.signIn('foreman');
    const bare = await foreman.post('/api/work-orders').send({ fieldId: api.fixture.fields.northLawn, task: 'colourant', plannedDate: '2026-05-21', plannedHours: 1 });
    expect(bare.status).toBe(400);
    expect(bare.body.error.details.issues[0].path).toBe('body.colourant');
    const other = await foreman.post('/api/work-orders').send({ fieldId: api.fixture.fields.northLawn, task: 'mow', plannedDate: '2026-05-21', plannedHours: 1, colourant });
    expect(other.status).toBe(400);
    const badRate = await foreman.post('/api/work-orders').send({ fieldId: api.fixture.fields.northLawn, task: 'colourant', plannedDate: '2026-05-21', plannedHours: 1, colourant: { ...colourant, rateMlPerM2: 0 } });
    expect(badRate.status).toBe(400);
    const ok = await foreman.post('/api/work-orders').send({ fieldId: api.fixture.fields.northLawn, task: 'colourant', plannedDate: '2026-05-21', plannedHours: 1, colourant });
    expect(ok.status).toBe(201);
    expect(ok.body).toMatchObject({ task: 'colourant', details: { colourant } });
    await api.database.db.delete(workOrders).where(eq(workOrders.id, ok.body.id));
  });
});

describe('game-day preparation', () => {
  test('should refuse the wrong people before reading the body', async () => {
    const body = { steps: ['mow'] };
    expect((await (await api.signIn('foremanSouth')).post(`/api/game-days/events/${ids.stadiumEvent}`).send(body)).status).toBe(404);
    expect((await (await api.signIn('crew')).post(`/api/game-days/events/${ids.stadiumEvent}`).send(body)).status).toBe(403);
    expect((await (await api.signIn('partner')).post(`/api/game-days/events/${ids.stadiumEvent}`).send(body)).status).toBe(403);
    expect((await (await api.signIn('head')).post(`/api/game-days/events/${ids.stadiumEvent}`).send(body)).status).toBe(403);
    // A bad body from someone with no right to the event still gets the 403, not a 400.
    expect((await (await api.signIn('partner')).post(`/api/game-days/events/${ids.stadiumEvent}`).send({ steps: 'all' })).status).toBe(403);
    expect((await (await api.signIn('foreman')).post('/api/game-days/events/999999').send(body)).status).toBe(404);
  });

  test('should refuse a bad checklist with a clear 400', async () => {
    const foreman = await api.signIn('foreman');
    const noColour = await foreman.post(`/api/game-days/events/${ids.stadiumEvent}`).send({ steps: ['mow', 'colourant'] });
    expect(noColour.status).toBe(400);
    expect(noColour.body.error.details.issues[0].path).toBe('body.colourant');
    expect((await foreman.post(`/api/game-days/events/${ids.stadiumEvent}`).send({ steps: [] })).status).toBe(400);
    expect((await foreman.post(`/api/game-days/events/${ids.stadiumEvent}`).send({ steps: ['mow', 'mow'] })).status).toBe(400);
    expect((await foreman.post(`/api/game-days/events/${ids.stadiumEvent}`).send({ steps: ['sweep'] })).status).toBe(400);
  });

  test('should make the checklist and its work orders on the day before the event, with HOC, pattern and colourant', async () => {
    const foreman = await api.signIn('foreman');
    const res = await foreman.post(`/api/game-days/events/${ids.stadiumEvent}`).send({ steps: ['field_check', 'paint_lines', 'mow', 'colourant', 'logo'], colourant, pattern: 'checkerboard' });
    expect(res.status).toBe(201);
    const prep = res.body.gameDay as Prep;
    ids.stadiumPrep = prep.id;
    // Working order, whatever order the foreman ticked them in.
    expect(prep.steps.map((s) => s.step)).toEqual(['mow', 'colourant', 'paint_lines', 'logo', 'field_check']);
    expect(prep.steps.every((s) => s.plannedDate === '2026-05-29' && s.crewName === 'North Crew' && s.status === 'assigned')).toBe(true);
    expect(prep.progress).toEqual({ done: 0, total: 5 });
    // The crew lead hears of the new jobs, as of any assigned work.
    expect(res.body.emailed).toBe(1);
    const mail = await api.mail.waitFor((m) => m.subject.includes('New work for North Crew') && m.text.includes('Colourant'));
    expect(mail.to).toContain(api.fixture.users.crew.email);
    const rows = await api.database.db.select().from(workOrders).where(eq(workOrders.details, workOrders.details));
    const mine = rows.filter((r) => ordersOf(prep).includes(r.id));
    expect(mine).toHaveLength(5);
    expect(mine.every((r) => r.pinned && r.origin === 'manual' && r.weekStart === WEEK)).toBe(true);
    const mow = mine.find((r) => r.task === 'mow')!;
    expect(mow.details).toMatchObject({ pattern: 'checkerboard', gameDayStep: 'mow', eventTitle: 'Homecoming' });
    expect(typeof mow.details.hocMm).toBe('number');
    expect(mine.find((r) => r.task === 'colourant')!.details).toMatchObject({ colourant });
    // 5,350 m² at 10,500 m²/h plus 0.5 h mixing (common practice): 1.01 h.
    expect(mine.find((r) => r.task === 'colourant')!.plannedHours).toBeCloseTo(1.01, 2);
    expect(mine.filter((r) => r.task === 'paint_lines').map((r) => r.details.gameDayStep).sort()).toEqual(['logo', 'paint_lines']);
    expect(mine.find((r) => r.details.gameDayStep === 'paint_lines')!.details.eventId).toBe(ids.stadiumEvent);
    expect((await foreman.post(`/api/game-days/events/${ids.stadiumEvent}`).send({ steps: ['mow'] })).status).toBe(409);
  });

  test('should show the partner the progress of their own events only, without crews, hours or order ids', async () => {
    const admin = await api.signIn('admin');
    const south = await admin.post(`/api/game-days/events/${ids.southEvent}`).send({ steps: ['mow', 'field_check'] });
    expect(south.status).toBe(201);
    ids.southPrep = south.body.gameDay.id;
    const prep = (await api.signIn('foreman')).get(`/api/game-days/${ids.stadiumPrep}`);
    const paintId = (await prep).body.gameDay.steps.find((s: Step) => s.step === 'paint_lines').workOrderId;
    await api.database.db.update(workOrders).set({ status: 'done', actualHours: 2 }).where(eq(workOrders.id, paintId));

    const partner = await api.signIn('partner');
    const list = await partner.get('/api/game-days');
    expect(list.status).toBe(200);
    expect(list.body.items.map((p: Prep) => p.id)).toEqual([ids.stadiumPrep]);
    const mine = list.body.items[0] as Prep;
    expect(mine.progress).toEqual({ done: 1, total: 5 });
    expect(mine.steps.find((s) => s.step === 'paint_lines')).toMatchObject({ done: true, publicLabel: 'The lines are painted' });
    expect(mine.steps.every((s) => s.workOrderId === null && s.crewName === null && s.plannedHours === null)).toBe(true);
    expect((await partner.get(`/api/game-days/${ids.southPrep}`)).status).toBe(404);

    // Foremen see their own district; the crew its district; the head all.
    expect((await (await api.signIn('foreman')).get('/api/game-days')).body.items.map((p: Prep) => p.id)).toEqual([ids.stadiumPrep]);
    expect((await (await api.signIn('foremanSouth')).get('/api/game-days')).body.items.map((p: Prep) => p.id)).toEqual([ids.southPrep]);
    expect((await (await api.signIn('crew')).get(`/api/game-days/${ids.stadiumPrep}`)).status).toBe(200);
    expect((await (await api.signIn('crew')).get(`/api/game-days/${ids.southPrep}`)).status).toBe(404);
    expect((await (await api.signIn('head')).get('/api/game-days')).body.items).toHaveLength(2);
  });

  test('should take over the week plan’s painting for the event, and keep every order when the week is generated again', async () => {
    const foreman = await api.signIn('foreman');
    const gen = await foreman.post('/api/week-plans/generate').send({ districtId: api.fixture.districts.north, weekStart: WEEK });
    expect(gen.status).toBe(200);
    const paintFor = async (eventId: number) => (await api.database.db.select().from(workOrders).where(and(eq(workOrders.task, 'paint_lines'), eq(workOrders.fieldId, api.fixture.fields.northSoccer)))).filter((r) => r.details.eventId === eventId);
    // The week plan paints before the soccer final on its own.
    const planned = await paintFor(ids.soccerEvent!);
    expect(planned).toHaveLength(1);
    const res = await foreman.post(`/api/game-days/events/${ids.soccerEvent}`).send({ steps: ['mow', 'paint_lines', 'field_check'] });
    expect(res.status).toBe(201);
    const prep = res.body.gameDay as Prep;
    // The checklist's painting is the week plan's, pinned now; none added.
    expect(prep.steps.find((s) => s.step === 'paint_lines')!.workOrderId).toBe(planned[0]!.id);
    expect(await paintFor(ids.soccerEvent!)).toHaveLength(1);

    const stadium = (await foreman.get(`/api/game-days/${ids.stadiumPrep}`)).body.gameDay as Prep;
    for (let run = 0; run < 2; run++) {
      const again = await foreman.post('/api/week-plans/generate').send({ districtId: api.fixture.districts.north, weekStart: WEEK });
      expect(again.status).toBe(200);
    }
    for (const p of [prep, stadium]) {
      const after = (await foreman.get(`/api/game-days/${p.id}`)).body.gameDay as Prep;
      expect(after.steps.map((s) => [s.workOrderId, s.plannedDate])).toEqual(p.steps.map((s) => [s.workOrderId, s.plannedDate]));
    }
    expect(await paintFor(ids.soccerEvent!)).toHaveLength(1);
    const stadiumPaints = (await api.database.db.select().from(workOrders).where(and(eq(workOrders.task, 'paint_lines'), eq(workOrders.fieldId, api.fixture.fields.northSchoolFootball)))).filter((r) => r.details.eventId === ids.stadiumEvent);
    expect(stadiumPaints).toHaveLength(1);
  });

  test('should refuse an event already past', async () => {
    const foreman = await api.signIn('foreman');
    const old = await foreman.post('/api/field-events').send({ fieldId: api.fixture.fields.northLawn, kind: 'game', title: 'Last week', startsOn: '2026-05-12' });
    const res = await foreman.post(`/api/game-days/events/${old.body.event.id}`).send({ steps: ['mow'] });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('game_day/past_event');
  });
});

describe('the checklist PDF', () => {
  test('should render as one non-blank page, and only for those who may read the preparation', async () => {
    const foreman = await api.signIn('foreman');
    const sheet = renderPdf(await getPdf(foreman, `/api/game-days/${ids.stadiumPrep}/checklist.pdf`), 'game-day-checklist-pdf');
    expect(sheet.pages).toHaveLength(1);
    const { data, info } = await sharp(sheet.pages[0]!).greyscale().raw().toBuffer({ resolveWithObject: true });
    expect(info.width).toBe(510); // US Letter, 8.5 in at 60 dpi
    const dark = data.filter((v) => v < 128).length / data.length;
    // Text and the table's rules: ink on part of the page, not none, not all.
    expect(dark).toBeGreaterThan(0.01);
    expect(dark).toBeLessThan(0.3);
    sheet.remove();

    expect((await (await api.signIn('foremanSouth')).get(`/api/game-days/${ids.stadiumPrep}/checklist.pdf`)).status).toBe(404);
    expect((await (await api.signIn('partner')).get(`/api/game-days/${ids.stadiumPrep}/checklist.pdf`)).status).toBe(200);
  });
});
