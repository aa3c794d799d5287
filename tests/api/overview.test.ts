/**
 * The overview on the demo city: every figure equals a plain SQL query over the rows written
 * here (not the service's own), the department is the sum of its districts, mowings late agree
 * with Records, and a foreman sees his own district only.
 */
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { annualNitrogen, DEFAULT_TIME_ZONE, defineAbilityFor, LEVELS, type Actor, type Grass, type Level, type Overview } from '@swardwise/domain';
import { openDatabase, type Database } from '../../apps/api/src/db/client.ts';
import { seedDemoCity } from '../../apps/api/src/db/seed/index.ts';
import { DepartmentClock } from '../../apps/api/src/services/clock.ts';
import type { Ctx } from '../../apps/api/src/services/context.ts';
import { getOverview } from '../../apps/api/src/services/overview.ts';
import { getRecords } from '../../apps/api/src/services/records.ts';
import { loadParameters, loadStandards } from '../../apps/api/src/services/standards.ts';

const TODAY = '2026-12-03';
const SEASON_FROM = '2026-01-01';
const SEASON_TO = '2026-12-31';
let database: Database;
let head: Ctx;
let foreman: Ctx;
let north: number;
let south: number;
let answer: Overview;

type Row = Record<string, unknown>;
const one = async (q: ReturnType<typeof sql>) => ((await database.db.execute<Row>(q)).rows[0] ?? {}) as Row;
const n = (v: unknown) => Number(v ?? 0);

beforeAll(async () => {
  database = await openDatabase({ pgliteDir: 'memory://' });
  await seedDemoCity(database.db, TODAY);
  const clock = new DepartmentClock(database.db, DEFAULT_TIME_ZONE, () => new Date(`${TODAY}T18:00:00Z`));
  const ds = (await database.db.execute<{ id: number; code: string }>(sql`select id, code from districts order by id`)).rows;
  north = ds.find((d) => d.code === 'north')!.id;
  south = ds.find((d) => d.code !== 'north')!.id;
  const ctxOf = (actor: Actor): Ctx => ({ db: database.db, actor, actorName: 'Test', ability: defineAbilityFor(actor), clock });
  head = ctxOf({ id: 1, role: 'head', districtId: null, crewId: null, siteIds: [] });
  foreman = ctxOf({ id: 2, role: 'foreman', districtId: north, crewId: null, siteIds: [] });

  // The demo's history has no irrigation or line marking: add some, done and not, with the
  // details the week plan writes (a controller's week volume; a quick-coupler run's minutes).
  await database.db.execute(sql`
    insert into work_orders (field_id, site_id, district_id, task, week_start, planned_date, planned_hours, actual_hours, status, origin, details, done_at)
    select f.id, f.site_id, s.district_id, t.task, '2026-11-30', '2026-12-01', 0.5, t.actual, t.status, 'generated', t.details::jsonb, t.done_at
    from (select f.* from fields f order by f.id limit 6) f join sites s on s.id = f.site_id,
    (values
      ('irrigate', 'done', 0.4::real, '{"system":"automatic","volumeL":12000,"grossMm":4.2}', '2026-12-01T15:00:00Z'::timestamptz),
      ('irrigate', 'planned', null, '{"system":"quick_coupler","volumeL":9000,"runTimeMin":45,"runOn":"2026-12-02"}', null),
      ('irrigate', 'done', 0.5, '{"system":"quick_coupler","volumeL":9000,"runTimeMin":30,"runOn":"2026-12-01"}', '2026-12-01T16:00:00Z'),
      ('paint_lines', 'done', 1.5, '{"coat":"touch_up","paintL":3.5,"mixedL":7}', '2026-12-01T17:00:00Z'),
      ('paint_lines', 'assigned', null, '{"coat":"first","paintL":6.2,"mixedL":12.4}', null)
    ) as t(task, status, actual, details, done_at)`);
  // A closure decided and lifted in the season (history), and one of last season.
  await database.db.execute(sql`
    insert into field_closures (field_id, status, reason, from_at, to_at)
    select f.id, t.status, 'wet', t.from_at::timestamptz, t.to_at::timestamptz from (select id from fields order by id limit 2) f,
    (values ('closed', '2026-10-04T13:00:00Z', '2026-10-05T13:00:00Z'), ('restricted', '2025-10-04T13:00:00Z', '2025-10-06T13:00:00Z')) as t(status, from_at, to_at)`);
  answer = await getOverview(head, {});
});
afterAll(() => database.close());

