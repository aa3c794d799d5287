/**
 * The department head's overview: per district and for the department, the quantities a
 * budget is defended with. Every figure is a SQL aggregate over the rows the portal links to
 * (work orders, field checks, requests, closures); the department is the sum of its districts,
 * so no figure is counted twice and no loop runs over the rows themselves.
 *
 * Definitions are those of the pages the figures link to: labour and mowings as Records counts
 * them (a mowing is late when done after its one-third-rule due date `details.dueBy`, missed
 * when not done and its day has passed), the latest field check per field as the fields list and
 * the map show it, the feed plan's annual N from the engine's `annualNitrogen`.
 */
import { LEVELS, addDaysIso, annualNitrogen, errors, type Grass, type Level, type Overview, type OverviewBlock, type OverviewLabour, type OverviewMowings, type OverviewQuery } from '@swardwise/domain';
import { sql, type SQL } from 'drizzle-orm';
import type { Db } from '../db/client.ts';
import { authorize, type Ctx } from './context.ts';
import { loadParameters, loadStandards } from './standards.ts';

const r2 = (v: number) => Math.round(v * 100) / 100;
const num = (v: unknown) => (v === null || v === undefined ? 0 : Number(v));

type Row = Record<string, unknown>;

/** Which districts the answer covers: the one asked for (checked), a foreman's own, or all. */
async function districtsOf(ctx: Ctx, q: OverviewQuery): Promise<{ id: number; name: string }[]> {
  const { actor } = ctx;
  if (q.districtId !== undefined) authorize(ctx, 'read', 'Overview', { districtId: q.districtId });
  else if (actor.role === 'foreman') authorize(ctx, 'read', 'Overview', { districtId: actor.districtId ?? -1 });
  else authorize(ctx, 'read', 'Overview');
  const only = q.districtId ?? (actor.role === 'foreman' ? (actor.districtId ?? -1) : null);
  const res = await ctx.db.execute<{ id: number; name: string }>(sql`select id, name from districts ${only === null ? sql`` : sql`where id = ${only}`} order by name, id`);
  if (only !== null && res.rows.length === 0) throw errors.notFound('district', only);
  return res.rows;
}

const emptyLabour = (): OverviewLabour => ({ plannedHours: 0, actualHours: 0, plannedHoursDone: 0, ordersPlanned: 0, ordersDone: 0 });
const emptyMowings = (): OverviewMowings => ({ asked: 0, onTime: 0, late: 0, missed: 0 });

interface Acc {
  block: OverviewBlock;
  /** Sum of the latest scores per level, for a weighted mean over districts. */
  scoreSum: Record<Level, number>;
}

function emptyAcc(districtId: number | null, name: string, targets: Record<Level, number>): Acc {
  return {
    block: {
      districtId,
      name,
      levels: LEVELS.map((level) => ({ level, fields: 0, areaM2: 0, scored: 0, scoreAvg: null, targetScore: targets[level], belowTarget: 0 })),
      labour: { week: emptyLabour(), season: emptyLabour() },
      mowings: { week: emptyMowings(), season: emptyMowings() },
      nitrogen: { appliedKg: 0, planKg: 0 },
      water: { budgetL: 0, usedL: 0 },
      paint: { plannedL: 0, usedL: 0 },
      requests: { open: 0, waiting: 0, scheduled: 0, closedInSeason: 0 },
      closures: { closedNow: 0, restrictedNow: 0, inSeason: 0 },
    },
    scoreSum: { 1: 0, 2: 0, 3: 0, 4: 0 },
  };
}

/** The department's date of a stored instant, in SQL (the one clock's zone). */
const localDate = (column: SQL, tz: string) => sql`(${column} at time zone ${tz})::date`;

/**
 * The labour and mowing sums of the days in [from, to], per district, from the day rollup the
 * triggers keep (rollup_overview_day). A mowing is late when done after its one-third rule's
 * due date (`details.dueBy`, else its planned day), as Records has it; missed when not done and
 * its day is before today.
 */
