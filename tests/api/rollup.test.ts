/**
 * The summary tables the overview and the sites compare read (rollup_overview_day and the
 * compare's year-to-date tables) stay equal to a fresh aggregate of the raw rows after work orders and
 * fields change in every way the app changes them: a week plan generated and re-generated,
 * orders added by hand, reported started, done and skipped, reopened, moved across a month,
 * reassigned, deleted, rained out, a field check logged, a field re-drawn and a field deleted.
 */
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { DEFAULT_TIME_ZONE } from '@swardwise/domain';
import { fieldBody, giveWork, rectangle } from '../support/fixture.ts';
import { startTestApi, type TestApi } from '../support/app.ts';

let api: TestApi;
type Agent = Awaited<ReturnType<TestApi['signIn']>>;
let foreman: Agent;
let crew: Agent;
type Row = Record<string, unknown>;

// The fixture's weather runs 4 May – 7 June 2026: two weeks of plans across the month's end.
const WEEKS = ['2026-05-25', '2026-06-01'];

beforeAll(async () => {
  api = await startTestApi();
  foreman = await api.signIn('foreman');
  crew = await api.signIn('crew');
});
afterAll(() => api.close());

const rows = async (q: ReturnType<typeof sql>) => (await api.database.db.execute<Row>(q)).rows;
const orderIds = async (where: ReturnType<typeof sql>) => (await rows(sql`select id, version from work_orders where ${where} order by id`)) as { id: number; version: number }[];
const ok = (res: { status: number; body: unknown }, what: string) => expect(res.status, `${what}: ${JSON.stringify(res.body)}`).toBeLessThan(300);

/** Rows keyed and with every figure as a number, rollup rows that hold nothing left out. */
function keyed(list: Row[], key: string[]): Map<string, Record<string, number>> {
  const out = new Map<string, Record<string, number>>();
  for (const r of list) {
    const figures = Object.fromEntries(Object.entries(r).filter(([k]) => !key.includes(k)).map(([k, v]) => [k, Number(v)]));
    if (Object.values(figures).every((v) => v === 0)) continue;
    out.set(key.map((k) => String(r[k])).join('|'), figures);
  }
  return out;
}

function expectSame(rollup: Map<string, Record<string, number>>, fresh: Map<string, Record<string, number>>, table: string) {
  expect([...rollup.keys()].sort(), table).toEqual([...fresh.keys()].sort());
  for (const [k, want] of fresh) {
    const got = rollup.get(k)!;
    for (const [name, value] of Object.entries(want)) expect(got[name], `${table} ${k} ${name}`).toBeCloseTo(value, 6);
  }
}

/** The overview's day sums, written apart from the triggers: float arithmetic over every order. */
async function freshOverview() {
  return keyed(
    await rows(sql`
      select wo.district_id, wo.planned_date::text as day,
        count(*) as orders, sum(wo.planned_hours::float8) as planned_hours,
        count(*) filter (where wo.status = 'done') as orders_done,
        coalesce(sum(coalesce(wo.actual_hours, 0)::float8) filter (where wo.status = 'done'), 0) as actual_hours_done,
        coalesce(sum(wo.planned_hours::float8) filter (where wo.status = 'done'), 0) as planned_hours_done,
        count(*) filter (where wo.task = 'mow') as mow_asked,
        count(*) filter (where wo.task = 'mow' and wo.status = 'done') as mow_done,
        count(*) filter (where wo.task = 'mow' and wo.status = 'done' and (wo.done_at at time zone ${DEFAULT_TIME_ZONE})::date > coalesce((wo.details->>'dueBy')::date, wo.planned_date)) as mow_late,
        count(*) filter (where wo.task = 'mow' and wo.status <> 'done') as mow_not_done,
        coalesce(sum((wo.details->>'nGPerM2')::float8 * f.area_m2 / 1000) filter (where wo.task = 'feed' and wo.status = 'done' and f.id is not null), 0) as n_kg_done,
        coalesce(sum(case when wo.details->>'system' = 'quick_coupler' then 0 else (wo.details->>'volumeL')::float8 end) filter (where wo.task = 'irrigate' and wo.status <> 'skipped' and f.id is not null), 0) as water_vol_budget,
        coalesce(sum(case when wo.details->>'system' = 'quick_coupler' then (wo.details->>'runTimeMin')::float8 * f.area_m2 else 0 end) filter (where wo.task = 'irrigate' and wo.status <> 'skipped' and f.id is not null), 0) as water_qc_budget,
        coalesce(sum(case when wo.details->>'system' = 'quick_coupler' then 0 else (wo.details->>'volumeL')::float8 end) filter (where wo.task = 'irrigate' and wo.status = 'done' and f.id is not null), 0) as water_vol_used,
        coalesce(sum(case when wo.details->>'system' = 'quick_coupler' then (wo.details->>'runTimeMin')::float8 * f.area_m2 else 0 end) filter (where wo.task = 'irrigate' and wo.status = 'done' and f.id is not null), 0) as water_qc_used,
        coalesce(sum((wo.details->>'paintL')::float8) filter (where wo.task = 'paint_lines' and wo.status <> 'skipped' and f.id is not null), 0) as paint_planned,
        coalesce(sum((wo.details->>'paintL')::float8) filter (where wo.task = 'paint_lines' and wo.status = 'done' and f.id is not null), 0) as paint_used
      from work_orders wo left join fields f on f.id = wo.field_id
      group by 1, 2`),
    ['district_id', 'day'],
  );
}