describe('overview of the demo city', () => {
  test('should count acres, fields, scores and fields below target per level as SQL over the fields and their latest check', async () => {
    const { standards } = await loadStandards(database.db);
    for (const level of LEVELS) {
      // The latest check per field by a window, not by DISTINCT ON as the service has it.
      const r = await one(sql`
        with ranked as (select field_id, score, row_number() over (partition by field_id order by checked_on desc, id desc) as k from field_checks)
        select count(*) as fields, sum(f.area_m2) as area, count(r.score) as scored, avg(r.score) as avg,
          count(*) filter (where r.score < ${standards[level].targetScore}) as below
        from fields f left join ranked r on r.field_id = f.id and r.k = 1
        where f.status <> 'retired' and f.maintenance_level = ${level}`);
      const lv = answer.total.levels.find((x) => x.level === level)!;
      expect(lv.fields).toBe(n(r.fields));
      expect(lv.areaM2).toBeCloseTo(n(r.area), -1);
      expect(lv.scored).toBe(n(r.scored));
      expect(lv.belowTarget).toBe(n(r.below));
      expect(lv.targetScore).toBe(standards[level].targetScore);
      if (n(r.scored)) expect(lv.scoreAvg).toBeCloseTo(n(r.avg), 0);
    }
    expect(answer.total.levels.reduce((s, l) => s + l.belowTarget, 0)).toBeGreaterThan(0);
  });

  test('should sum labour of the season and the week as SQL over the work orders', async () => {
    for (const [span, from, to] of [
      ['season', SEASON_FROM, SEASON_TO],
      ['week', answer.weekFrom, answer.weekTo],
    ] as const) {
      const r = await one(sql`
        select count(*) as orders, sum(planned_hours) as planned, sum(case when status = 'done' then coalesce(actual_hours, 0) end) as actual,
          sum(case when status = 'done' then planned_hours end) as planned_done, sum(case when status = 'done' then 1 else 0 end) as done
        from work_orders where planned_date >= ${from}::date and planned_date <= ${to}::date`);
      const l = answer.total.labour[span];
      expect(l.ordersPlanned).toBe(n(r.orders));
      expect(l.ordersDone).toBe(n(r.done));
      expect(l.plannedHours).toBeCloseTo(n(r.planned), 1);
      expect(l.actualHours).toBeCloseTo(n(r.actual), 1);
      expect(l.plannedHoursDone).toBeCloseTo(n(r.planned_done), 1);
    }
    expect(answer.weekFrom).toBe('2026-11-30');
    expect(answer.total.labour.season.actualHours).toBeGreaterThan(1000);
  });

  test('should count mowings on time, late and missed as Records does', async () => {
    const r = await one(sql`
      select count(*) as asked,
        sum(case when status = 'done' and (done_at at time zone ${DEFAULT_TIME_ZONE})::date > coalesce((details->>'dueBy')::date, planned_date) then 1 else 0 end) as late,
        sum(case when status = 'done' then 1 else 0 end) as done,
        sum(case when status <> 'done' and planned_date < ${TODAY}::date then 1 else 0 end) as missed
      from work_orders where task = 'mow' and planned_date between ${SEASON_FROM}::date and ${SEASON_TO}::date`);
    const m = answer.total.mowings.season;
    expect(m).toEqual({ asked: n(r.asked), late: n(r.late), onTime: n(r.done) - n(r.late), missed: n(r.missed) });
    expect(m.late).toBeGreaterThan(0);
    expect(m.onTime).toBeGreaterThan(m.late);
    const records = await getRecords(head, { from: SEASON_FROM, to: SEASON_TO }, TODAY);
    expect(records.totals.mowingsLate).toBe(m.late);
    expect(records.totals.mowingsDone).toBe(m.onTime + m.late);
    expect(records.totals.mowingsMissed).toBe(m.missed);
  });

  test('should weigh N applied, water and paint as SQL over the done orders and N planned by the engine per field', async () => {
    const precip = (await loadParameters(database.db)).irrigation.precipRateMmPerH;
    const r = await one(sql`
      select
        sum(case when wo.task = 'feed' and wo.status = 'done' then (wo.details->>'nGPerM2')::float8 * f.area_m2 / 1000 else 0 end) as n_kg,
        sum(case when wo.task = 'irrigate' and wo.status = 'done' then
          case when wo.details->>'system' = 'quick_coupler' then (wo.details->>'runTimeMin')::float8 * ${precip} / 60 * f.area_m2 else (wo.details->>'volumeL')::float8 end else 0 end) as water_used,
        sum(case when wo.task = 'irrigate' and wo.status <> 'skipped' then
          case when wo.details->>'system' = 'quick_coupler' then (wo.details->>'runTimeMin')::float8 * ${precip} / 60 * f.area_m2 else (wo.details->>'volumeL')::float8 end else 0 end) as water_budget,
        sum(case when wo.task = 'paint_lines' and wo.status = 'done' then (wo.details->>'paintL')::float8 else 0 end) as paint_used,
        sum(case when wo.task = 'paint_lines' and wo.status <> 'skipped' then (wo.details->>'paintL')::float8 else 0 end) as paint_planned
      from work_orders wo join fields f on f.id = wo.field_id
      where wo.planned_date between ${SEASON_FROM}::date and ${SEASON_TO}::date`);
    const t = answer.total;
    expect(t.nitrogen.appliedKg).toBeCloseTo(n(r.n_kg), 1);
    expect(t.nitrogen.appliedKg).toBeGreaterThan(0);
    expect(t.water.usedL).toBeCloseTo(n(r.water_used), -1);
    expect(t.water.budgetL).toBeCloseTo(n(r.water_budget), -1);
    expect(t.water.budgetL).toBeGreaterThan(t.water.usedL);
    // Six fields, each with a done touch-up of 3.5 L and a first coat of 6.2 L to come.
    expect(t.paint).toEqual({ usedL: 21, plannedL: 58.2 });
    expect(n(r.paint_used)).toBeCloseTo(21, 5);

    // The feed plan: the engine's annual N of each field, one field at a time.
    const { standards } = await loadStandards(database.db);
    const fields = (await database.db.execute<{ grass: Grass; level: Level; clippings: 'returned' | 'removed'; irrigation: string; area_m2: number }>(sql`
      select grass, maintenance_level as level, clippings, irrigation, area_m2 from fields where status <> 'retired'`)).rows;
    const planKg = fields.reduce((s, f) => {
      const irrigated = f.irrigation !== 'none' && (standards[f.level].irrigationShareOfEtc ?? 0) > 0;
      return s + (annualNitrogen({ grass: f.grass, level: f.level, clippings: f.clippings, irrigated }, standards).gPerM2 * f.area_m2) / 1000;
    }, 0);
    expect(t.nitrogen.planKg).toBeCloseTo(planKg, 1);
  });

  test('should count open requests and closures as SQL over their rows', async () => {
    const req = await one(sql`select sum(case when state in ('requested', 'scheduled') then 1 else 0 end) as open,
      sum(case when state = 'requested' then 1 else 0 end) as waiting, sum(case when state = 'scheduled' then 1 else 0 end) as scheduled,
      sum(case when state in ('done', 'declined') and (closed_at at time zone ${DEFAULT_TIME_ZONE})::date >= ${SEASON_FROM}::date then 1 else 0 end) as closed from field_requests`);
    expect(answer.total.requests).toEqual({ open: n(req.open), waiting: n(req.waiting), scheduled: n(req.scheduled), closedInSeason: n(req.closed) });
    const now = await one(sql`select sum(case when status = 'closed' then 1 else 0 end) as closed, sum(case when status = 'restricted' then 1 else 0 end) as restricted from fields`);
    const decided = await one(sql`select count(*) as c from field_closures where status <> 'open' and (from_at at time zone ${DEFAULT_TIME_ZONE})::date between ${SEASON_FROM}::date and ${SEASON_TO}::date`);
    expect(answer.total.closures).toEqual({ closedNow: n(now.closed), restrictedNow: n(now.restricted), inSeason: n(decided.c) });
    expect(answer.total.closures.inSeason).toBeGreaterThan(0);
  });

  test('should make the department the sum of its districts', () => {
    const sum = (f: (b: Overview['total']) => number) => answer.districts.reduce((s, d) => s + f(d), 0);
    expect(answer.districts.length).toBeGreaterThan(1);
    expect(answer.districtId).toBeNull();
    expect(sum((d) => d.labour.season.ordersPlanned)).toBe(answer.total.labour.season.ordersPlanned);
    expect(sum((d) => d.mowings.season.late)).toBe(answer.total.mowings.season.late);
    expect(sum((d) => d.levels.reduce((s, l) => s + l.fields, 0))).toBe(answer.total.levels.reduce((s, l) => s + l.fields, 0));
    expect(sum((d) => d.requests.open)).toBe(answer.total.requests.open);
  });
});

