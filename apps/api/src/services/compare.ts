/**
 * Sites compared over a period: hours, inputs and money per acre, and the surface score they
 * bought. Summed in SQL (one grouped pass over the period's done work orders, per site, crew
 * and machine kind), priced in the domain (`costOfWork`), never a loop over orders here.
 */
import { sql, type SQL } from 'drizzle-orm';
import {
  addDaysIso,
  costOfWork,
  errors,
  KG_PER_LB,
  M2_PER_ACRE,
  M2_PER_FT2,
  MACHINE_OF_TASK,
  type CompareQuery,
  type CompareSiteRow,
  type CompareSitesAnswer,
  type CostSettings,
  type EquipmentKind,
  type Level,
  type WorkCost,
  WORK_TASKS,
} from '@swardwise/domain';
import { answerVersions, applications, districts, equipment, fieldChecks, fields, sites, workOrders } from '../db/schema/index.ts';
import { cachedAnswer } from './answer-cache.ts';
import { authorize, type Ctx } from './context.ts';
import { readCosts } from './costs.ts';

/** The days compared: the season (the department's calendar year to today), the last 12 months, or the range asked. */
export function comparePeriod(today: string, q: CompareQuery): CompareSitesAnswer['period'] {
  if (q.period === 'range') return { kind: 'range', from: q.from!, to: q.to! };
  if (q.period === 'last12') return { kind: 'last12', from: addDaysIso(today, -364), to: today };
  return { kind: 'season', from: `${today.slice(0, 4)}-01-01`, to: today };
}

/** A number kept in a work order's details, or 0 when absent or not a number. */
const detail = (path: SQL): SQL => sql`case when jsonb_typeof(${path}) = 'number' then (${path}#>>'{}')::float8 else 0 end`;

/**
 * The machine an order ran: its equipment's kind (`e.kind`), else the task's usual machine;
 * `reel` tells a reel mowing from a rotary one.
 */
const machineKindOf = (task: SQL, reel: SQL): SQL => sql`coalesce(e.kind, case ${task} ${sql.join(
  Object.entries(MACHINE_OF_TASK)
    .filter(([, kind]) => kind !== null)
    .map(([t, kind]) => (t === 'mow' ? sql`when 'mow' then case when ${reel} then 'reel_mower' else 'rotary_mower' end` : sql`when ${sql.raw(`'${t}'`)} then ${sql.raw(`'${kind}'`)}`)),
  sql` `,
)} end)`;

/** The first day of the month after the one of `iso`. */
const nextMonth = (iso: string): string => {
  const [y, m] = [Number(iso.slice(0, 4)), Number(iso.slice(5, 7))];
  return m === 12 ? `${y + 1}-01-01` : `${y}-${String(m + 1).padStart(2, '0')}-01`;
};

/**
 * The period cut into whole months (read from the month rollup the triggers keep) and the days
 * before and after them (read from the orders themselves, through work_orders_task_date_idx).
 */
export function splitByMonth(from: string, to: string): { months: [string, string] | null; days: [string, string][] } {
  const first = from.endsWith('-01') ? from : nextMonth(from);
  const last = addDaysIso(nextMonth(to), -1) === to ? to : addDaysIso(`${to.slice(0, 7)}-01`, -1);
  if (first > last) return { months: null, days: [[from, to]] };
  const days: [string, string][] = [];
  if (from < first) days.push([from, addDaysIso(first, -1)]);
  if (last < to) days.push([addDaysIso(last, 1), to]);
  return { months: [first, last], days };
}

/** Seed sown, kg, from an application's label rate and area. */
const SEED_KG = sql`case a.rate_unit
  when 'g/m²' then a.rate * a.area_m2 / 1000
  when 'kg/ha' then a.rate * a.area_m2 / 10000
  when 'lb/1000 ft²' then a.rate * ${KG_PER_LB}::float8 * a.area_m2 / (1000 * ${M2_PER_FT2}::float8)
  when 'oz/1000 ft²' then a.rate * ${KG_PER_LB / 16}::float8 * a.area_m2 / (1000 * ${M2_PER_FT2}::float8)
  else 0 end`;

type SiteFacts = { site_id: number; site_name: string; district_id: number; district_name: string; field_count: number; area_m2: number; level: number };
type CrewWork = { site_id: number; crew_id: number | null; orders: number; hours: number; kg_n: number; water_m3: number; paint_l: number; colourant_l: number };
type MachineWork = { site_id: number; kind: EquipmentKind; hours: number };