function workSums(from: string, to: string, today: string, prefix: '' | 'w_'): SQL {
  const inSpan = sql`r.day between ${from}::date and ${to}::date`;
  const as = (name: string) => sql.raw(`${prefix}${name}`);
  const total = (column: string, name: string) => sql`coalesce(sum(${sql.raw(`r.${column}`)}) filter (where ${inSpan}), 0) as ${as(name)}`;
  return sql.join(
    [
      total('orders', 'orders'),
      total('planned_hours', 'planned_hours'),
      total('orders_done', 'orders_done'),
      total('actual_hours_done', 'actual_hours'),
      total('planned_hours_done', 'planned_hours_done'),
      total('mow_asked', 'mow_asked'),
      total('mow_done', 'mow_done'),
      total('mow_late', 'mow_late'),
      sql`coalesce(sum(r.mow_not_done) filter (where ${inSpan} and r.day < ${today}::date), 0) as ${as('mow_missed')}`,
    ],
    sql`, `,
  );
}

/**
 * The late mowings of the rollup are counted in the zone stored with it; when the department's
 * zone has changed since, count them again (once, in one transaction).
 */
async function rollupInZone(ctx: Ctx, tz: string): Promise<void> {
  const stored = await ctx.db.execute<{ time_zone: string }>(sql`select time_zone from rollup_state where id = 1`);
  if (stored.rows[0]?.time_zone === tz) return;
  await (ctx.db as Db).transaction(async (tx) => {
    await tx.execute(sql`lock table rollup_state in exclusive mode`);
    const again = await tx.execute<{ time_zone: string }>(sql`select time_zone from rollup_state where id = 1`);
    if (again.rows[0]?.time_zone !== tz) await tx.execute(sql`select rollup_rebuild(${tz})`);
  });
}

function labourOf(r: Row | undefined, prefix: string): { labour: OverviewLabour; mowings: OverviewMowings } {
  const g = (k: string) => num(r?.[`${prefix}${k}`]);
  const done = g('mow_done');
  const late = g('mow_late');
  return {
    labour: { plannedHours: g('planned_hours'), actualHours: g('actual_hours'), plannedHoursDone: g('planned_hours_done'), ordersPlanned: g('orders'), ordersDone: g('orders_done') },
    mowings: { asked: g('mow_asked'), onTime: done - late, late, missed: g('mow_missed') },
  };
}