describe('overview scope', () => {
  test('should give a foreman his own district when he names none, and the same figures as the head sees for it', async () => {
    const own = await getOverview(foreman, {});
    expect(own.districtId).toBe(north);
    expect(own.districts.map((d) => d.districtId)).toEqual([north]);
    expect(own.total).toEqual(answer.districts.find((d) => d.districtId === north));
    expect(await getOverview(foreman, { districtId: north })).toEqual(own);
  });

  test('should refuse a foreman another district’s figures', async () => {
    await expect(getOverview(foreman, { districtId: south })).rejects.toMatchObject({ code: 'auth/forbidden' });
  });

  test('should refuse crews and partners, and answer 404 for a district that does not exist', async () => {
    for (const role of ['crew', 'partner'] as const) {
      const actor: Actor = { id: 9, role, districtId: north, crewId: role === 'crew' ? 1 : null, siteIds: [] };
      await expect(getOverview({ ...head, actor, ability: defineAbilityFor(actor) }, {})).rejects.toMatchObject({ code: 'auth/forbidden' });
    }
    await expect(getOverview(head, { districtId: 999_999 })).rejects.toMatchObject({ code: 'district/not_found' });
  });

  test('should answer an earlier season without this year’s work', async () => {
    const last = await getOverview(head, { season: 2025 });
    const r = await one(sql`select count(*) as c from work_orders where planned_date between '2025-01-01' and '2025-12-31'`);
    expect(last.total.labour.season.ordersPlanned).toBe(n(r.c));
    expect(last.seasonFrom).toBe('2025-01-01');
  });
});