/** A query's rows as one JSON array in text (in `order`, else as they come). */
const jsonRows = (query: SQL, order: SQL = sql``): SQL => sql`(select coalesce(json_agg(q ${order}), '[]'::json)::text from (${query}) q)`;

const perAcre = (value: number, acres: number): number | null => (acres > 0 ? value / acres : null);

/**
 * The (year, month, sign) terms whose year-to-date rows add up to the whole months
 * [first, last]: each year's last month counted in, the month before the first taken out.
 */
function ytdTerms(first: string, last: string): SQL {
  const [y1, m1, y2, m2] = [Number(first.slice(0, 4)), Number(first.slice(5, 7)), Number(last.slice(0, 4)), Number(last.slice(5, 7))];
  const terms: [number, number, number][] = [];
  for (let y = y1; y <= y2; y++) terms.push([y, y === y2 ? m2 : 12, 1]);
  if (m1 > 1) terms.push([y1, m1 - 1, -1]);
  return sql`(values ${sql.join(
    terms.map(([y, m, sign]) => sql`(${y}::int, ${m}::int, ${sign}::int)`),
    sql`, `,
  )}) as t(year, month, sign)`;
}

const ORDERS_DAYS = (a: string, b: string, inDistrict: (col: SQL) => SQL): SQL =>
  sql`wo.status = 'done' and wo.task in (${sql.join(
    WORK_TASKS.map((t) => sql`${t}`),
    sql`, `,
  )}) and wo.planned_date between ${a} and ${b} and ${inDistrict(sql`wo.district_id`)}`;

/** Sites in the caller's scope with their figures over the period. The head sees every district (or the one asked); a foreman only his own. */
export async function compareSites(ctx: Ctx, q: CompareQuery): Promise<CompareSitesAnswer> {
  authorize(ctx, 'read', 'SiteComparison');
  const { actor } = ctx;
  let districtId: number | null = q.districtId ?? null;
  if (actor.role === 'foreman') {
    // A foreman never widens his scope: another district's id is refused, none means his own.
    if (districtId !== null && districtId !== actor.districtId) throw errors.forbidden('A foreman compares the sites of his own district');
    districtId = actor.districtId ?? -1;
  }
  authorize(ctx, 'read', 'SiteComparison', districtId === null ? undefined : { districtId });
  const period = comparePeriod(ctx.clock.today(), q);
  // Kept until any table it reads is written (the change counters of `answer_versions`); worked
  // out again, it reads only the sites whose work changed when work orders alone were written.
  const scope = districtId;
  return cachedAnswer(ctx, 'compare', JSON.stringify([scope, period]), () => buildComparison(ctx, scope, period));
}

/** Done work per site and crew (orders, hours, inputs) and per site and machine kind (hours). */
interface Work {
  crews: SQL;
  machines: SQL;
}

/** The done orders of the days [a, b], read from the orders themselves (through work_orders_task_date_idx). */
function workOfDays(days: [string, string][], inDistrict: (col: SQL) => SQL): Work | null {
  if (days.length === 0) return null;
  const crews = days.map(
    ([a, b]) => sql`
      select wo.site_id, wo.crew_id, count(*)::int as orders,
        sum(coalesce(wo.actual_hours, wo.planned_hours)::float8) as hours,
        sum(case when wo.task = 'feed' then ${detail(sql`wo.details->'nGPerM2'`)} * f.area_m2 / 1000 else 0 end)::float8 as kg_n,
        sum(case when wo.task = 'irrigate' then ${detail(sql`wo.details->'volumeL'`)} / 1000 else 0 end)::float8 as water_m3,
        sum(case when wo.task = 'paint_lines' then ${detail(sql`wo.details->'paintL'`)} else 0 end)::float8 as paint_l,
        sum(case when wo.task = 'colourant' then ${detail(sql`wo.details->'colourant'->'rateMlPerM2'`)} * ${detail(sql`wo.details->'colourant'->'areaM2'`)} / 1000 else 0 end)::float8 as colourant_l
      from ${workOrders} wo join ${fields} f on f.id = wo.field_id
      where ${ORDERS_DAYS(a, b, inDistrict)}
      group by wo.site_id, wo.crew_id`,
  );
  const machines = days.map(
    ([a, b]) => sql`
      select wo.site_id, ${machineKindOf(sql`wo.task`, sql`coalesce(wo.details->>'mowerKind', wo.details->>'mower', '') like 'reel%'`)} as kind,
        sum(coalesce(wo.actual_hours, wo.planned_hours)::float8) as hours
      from ${workOrders} wo join ${fields} f on f.id = wo.field_id left join ${equipment} e on e.id = wo.equipment_id
      where ${ORDERS_DAYS(a, b, inDistrict)}
      group by 1, 2`,
  );
  return {
    crews: sql`
      select site_id, crew_id, sum(orders)::int as orders, sum(hours)::float8 as hours, sum(kg_n)::float8 as kg_n,
        sum(water_m3)::float8 as water_m3, sum(paint_l)::float8 as paint_l, sum(colourant_l)::float8 as colourant_l
      from (${sql.join(crews, sql` union all `)}) g
      group by site_id, crew_id`,
    machines: sql`select site_id, kind, sum(hours)::float8 as hours from (${sql.join(machines, sql` union all `)}) g where kind is not null group by site_id, kind`,
  };
}