const ROLLUP_OVERVIEW = sql`select district_id, day::text as day, orders, planned_hours, orders_done, actual_hours_done, planned_hours_done, mow_asked, mow_done, mow_late, mow_not_done,
  n_kg_done, water_vol_budget, water_qc_budget, water_vol_used, water_qc_used, paint_planned, paint_used from rollup_overview_day`;

/** The compare's year-to-date sums of done orders on a field (January to each month), written apart from the triggers. */
async function freshCompare() {
  const crews = keyed(
    await rows(sql`
      select extract(year from wo.planned_date)::int as year, m.month, wo.district_id, wo.site_id, coalesce(wo.crew_id, 0) as crew,
        count(*) as orders, sum(coalesce(wo.actual_hours, wo.planned_hours)::float8) as hours,
        sum(case when wo.task = 'feed' then (wo.details->>'nGPerM2')::float8 * f.area_m2 / 1000 else 0 end) as kg_n,
        sum(case when wo.task = 'irrigate' then coalesce((wo.details->>'volumeL')::float8, 0) / 1000 else 0 end) as water_m3,
        sum(case when wo.task = 'paint_lines' then coalesce((wo.details->>'paintL')::float8, 0) else 0 end) as paint_l,
        sum(case when wo.task = 'colourant' then (wo.details->'colourant'->>'rateMlPerM2')::float8 * (wo.details->'colourant'->>'areaM2')::float8 / 1000 else 0 end) as colourant_l
      from work_orders wo join fields f on f.id = wo.field_id
      join (select generate_series(1, 12) as month) m on m.month >= extract(month from wo.planned_date)
      where wo.status = 'done'
      group by 1, 2, 3, 4, 5`),
    ['year', 'month', 'district_id', 'site_id', 'crew'],
  );
  const machines = keyed(
    await rows(sql`
      select extract(year from wo.planned_date)::int as year, m.month, wo.district_id, wo.site_id, coalesce(wo.equipment_id, 0) as equipment, wo.task,
        (wo.task = 'mow' and coalesce(wo.details->>'mowerKind', wo.details->>'mower', '') like 'reel%') as reel,
        sum(coalesce(wo.actual_hours, wo.planned_hours)::float8) as hours
      from work_orders wo join fields f on f.id = wo.field_id
      join (select generate_series(1, 12) as month) m on m.month >= extract(month from wo.planned_date)
      where wo.status = 'done'
      group by 1, 2, 3, 4, 5, 6, 7`),
    MACHINE_KEY,
  );
  return { crews, machines };
}

const CREW_KEY = ['year', 'month', 'district_id', 'site_id', 'crew'];
const MACHINE_KEY = ['year', 'month', 'district_id', 'site_id', 'equipment', 'task', 'reel'];

async function expectRollupsExact() {
  expectSame(keyed(await rows(ROLLUP_OVERVIEW), ['district_id', 'day']), await freshOverview(), 'rollup_overview_day');
  const fresh = await freshCompare();
  const crews = await rows(sql`select year, month, district_id, site_id, crew_key as crew, orders, hours, kg_n, water_m3, paint_l, colourant_l from rollup_compare_crew_ytd`);
  expectSame(keyed(crews, CREW_KEY), fresh.crews, 'rollup_compare_crew_ytd');
  const machines = await rows(sql`select year, month, district_id, site_id, equipment_key as equipment, task, reel, hours from rollup_compare_machine_ytd`);
  expectSame(keyed(machines, MACHINE_KEY), fresh.machines, 'rollup_compare_machine_ytd');
  const latest = await rows(sql`select field_id, check_id, checked_on::text as day, score from rollup_field_latest order by field_id`);
  const ranked = await rows(sql`select field_id, id as check_id, checked_on::text as day, score from (
    select c.*, row_number() over (partition by field_id order by checked_on desc, id desc) as k from field_checks c) c where k = 1 order by field_id`);
  expect(latest, 'rollup_field_latest').toEqual(ranked);
}