/** The overview of the caller's districts for a season (default: the department's current one). */
export async function getOverview(ctx: Ctx, q: OverviewQuery): Promise<Overview> {
  const list = await districtsOf(ctx, q);
  const ids = list.map((d) => d.id);
  const today = ctx.clock.today();
  const tz = ctx.clock.timeZone;
  const season = q.season ?? Number(today.slice(0, 4));
  const seasonFrom = `${season}-01-01`;
  const seasonTo = `${season}-12-31`;
  const weekFrom = ctx.clock.weekStart();
  const weekTo = addDaysIso(weekFrom, 6);
  const [{ standards }, params] = [await loadStandards(ctx.db), await loadParameters(ctx.db)];
  const targets = Object.fromEntries(LEVELS.map((l) => [l, standards[l].targetScore])) as Record<Level, number>;
  const precipRate = params.irrigation.precipRateMmPerH;
  const inDistricts = (column: SQL) => (ids.length ? sql`${column} in (${sql.join(ids.map((i) => sql`${i}`), sql`, `)})` : sql`false`);

  const acc = new Map<number, Acc>(list.map((d) => [d.id, emptyAcc(d.id, d.name, targets)]));
  const of = (r: Row) => acc.get(Number(r.district_id));

  // Fields by level with each one's latest field check (as the fields list shows it).
  const fieldRows = await ctx.db.execute<Row>(sql`
    select s.district_id, f.maintenance_level as level, count(*) as fields, sum(f.area_m2) as area_m2,
      count(l.score) as scored, coalesce(sum(l.score), 0) as score_sum,
      count(*) filter (where l.score < (${sql.raw(`array[${LEVELS.map((l) => Number(targets[l])).join(', ')}]::float8[]`)})[f.maintenance_level]) as below
    from fields f join sites s on s.id = f.site_id
    -- The latest check of each field as the trigger on field_checks keeps it.
    left join rollup_field_latest l on l.field_id = f.id
    where f.status <> 'retired' and ${inDistricts(sql`s.district_id`)}
    group by s.district_id, f.maintenance_level`);
  for (const r of fieldRows.rows) {
    const a = of(r);
    if (!a) continue;
    const lv = a.block.levels.find((x) => x.level === Number(r.level))!;
    Object.assign(lv, { fields: num(r.fields), areaM2: num(r.area_m2), scored: num(r.scored), belowTarget: num(r.below) });
    a.scoreSum[lv.level] = num(r.score_sum);
  }

  // The season's feed plan: the engine's annual N for each kind of field, times its area.
  const feedRows = await ctx.db.execute<Row>(sql`
    select s.district_id, f.grass, f.maintenance_level as level, f.clippings, f.irrigation <> 'none' as has_irrigation, sum(f.area_m2) as area_m2
    from fields f join sites s on s.id = f.site_id
    where f.status <> 'retired' and ${inDistricts(sql`s.district_id`)}
    group by 1, 2, 3, 4, 5`);
  for (const r of feedRows.rows) {
    const a = of(r);
    if (!a) continue;
    const level = Number(r.level) as Level;
    const irrigated = r.has_irrigation === true && (standards[level].irrigationShareOfEtc ?? 0) > 0;
    const annual = annualNitrogen({ grass: r.grass as Grass, level, clippings: r.clippings as 'returned' | 'removed', irrigated }, standards);
    a.block.nitrogen.planKg += (annual.gPerM2 * num(r.area_m2)) / 1000;
  }

  // Labour, mowings and inputs of the season and of the department's current week, from the day rollup.
  await rollupInZone(ctx, tz);
  const lo = weekFrom < seasonFrom ? weekFrom : seasonFrom;
  const hi = weekTo > seasonTo ? weekTo : seasonTo;
  // Inputs: N of the feed orders done (g N/m² × area), the water the week plans scheduled (a
  // controller's week volume; a quick-coupler run's minutes × precipitation rate × area), the
  // paint concentrate of line marking.
  const inSeason = sql`r.day between ${seasonFrom}::date and ${seasonTo}::date`;
  const seasonSum = (expr: SQL, name: string) => sql`coalesce(sum(${expr}) filter (where ${inSeason}), 0)::float8 as ${sql.raw(name)}`;
  const workRows = await ctx.db.execute<Row>(sql`
    select r.district_id,
      ${workSums(seasonFrom, seasonTo, today, '')},
      ${workSums(weekFrom, weekTo, today, 'w_')},
      ${seasonSum(sql`r.n_kg_done`, 'n_kg')},
      ${seasonSum(sql`r.water_vol_budget + r.water_qc_budget * ${precipRate}::numeric / 60`, 'water_budget')},
      ${seasonSum(sql`r.water_vol_used + r.water_qc_used * ${precipRate}::numeric / 60`, 'water_used')},
      ${seasonSum(sql`r.paint_planned`, 'paint_planned')},
      ${seasonSum(sql`r.paint_used`, 'paint_used')}
    from rollup_overview_day r
    where r.day between ${lo}::date and ${hi}::date and ${inDistricts(sql`r.district_id`)}
    group by r.district_id`);
  for (const r of workRows.rows) {
    const a = of(r);
    if (!a) continue;
    const s = labourOf(r, '');
    const w = labourOf(r, 'w_');
    a.block.labour = { season: s.labour, week: w.labour };
    a.block.mowings = { season: s.mowings, week: w.mowings };
    a.block.nitrogen.appliedKg = num(r.n_kg);
    a.block.water = { budgetL: num(r.water_budget), usedL: num(r.water_used) };
    a.block.paint = { plannedL: num(r.paint_planned), usedL: num(r.paint_used) };
  }

  // Partners' requests: open now, and closed (done or declined) in the season.
  const requestRows = await ctx.db.execute<Row>(sql`
    select district_id,
      count(*) filter (where state = 'requested') as waiting,
      count(*) filter (where state = 'scheduled') as scheduled,
      count(*) filter (where state in ('done', 'declined') and closed_at is not null and ${localDate(sql`closed_at`, tz)} between ${seasonFrom}::date and ${seasonTo}::date) as closed
    from field_requests where ${inDistricts(sql`district_id`)}
    group by district_id`);
  for (const r of requestRows.rows) {
    const a = of(r);
    if (a) a.block.requests = { open: num(r.waiting) + num(r.scheduled), waiting: num(r.waiting), scheduled: num(r.scheduled), closedInSeason: num(r.closed) };
  }

  // Closures: fields closed or restricted now, and closures or restrictions decided in the season.
  const closureRows = await ctx.db.execute<Row>(sql`
    select s.district_id,
      count(*) filter (where f.status = 'closed') as closed_now,
      count(*) filter (where f.status = 'restricted') as restricted_now,
      (select count(*) from field_closures fc join fields f2 on f2.id = fc.field_id join sites s2 on s2.id = f2.site_id
        where s2.district_id = s.district_id and fc.status in ('closed', 'restricted')
          and ${localDate(sql`fc.from_at`, tz)} between ${seasonFrom}::date and ${seasonTo}::date) as in_season
    from fields f join sites s on s.id = f.site_id
    where ${inDistricts(sql`s.district_id`)}
    group by s.district_id`);
  for (const r of closureRows.rows) {
    const a = of(r);
    if (a) a.block.closures = { closedNow: num(r.closed_now), restrictedNow: num(r.restricted_now), inSeason: num(r.in_season) };
  }

  const districtsOut = [...acc.values()].map(finish);
  const total = list.length === 1 ? districtsOut[0]! : finish(sumOf([...acc.values()], targets));
  return { season, seasonFrom, seasonTo, weekFrom, weekTo, asOf: today, districtId: list.length === 1 && (q.districtId !== undefined || ctx.actor.role === 'foreman') ? list[0]!.id : null, total, districts: districtsOut };
}