/**
 * The done work of the whole months [first, last], from the year-to-date rollups the triggers
 * keep; only the sites listed when `onlySites` is given.
 */
function workOfMonths([first, last]: [string, string], inDistrict: (col: SQL) => SQL, onlySites?: number[]): Work {
  const ofSites = (col: SQL): SQL => (onlySites ? sql`${col} in (${sql.join(onlySites.map((id) => sql`${id}::int`), sql`, `)})` : sql`true`);
  return {
    crews: sql`
      select c.site_id, nullif(c.crew_key, 0) as crew_id, sum(t.sign * c.orders)::int as orders, sum(t.sign * c.hours)::float8 as hours,
        sum(t.sign * c.kg_n)::float8 as kg_n, sum(t.sign * c.water_m3)::float8 as water_m3, sum(t.sign * c.paint_l)::float8 as paint_l, sum(t.sign * c.colourant_l)::float8 as colourant_l
      from rollup_compare_crew_ytd c join ${ytdTerms(first, last)} on c.year = t.year and c.month = t.month
      where ${inDistrict(sql`c.district_id`)} and ${ofSites(sql`c.site_id`)}
      group by 1, 2`,
    machines: sql`
      select g.site_id, g.kind, sum(g.hours)::float8 as hours from (
        select r.site_id, ${machineKindOf(sql`r.task`, sql`r.reel`)} as kind, t.sign * r.hours as hours
        from rollup_compare_machine_ytd r join ${ytdTerms(first, last)} on r.year = t.year and r.month = t.month left join ${equipment} e on e.id = nullif(r.equipment_key, 0)
        where ${inDistrict(sql`r.district_id`)} and ${ofSites(sql`r.site_id`)}) g
      where g.kind is not null
      group by 1, 2`,
  };
}

/**
 * Per site, the sum of the change counters of the year-to-date rows the months [first, last]
 * are read from (`rollup_compare_site_versions`): it moves exactly when one of them changed.
 */
function monthVersions([first, last]: [string, string]): SQL {
  return jsonRows(sql`
    select v.site_id, sum(v.version)::float8 as version
    from rollup_compare_site_versions v join ${ytdTerms(first, last)} on v.year = t.year and v.month = t.month
    group by v.site_id`);
}

/**
 * What one comparison (a scope and period) was last worked out from: its parts that come from
 * the rollups of whole months and the other tables, the change counters of every table as
 * they were, and each site's month counter. After work orders alone were written, only the
 * sites whose month counter moved are read again; the loose days are always read afresh.
 */
interface ComparisonBase {
  tables: string;
  siteVersions: Map<number, number>;
  facts: SiteFacts[];
  months: { crews: CrewWork[]; machines: MachineWork[] };
  seed: { site_id: number; seed_kg: number }[];
  scores: { site_id: number; score: number; checked: number }[];
}
const bases = new WeakMap<object, Map<string, ComparisonBase>>();
const BASES_KEPT = 8;

/** How comparisons were worked out since start: in full, or from the last one with some sites read again. */
export const comparisonBuilds = { full: 0, sitesReadAgain: 0 };

/** The change counters of every table but the work orders (whose changes the site counters follow). */
const TABLE_VERSIONS = sql`(select coalesce(json_object_agg(scope, version order by scope), '{}'::json)::text from ${answerVersions} where scope <> 'work_orders')`;