describe('summary tables kept by triggers', () => {
  test('should equal a fresh aggregate of the raw rows after every kind of change the app makes', { timeout: 180_000 }, async () => {
    const { districts, fields, crews } = api.fixture;
    await expectRollupsExact();

    // A week plan generated (applied) for two weeks, then generated again (matched and moved).
    for (const weekStart of WEEKS) ok(await foreman.post('/api/week-plans/generate').send({ districtId: districts.north, weekStart }), `generate ${weekStart}`);
    ok(await foreman.post('/api/week-plans/generate').send({ districtId: districts.north, weekStart: WEEKS[0] }), 're-generate');
    const planned = await orderIds(sql`district_id = ${districts.north} and planned_date >= ${WEEKS[0]}::date`);
    expect(planned.length).toBeGreaterThan(6);
    await expectRollupsExact();

    // Orders added by hand, one a colourant job; and inputs as the week plan writes them.
    ok(await foreman.post('/api/work-orders').send({ fieldId: fields.northSoccer, task: 'colourant', plannedDate: '2026-05-29', plannedHours: 2, colourant: { product: 'Invented green', rateMlPerM2: 0.8, areaM2: 1200 } }), 'colourant');
    ok(await foreman.post('/api/work-orders').send({ fieldId: fields.northLawn, task: 'paint_lines', plannedDate: '2026-05-30', plannedHours: 1.5, crewId: crews.north }), 'paint');
    await api.database.db.execute(sql`
      insert into work_orders (field_id, site_id, district_id, task, week_start, planned_date, planned_hours, status, origin, details, crew_id)
      select f.id, f.site_id, s.district_id, t.task, '2026-05-25', t.day::date, 1, 'assigned', 'generated', t.details::jsonb, ${crews.north}
      from fields f join sites s on s.id = f.site_id,
      (values ('feed', '2026-05-27', '{"nGPerM2": 2.5}'), ('irrigate', '2026-05-28', '{"system":"quick_coupler","volumeL":9000,"runTimeMin":40}'),
              ('irrigate', '2026-05-31', '{"system":"automatic","volumeL":15000}'), ('paint_lines', '2026-06-02', '{"paintL":4.5}'),
              ('mow', '2026-05-26', '{"dueBy":"2026-05-26","mowerKind":"reel"}')) as t(task, day, details)
      where f.id = ${fields.northSoccer}`);
    await expectRollupsExact();

    // Reported started, done (some after the one-third rule's date), skipped, by the crew.
    const mine = await orderIds(sql`crew_id = ${crews.north} and status in ('planned', 'assigned') and planned_date >= ${WEEKS[0]}::date`);
    expect(mine.length).toBeGreaterThan(5);
    ok(await crew.post(`/api/work-orders/${mine[0]!.id}/reports`).send({ status: 'started' }), 'started');
    for (const [i, o] of mine.slice(0, mine.length - 2).entries()) {
      ok(await crew.post(`/api/work-orders/${o.id}/reports`).send({ status: 'done', actualHours: 0.75 + i * 0.1, note: '', reportedAt: `2026-06-0${1 + (i % 5)}T21:30:00-05:00` }), `done ${o.id}`);
    }
    const skipped = mine[mine.length - 1]!.id;
    ok(await crew.post(`/api/work-orders/${skipped}/reports`).send({ status: 'skipped', note: 'Standing water on the north end' }), 'skipped');
    await expectRollupsExact();

    // Reopened: a done one and the skipped one.
    ok(await foreman.post(`/api/work-orders/${mine[1]!.id}/reopen`).send({ reason: 'Cut was patchy' }), 'reopen done');
    ok(await foreman.post(`/api/work-orders/${skipped}/reopen`).send({ reason: 'Dry again' }), 'reopen skipped');
    await expectRollupsExact();

    // Moved across the month's end, reassigned, re-timed; a done one re-timed by hand.
    const open = await orderIds(sql`district_id = ${districts.north} and status in ('planned', 'assigned') and planned_date >= ${WEEKS[0]}::date`);
    expect(open.length).toBeGreaterThan(3);
    ok(await foreman.patch(`/api/work-orders/${open[0]!.id}`).send({ version: open[0]!.version, plannedDate: '2026-06-03' }), 'move');
    ok(await foreman.patch(`/api/work-orders/${open[1]!.id}`).send({ version: open[1]!.version, crewId: null, plannedHours: 3.25 }), 'reassign');
    await api.database.db.execute(sql`update work_orders set actual_hours = actual_hours + 0.5, done_at = done_at + interval '2 days' where status = 'done' and task = 'mow'`);
    await api.database.db.execute(sql`update work_orders set notes = 'touched' where district_id = ${districts.north}`);
    await expectRollupsExact();

    // Deleted, and a day rained out (its open work cancelled).
    const fresh = (await orderIds(sql`id = ${open[2]!.id}`))[0]!;
    ok(await foreman.delete(`/api/work-orders/${fresh.id}?version=${fresh.version}`), 'delete');
    const rainDay = (await rows(sql`select planned_date::text as d from work_orders where district_id = ${districts.north} and status in ('planned', 'assigned') order by planned_date limit 1`))[0]!.d as string;
    ok(await foreman.post('/api/week-plans/rain-out').send({ districtId: districts.north, date: rainDay, reason: 'Thunderstorms all afternoon' }), 'rain-out');
    await expectRollupsExact();

    // A field check logged on a field-check order and on the field page.
    const checkOrder = await giveWork(api.database.db, fields.northLawn, crews.north, 0);
    await api.database.db.execute(sql`update work_orders set task = 'field_check' where id = ${checkOrder}`);
    const check = { turfCoverPct: 90, weedsPct: 2, bareWornPct: 3, evenness: 4, divots: 4, heightMm: 40, actualHours: 0.5 };
    ok(await crew.post(`/api/work-orders/${checkOrder}/field-check`).send(check), 'check on order');
    ok(await foreman.post(`/api/fields/${fields.northSoccer}/checks`).send(check), 'check on field');
    await expectRollupsExact();
    // A check re-dated before an older one, and the latest deleted.
    await api.database.db.execute(sql`insert into field_checks (field_id, checked_on, turf_cover_pct, weeds_pct, bare_pct, score) values (${fields.northSoccer}, '2026-05-01', 80, 5, 5, 61.5)`);
    await api.database.db.execute(sql`update field_checks set checked_on = '2026-04-01' where id = (select max(id) from field_checks where field_id = ${fields.northLawn})`);
    await api.database.db.execute(sql`delete from field_checks where id = (select check_id from rollup_field_latest where field_id = ${fields.northSoccer})`);
    await expectRollupsExact();

    // A field re-drawn (its area weighs its feeds and quick-coupler runs), then a new field with planned work deleted.
    const soccer = (await rows(sql`select version from fields where id = ${fields.northSoccer}`))[0]!;
    ok(await foreman.patch(`/api/fields/${fields.northSoccer}`).send({ version: soccer.version, geometry: rectangle(37.621, -66.481, 70, 110) }), 're-draw');
    const made = await foreman.post('/api/fields').send(fieldBody(api.fixture.sites.northPark, 'Temporary pitch', rectangle(37.6248, -66.474, 60, 90), { maintenanceLevel: 2 }));
    ok(made, 'new field');
    const temp = made.body.field as { id: number; version: number };
    await giveWork(api.database.db, temp.id, crews.north, 1);
    await api.database.db.execute(sql`insert into work_orders (field_id, site_id, district_id, task, week_start, planned_date, planned_hours, status, origin, details)
      select id, site_id, ${districts.north}, 'feed', '2026-05-25', '2026-05-27', 1, 'planned', 'generated', '{"nGPerM2": 1}' from fields where id = ${temp.id}`);
    await expectRollupsExact();
    ok(await foreman.delete(`/api/fields/${temp.id}?version=${temp.version}`), 'delete field');
    expect((await rows(sql`select count(*)::int as n from work_orders where field_id = ${temp.id}`))[0]!.n).toBe(0);
    await expectRollupsExact();

    // What the tables hold was worth checking: done work, late mowings and inputs are there.
    const [sums] = await rows(sql`select sum(orders_done)::int as done, sum(mow_done)::int as mowed, sum(water_qc_budget)::float8 as qc, sum(paint_planned)::float8 as paint from rollup_overview_day`);
    expect(sums).toMatchObject({ done: expect.any(Number) as number, mowed: expect.any(Number) as number });
    expect(Number(sums!.done)).toBeGreaterThan(5);
    expect(Number(sums!.qc)).toBeGreaterThan(0);
    expect(Number(sums!.paint)).toBeGreaterThan(0);
  });

  test('should count late mowings again when the department changes its time zone', async () => {
    // Done at 21:30 in Chicago on the due day: the next day in UTC, so late there.
    const id = await giveWork(api.database.db, api.fixture.fields.northLawn, api.fixture.crews.north, 0);
    await api.database.db.execute(sql`update work_orders set planned_date = '2026-06-10', details = '{"dueBy":"2026-06-10"}', status = 'done', done_at = '2026-06-10T21:30:00-05:00', actual_hours = 1 where id = ${id}`);
    const lateOn = async () => Number((await rows(sql`select mow_late from rollup_overview_day where day = '2026-06-10'`))[0]?.mow_late ?? 0);
    expect(await lateOn()).toBe(0);
    const head = await api.signIn('head');
    await api.database.db.execute(sql`select rollup_rebuild('UTC')`);
    expect(await lateOn()).toBe(1);
    // The overview sees the zone changed back to the department's and counts again.
    ok(await head.get('/api/overview'), 'overview');
    expect((await rows(sql`select time_zone from rollup_state`))[0]!.time_zone).toBe(api.clock.timeZone);
    expect(await lateOn()).toBe(0);
    await expectRollupsExact();
  });
});