/** Adds each count of `part` into the same count of `into`. */
function addCounts<T extends { [K in keyof T]: number }>(into: T, part: T): void {
  for (const k of Object.keys(into) as (keyof T)[]) (into[k] as number) += part[k];
}

/** The department: the sum of its districts (the score a mean over every scored field). */
function sumOf(parts: Acc[], targets: Record<Level, number>): Acc {
  const t = emptyAcc(null, 'Department', targets);
  const b = t.block;
  for (const { block: p, scoreSum } of parts) {
    for (const lv of p.levels) {
      const x = b.levels.find((y) => y.level === lv.level)!;
      x.fields += lv.fields;
      x.areaM2 += lv.areaM2;
      x.scored += lv.scored;
      x.belowTarget += lv.belowTarget;
      t.scoreSum[lv.level] += scoreSum[lv.level];
    }
    for (const span of ['week', 'season'] as const) {
      addCounts(b.labour[span], p.labour[span]);
      addCounts(b.mowings[span], p.mowings[span]);
    }
    for (const group of ['nitrogen', 'water', 'paint', 'requests', 'closures'] as const) addCounts<Record<string, number>>(b[group], p[group]);
  }
  return t;
}

/** Rounds what is shown: hours and kg to 0.01, litres and m² to whole units, the score to 0.1. */
function finish({ block, scoreSum }: Acc): OverviewBlock {
  const labour = (l: OverviewLabour): OverviewLabour => ({ ...l, plannedHours: r2(l.plannedHours), actualHours: r2(l.actualHours), plannedHoursDone: r2(l.plannedHoursDone) });
  return {
    ...block,
    levels: block.levels.map((lv) => ({ ...lv, areaM2: Math.round(lv.areaM2), scoreAvg: lv.scored ? Math.round((scoreSum[lv.level] / lv.scored) * 10) / 10 : null })),
    labour: { week: labour(block.labour.week), season: labour(block.labour.season) },
    nitrogen: { appliedKg: r2(block.nitrogen.appliedKg), planKg: r2(block.nitrogen.planKg) },
    water: { budgetL: Math.round(block.water.budgetL), usedL: Math.round(block.water.usedL) },
    paint: { plannedL: r2(block.paint.plannedL), usedL: r2(block.paint.usedL) },
  };
}