async function buildComparison(ctx: Ctx, districtId: number | null, period: CompareSitesAnswer['period']): Promise<CompareSitesAnswer> {
  const inDistrict = (col: SQL): SQL => (districtId === null ? sql`true` : sql`${col} = ${districtId}`);
  const { months, days } = splitByMonth(period.from, period.to);
  const loose = workOfDays(days, inDistrict);
  const none = sql`'[]'`;

  // One statement for what is read every time: the counters and the loose days' work.
  const [{ costs }, first] = await Promise.all([
    readCosts(ctx.db),
    ctx.db.execute<{ tables: string; sites: string; crews: string; machines: string }>(sql`select
      ${TABLE_VERSIONS} as tables,
      ${months ? monthVersions(months) : none} as sites,
      ${loose ? jsonRows(loose.crews) : none} as crews,
      ${loose ? jsonRows(loose.machines) : none} as machines`),
  ]);
  const now = first.rows[0]!;
  const siteVersions = new Map((JSON.parse(now.sites) as { site_id: number; version: number }[]).map((r) => [r.site_id, r.version]));

  let kept = bases.get(ctx.db);
  if (!kept) bases.set(ctx.db, (kept = new Map()));
  const key = JSON.stringify([districtId, period]);
  const was = kept.get(key);
  let base: ComparisonBase;
  if (was && was.tables === now.tables) {
    // Only work orders changed: read again the months of the sites whose counter moved.
    const moved = [...new Set([...siteVersions.keys(), ...was.siteVersions.keys()])].filter((id) => (siteVersions.get(id) ?? 0) !== (was.siteVersions.get(id) ?? 0));
    let monthsWork = was.months;
    if (months && moved.length > 0) {
      const again = workOfMonths(months, inDistrict, moved);
      const res = await ctx.db.execute<{ crews: string; machines: string }>(sql`select ${jsonRows(again.crews)} as crews, ${jsonRows(again.machines)} as machines`);
      const gone = new Set(moved);
      monthsWork = {
        crews: [...was.months.crews.filter((g) => !gone.has(g.site_id)), ...(JSON.parse(res.rows[0]!.crews) as CrewWork[])],
        machines: [...was.months.machines.filter((g) => !gone.has(g.site_id)), ...(JSON.parse(res.rows[0]!.machines) as MachineWork[])],
      };
    }
    base = { ...was, siteVersions, months: monthsWork };
    comparisonBuilds.sitesReadAgain++;
  } else {
    base = { tables: now.tables, siteVersions, ...(await readBase(ctx, inDistrict, period, months)) };
    comparisonBuilds.full++;
  }
  kept.delete(key);
  if (kept.size >= BASES_KEPT) kept.delete(kept.keys().next().value!);
  kept.set(key, base);

  const rows = rowsOf(base, JSON.parse(now.crews) as CrewWork[], JSON.parse(now.machines) as MachineWork[], costs);
  return { period, currency: costs.currency, districtId, rows, totals: totalsOf(rows) };
}

/**
 * Everything but the loose days, in one statement answering JSON arrays: PGlite hands
 * thousands of rows to the API a row and a column at a time (most of a rebuild's time on a big
 * city), one text value at once. float8 prints the same shortest exact digits in JSON as in a
 * row, so the numbers are the same.
 */