describe('sites compared over months read from the year-to-date tables', () => {
  test('should equal sums over the orders for a range across a year end with days before and after its whole months', async () => {
    const { fields, crews } = api.fixture;
    await api.database.db.execute(sql`
      insert into work_orders (field_id, site_id, district_id, task, week_start, planned_date, planned_hours, actual_hours, status, origin, crew_id, done_at)
      select f.id, f.site_id, s.district_id, 'mow', t.day::date, t.day::date, 1, t.hours, 'done', 'manual', ${crews.north}, (t.day || 'T15:00:00Z')::timestamptz
      from fields f join sites s on s.id = f.site_id,
      (values ('2025-10-10', 1.5), ('2025-11-20', 2.25), ('2025-12-05', 0.75), ('2026-02-11', 3.5), ('2026-06-02', 1.25), ('2026-06-20', 4)) as t(day, hours)
      where f.id in (${fields.northSoccer}, ${fields.southBaseball})`);
    // Checks in and after the period: the score is the latest check within it.
    await api.database.db.execute(sql`insert into field_checks (field_id, checked_on, turf_cover_pct, weeds_pct, bare_pct, score)
      values (${fields.southBaseball}, '2026-05-20', 80, 5, 5, 66), (${fields.southBaseball}, '2026-07-01', 95, 1, 1, 91), (${fields.northSoccer}, '2025-11-01', 70, 5, 5, 55)`);
    const [from, to] = ['2025-11-15', '2026-06-03'];
    const head = await api.signIn('head');
    const res = await head.get(`/api/compare/sites?period=range&from=${from}&to=${to}`);
    ok(res, 'compare');
    const want = new Map(
      (
        await rows(sql`select wo.site_id, count(*)::int as orders, sum(coalesce(wo.actual_hours, wo.planned_hours)::float8) as hours
          from work_orders wo join fields f on f.id = wo.field_id
          where wo.status = 'done' and wo.planned_date between ${from}::date and ${to}::date group by wo.site_id`)
      ).map((r) => [Number(r.site_id), r]),
    );
    const scores = new Map(
      (
        await rows(sql`select f.site_id, sum(l.score * f.area_m2) / sum(f.area_m2) as score
          from (select c.field_id, c.score, row_number() over (partition by c.field_id order by c.checked_on desc, c.id desc) as k
                from field_checks c where c.checked_on between ${from}::date and ${to}::date) l
          join fields f on f.id = l.field_id where l.k = 1 group by f.site_id`)
      ).map((r) => [Number(r.site_id), Number(r.score)]),
    );
    const answer = res.body as { rows: { siteId: number; ordersDone: number; hours: number; surfaceScore: number | null }[] };
    for (const r of answer.rows) {
      if (scores.has(r.siteId)) expect(r.surfaceScore, `score of site ${r.siteId}`).toBeCloseTo(scores.get(r.siteId)!, 6);
      else expect(r.surfaceScore, `score of site ${r.siteId}`).toBeNull();
    }
    expect(answer.rows.find((r) => r.siteId === api.fixture.sites.southPark)?.surfaceScore).toBeCloseTo(66, 6);
    for (const r of answer.rows) {
      const w = want.get(r.siteId);
      expect(r.ordersDone, `site ${r.siteId}`).toBe(Number(w?.orders ?? 0));
      expect(r.hours, `site ${r.siteId}`).toBeCloseTo(Number(w?.hours ?? 0), 6);
    }
    expect(answer.rows.reduce((t, r) => t + r.ordersDone, 0)).toBeGreaterThan(4);
  });
});
