import { and, eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { DEFAULT_CULTURAL } from '@swardwise/domain';
import { applications, fields, standards, weatherDays, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();
// The fixture's weather runs 4 May – 7 June 2026; tall fescue grows well in it.
const WEEK = '2026-05-25';
const row = async (level: number) => (await api.database.db.select().from(standards).where(eq(standards.level, level)))[0]!;
const aerateOnly = (times: number) => ({
  aerate: { ...DEFAULT_CULTURAL[2].aerate, timesPerSeason: times, method: 'solid_tine' as const },
  overseed: { ...DEFAULT_CULTURAL[2].overseed, timesPerSeason: 0 },
  topdress: { ...DEFAULT_CULTURAL[2].topdress, timesPerSeason: 0 },
  weed_control: { ...DEFAULT_CULTURAL[2].weed_control, timesPerSeason: 0 },
});

describe('the cultural program in the Standards', () => {
  test('should refuse a crew lead and a foreman, and change nothing', async () => {
    const before = await row(2);
    for (const who of ['crew', 'foreman', 'partner'] as const) {
      const res = await (await api.signIn(who)).patch('/api/standards/2').send({ version: before.version, cultural: aerateOnly(5) });
      expect(res.status, who).toBe(403);
    }
    expect((await row(2)).version).toBe(before.version);
  });

  test('should refuse a window that ends before it begins, and too many times, with the field and a message', async () => {
    const head = await api.signIn('head');
    const before = await row(2);
    const bad = await head.patch('/api/standards/2').send({ version: before.version, cultural: { aerate: { ...aerateOnly(2).aerate, cool: { fromMonth: 9, toMonth: 4 } } } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.issues).toContainEqual({ path: 'body.cultural.aerate.cool.toMonth', message: 'the window ends before it begins: the last month must be on or after the first' });
    const many = await head.patch('/api/standards/2').send({ version: before.version, cultural: { weed_control: { ...aerateOnly(2).weed_control, timesPerSeason: 13 } } });
    expect(many.status).toBe(400);
    expect(many.body.error.details.issues[0].message).toBe('more than 12 times a season is not a program');
    expect((await row(2)).version).toBe(before.version);
  });

  test('should let the head set a program, keep the tasks not sent, and plan it into the week with its reason', async () => {
    const head = await api.signIn('head');
    const before = await row(2);
    const res = await head.patch('/api/standards/2').send({ version: before.version, cultural: aerateOnly(1) });
    expect(res.status).toBe(200);
    expect(res.body.standard.data.cultural.aerate).toMatchObject({ timesPerSeason: 1, method: 'solid_tine' });
    const one = await head.patch('/api/standards/2').send({ version: before.version + 1, cultural: { topdress: { ...DEFAULT_CULTURAL[2].topdress, timesPerSeason: 0 } } });
    expect(one.status).toBe(200);
    expect(one.body.standard.data.cultural.aerate.timesPerSeason).toBe(1);

    const foreman = await api.signIn('foreman');
    const gen = await foreman.post('/api/week-plans/generate').send({ districtId: api.fixture.districts.north, weekStart: WEEK });
    expect(gen.status).toBe(200);
    type Order = { id: number; fieldId: number; task: string; reason: string; plannedHours: number; version: number; details: Record<string, unknown> };
    const aerations = (gen.body.board.orders as Order[]).filter((o) => o.task === 'aerate');
    // Level 2 soccer field only: level 1's program is its default (3 a season), level 4's asks none.
    const soccer = aerations.filter((o) => o.fieldId === api.fixture.fields.northSoccer);
    expect(soccer).toHaveLength(1);
    expect(soccer[0]!.reason).toMatch(/^Level 2 program: solid tine aeration 1× a season in Apr–Oct; this is 1 of 1 \(0 done\)/);
    expect(soccer[0]!.plannedHours).toBeGreaterThan(0);
    expect(aerations.some((o) => o.fieldId === api.fixture.fields.northLawn)).toBe(false);

    // Re-generating leaves it; once logged done, the season's one is done and no other is asked.
    const again = await foreman.post('/api/week-plans/generate').send({ districtId: api.fixture.districts.north, weekStart: WEEK });
    expect(again.body.diff.summary.added).toBe(0);
    await api.database.db.update(workOrders).set({ status: 'done' }).where(eq(workOrders.id, soccer[0]!.id));
    const next = await foreman.post('/api/week-plans/generate').send({ districtId: api.fixture.districts.north, weekStart: '2026-06-01' });
    expect(next.status).toBe(200);
    const asked = await api.database.db
      .select()
      .from(workOrders)
      .where(and(eq(workOrders.fieldId, api.fixture.fields.northSoccer), eq(workOrders.task, 'aerate')));
    expect(asked).toHaveLength(1);
  });
});

describe('application records', () => {
  const order = async (task: 'weed_control' | 'mow' | 'overseed') => {
    const [f] = await api.database.db.select().from(fields).where(eq(fields.id, api.fixture.fields.northSoccer));
    const [row] = await api.database.db
      .insert(workOrders)
      .values({ fieldId: f!.id, siteId: f!.siteId, districtId: api.fixture.districts.north, task, weekStart: '2026-05-25', plannedDate: '2026-05-26', crewId: api.fixture.crews.north, plannedHours: 1, status: 'assigned', origin: 'manual' })
      .returning();
    return row!.id;
  };
  const body = { product: 'Test broadleaf herbicide', rate: 1.1, rateUnit: 'fl oz/1000 ft²', areaM2: 600, appliedOn: '2026-05-26', applicator: 'A. Tester' };

  test('should refuse weed control without a licence number, a day to come and a bad rate with 400, writing nothing', async () => {
    const crew = await api.signIn('crew');
    const id = await order('weed_control');
    const noLicence = await crew.post(`/api/work-orders/${id}/application`).send(body);
    expect(noLicence.status).toBe(400);
    expect(noLicence.body.error.details.issues).toContainEqual({ path: 'body.licenceNumber', message: "a pesticide application needs the applicator's licence number" });
    const future = await crew.post(`/api/work-orders/${id}/application`).send({ ...body, licenceNumber: 'QA-1234', appliedOn: '2099-01-01' });
    expect(future.status).toBe(400);
    expect(future.body.error.details.issues[0].message).toBe('an application cannot be recorded for a day still to come');
    const rate = await crew.post(`/api/work-orders/${id}/application`).send({ ...body, licenceNumber: 'QA-1234', rate: 0 });
    expect(rate.status).toBe(400);
    expect(rate.body.error.details.issues[0]).toMatchObject({ path: 'body.rate', message: 'the rate must be more than 0' });
    expect(await api.database.db.select().from(applications)).toHaveLength(0);
  });

  test("should refuse another district's foreman before reading the body, and a mowing order", async () => {
    const id = await order('weed_control');
    const south = await (await api.signIn('foremanSouth')).post(`/api/work-orders/${id}/application`).send({ nonsense: true });
    expect(south.status).toBe(403);
    const mow = await order('mow');
    const res = await (await api.signIn('foreman')).post(`/api/work-orders/${mow}/application`).send({ ...body, licenceNumber: 'QA-1234' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('application/not_applicable');
  });

  test("should store the crew lead's record with the station's weather that day and show it in the records", async () => {
    const id = await order('weed_control');
    const res = await (await api.signIn('crew')).post(`/api/work-orders/${id}/application`).send({ ...body, licenceNumber: 'QA-1234' });
    expect(res.status).toBe(201);
    const [day] = await api.database.db.select().from(weatherDays).where(and(eq(weatherDays.stationId, api.fixture.weather.stationId), eq(weatherDays.date, '2026-05-26')));
    expect(res.body.application).toMatchObject({ task: 'weed_control', product: 'Test broadleaf herbicide', rate: 1.1, rateUnit: 'fl oz/1000 ft²', licenceNumber: 'QA-1234', workOrderId: id });
    expect(res.body.application.weather).toEqual({ stationName: 'Test Weather', date: '2026-05-26', tmaxC: day!.tmaxC, tminC: day!.tminC, rainMm: day!.rainMm, windMs: 2, kind: 'observed' });
    const list = await (await api.signIn('foreman')).get('/api/records/applications').query({ from: '2026-05-01', to: '2026-05-31' });
    expect(list.status).toBe(200);
    expect(list.body.applications.map((a: { id: number }) => a.id)).toContain(res.body.application.id);
    const south = await (await api.signIn('foremanSouth')).get('/api/records/applications').query({ from: '2026-05-01', to: '2026-05-31' });
    expect(south.body.applications).toEqual([]);
  });
});