async function readBase(ctx: Ctx, inDistrict: (col: SQL) => SQL, period: CompareSitesAnswer['period'], months: [string, string] | null): Promise<Omit<ComparisonBase, 'tables' | 'siteVersions'>> {
  const factsQuery = sql`
      select s.id as site_id, s.name as site_name, d.id as district_id, d.name as district_name,
        count(f.id)::int as field_count, coalesce(sum(f.area_m2), 0)::float8 as area_m2,
        coalesce((select f2.maintenance_level from ${fields} f2 where f2.site_id = s.id
          group by f2.maintenance_level order by sum(f2.area_m2) desc, f2.maintenance_level desc limit 1), 4)::int as level
      from ${sites} s join ${districts} d on d.id = s.district_id left join ${fields} f on f.site_id = s.id
      where ${inDistrict(sql`s.district_id`)}
      group by s.id, d.id`;
  const seedQuery = sql`
      select a.site_id, sum(${SEED_KG})::float8 as seed_kg from ${applications} a
      where a.task = 'overseed' and a.applied_on between ${period.from} and ${period.to} and ${inDistrict(sql`a.district_id`)}
      group by a.site_id`;
  // Each field's latest check in the period: the latest of all (kept by a trigger) when it
  // falls in the period, one index probe for a field checked again after the period ends.
  const scoresQuery = sql`
      select f.site_id, (sum(coalesce(p.score, r.score) * f.area_m2) / nullif(sum(f.area_m2), 0))::float8 as score, count(*)::int as checked
      from rollup_field_latest r join ${fields} f on f.id = r.field_id join ${sites} s on s.id = f.site_id
      left join lateral (select c.score from ${fieldChecks} c where r.checked_on > ${period.to} and c.field_id = r.field_id and c.checked_on between ${period.from} and ${period.to}
        order by c.checked_on desc, c.id desc limit 1) p on true
      where r.checked_on >= ${period.from} and (r.checked_on <= ${period.to} or p.score is not null) and ${inDistrict(sql`s.district_id`)}
      group by f.site_id`;
  const whole = months ? workOfMonths(months, inDistrict) : null;
  const res = await ctx.db.execute<{ facts: string; crews: string; machines: string; seed: string; scores: string }>(sql`select
      ${jsonRows(factsQuery, sql`order by q.site_name, q.site_id`)} as facts,
      ${whole ? jsonRows(whole.crews) : sql`'[]'`} as crews,
      ${whole ? jsonRows(whole.machines) : sql`'[]'`} as machines,
      ${jsonRows(seedQuery)} as seed,
      ${jsonRows(scoresQuery)} as scores`);
  const answer = res.rows[0]!;
  return {
    facts: JSON.parse(answer.facts) as SiteFacts[],
    months: { crews: JSON.parse(answer.crews) as CrewWork[], machines: JSON.parse(answer.machines) as MachineWork[] },
    seed: JSON.parse(answer.seed) as { site_id: number; seed_kg: number }[],
    scores: JSON.parse(answer.scores) as { site_id: number; score: number; checked: number }[],
  };
}

/** Each site's row: the months' work and the loose days' added per crew and machine kind, priced with the department's costs. */
function rowsOf(base: ComparisonBase, looseCrews: CrewWork[], looseMachines: MachineWork[], costs: CostSettings): CompareSiteRow[] {
  const crewsOf = new Map<number, Map<number | null, CrewWork>>();
  for (const g of [...base.months.crews, ...looseCrews]) {
    let bySite = crewsOf.get(g.site_id);
    if (!bySite) crewsOf.set(g.site_id, (bySite = new Map()));
    const had = bySite.get(g.crew_id);
    bySite.set(
      g.crew_id,
      had
        ? { ...had, orders: had.orders + g.orders, hours: had.hours + g.hours, kg_n: had.kg_n + g.kg_n, water_m3: had.water_m3 + g.water_m3, paint_l: had.paint_l + g.paint_l, colourant_l: had.colourant_l + g.colourant_l }
        : g,
    );
  }
  const machinesOf = new Map<number, Partial<Record<EquipmentKind, number>>>();
  for (const g of [...base.months.machines, ...looseMachines]) {
    let bySite = machinesOf.get(g.site_id);
    if (!bySite) machinesOf.set(g.site_id, (bySite = {}));
    bySite[g.kind] = (bySite[g.kind] ?? 0) + g.hours;
  }
  const seedOf = new Map(base.seed.map((r) => [r.site_id, r.seed_kg]));
  const scoreOf = new Map(base.scores.map((r) => [r.site_id, r]));

  return base.facts.map((s) => {
    // In one order of crews and kinds however the rows came, so a site read again adds up to the same bits.
    const groups = [...(crewsOf.get(s.site_id)?.values() ?? [])].sort((a, b) => (a.crew_id ?? 0) - (b.crew_id ?? 0));
    const sum = (k: 'orders' | 'hours' | 'kg_n' | 'water_m3' | 'paint_l' | 'colourant_l'): number => groups.reduce((t, g) => t + g[k], 0);
    const byKind = machinesOf.get(s.site_id) ?? {};
    const machineHours = Object.fromEntries(Object.entries(byKind).sort(([a], [b]) => a.localeCompare(b))) as Partial<Record<EquipmentKind, number>>;
    const quantities = { fertiliserKgN: sum('kg_n'), waterM3: sum('water_m3'), paintL: sum('paint_l'), seedKg: seedOf.get(s.site_id) ?? 0, colourantL: sum('colourant_l') };
    const cost = costOfWork({ labour: groups.map((g) => ({ crewId: g.crew_id, hours: g.hours })), machineHours, ...quantities }, costs);
    const acres = s.area_m2 / M2_PER_ACRE;
    const hours = sum('hours');
    const score = scoreOf.get(s.site_id);
    return {
      siteId: s.site_id,
      siteName: s.site_name,
      districtId: s.district_id,
      districtName: s.district_name,
      level: s.level as Level,
      fieldCount: s.field_count,
      areaM2: s.area_m2,
      acres,
      ordersDone: sum('orders'),
      hours,
      ...quantities,
      cost,
      costPerAcre: perAcre(cost.total, acres),
      hoursPerAcre: perAcre(hours, acres),
      inputsPerAcre: perAcre(cost.inputs, acres),
      surfaceScore: score?.score ?? null,
      fieldsChecked: score?.checked ?? 0,
    };
  });
}

function totalsOf(rows: CompareSiteRow[]): CompareSitesAnswer['totals'] {
  const add = (k: 'fieldCount' | 'areaM2' | 'acres' | 'ordersDone' | 'hours' | 'fertiliserKgN' | 'waterM3' | 'paintL' | 'seedKg' | 'colourantL'): number => rows.reduce((t, r) => t + r[k], 0);
  const cost = Object.fromEntries((['labour', 'fuel', 'fertiliser', 'water', 'paint', 'seed', 'colourant', 'inputs', 'total'] as const).map((k) => [k, rows.reduce((t, r) => t + r.cost[k], 0)])) as unknown as WorkCost;
  const acres = add('acres');
  const hours = add('hours');
  return {
    fieldCount: add('fieldCount'),
    areaM2: add('areaM2'),
    acres,
    ordersDone: add('ordersDone'),
    hours,
    fertiliserKgN: add('fertiliserKgN'),
    waterM3: add('waterM3'),
    paintL: add('paintL'),
    seedKg: add('seedKg'),
    colourantL: add('colourantL'),
    cost,
    costPerAcre: perAcre(cost.total, acres),
    hoursPerAcre: perAcre(hours, acres),
    inputsPerAcre: perAcre(cost.inputs, acres),
  };
}

/** The CSV's columns: heading and value (money and hours to the cent, the score to a tenth). */
export const COMPARE_CSV_COLUMNS: ReadonlyArray<[string, (r: CompareSiteRow) => string | number | null]> = [
  ['site', (r) => r.siteName],
  ['district', (r) => r.districtName],
  ['level', (r) => r.level],
  ['fields', (r) => r.fieldCount],
  ['acres', (r) => round(r.acres, 2)],
  ['orders_done', (r) => r.ordersDone],
  ['hours', (r) => round(r.hours, 2)],
  ['hours_per_acre', (r) => round(r.hoursPerAcre, 2)],
  ['labour', (r) => round(r.cost.labour, 2)],
  ['fuel', (r) => round(r.cost.fuel, 2)],
  ['fertiliser', (r) => round(r.cost.fertiliser, 2)],
  ['water', (r) => round(r.cost.water, 2)],
  ['paint', (r) => round(r.cost.paint, 2)],
  ['seed', (r) => round(r.cost.seed, 2)],
  ['colourant', (r) => round(r.cost.colourant, 2)],
  ['inputs', (r) => round(r.cost.inputs, 2)],
  ['total_cost', (r) => round(r.cost.total, 2)],
  ['cost_per_acre', (r) => round(r.costPerAcre, 2)],
  ['inputs_per_acre', (r) => round(r.inputsPerAcre, 2)],
  ['fertiliser_kg_n', (r) => round(r.fertiliserKgN, 2)],
  ['water_m3', (r) => round(r.waterM3, 2)],
  ['paint_l', (r) => round(r.paintL, 2)],
  ['seed_kg', (r) => round(r.seedKg, 2)],
  ['colourant_l', (r) => round(r.colourantL, 2)],
  ['surface_score', (r) => round(r.surfaceScore, 1)],
];

function round(v: number | null, places: number): number | null {
  if (v === null) return null;
  const f = 10 ** places;
  return Math.round(v * f) / f;
}
