/**
 * Sites compared on the demo city: every figure equals a sum over the rows worked out here by
 * an independent SQL query, the CSV parses back to the same numbers, a foreman sees only his
 * district, and crew leads and partners see nothing.
 */
import { sql } from 'drizzle-orm';
import Papa from 'papaparse';
import { pino } from 'pino';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, test, vi } from 'vitest';
import { DEFAULT_COSTS, DEFAULT_TIME_ZONE, type CompareSitesAnswer } from '@swardwise/domain';
import { createApp } from '../../apps/api/src/app.ts';
import { loadConfig } from '../../apps/api/src/config.ts';
import { openDatabase, type Database } from '../../apps/api/src/db/client.ts';
import { DEMO_SIGN_INS } from '../../apps/api/src/db/seed/demo-city.ts';
import { createMailer } from '../../apps/api/src/mail/mailer.ts';
import { DepartmentClock } from '../../apps/api/src/services/clock.ts';
import { comparisonBuilds } from '../../apps/api/src/services/compare.ts';
import { prepareInstallation } from '../../apps/api/src/services/first-run.ts';

const TODAY = '2026-12-02';
/** The international acre, m² (exact by definition: 43,560 ft² of 0.3048 m). */
const ACRE_M2 = 4046.8564224;

let database: Database;
let app: NonNullable<Parameters<typeof supertest.agent>[0]>;
const agent = async (role: keyof typeof DEMO_SIGN_INS) => {
  const a = supertest.agent(app);
  expect((await a.post('/api/auth/sign-in').send(DEMO_SIGN_INS[role])).status).toBe(200);
  return a;
};

beforeAll(async () => {
  database = await openDatabase({ pgliteDir: 'memory://' });
  const clock = new DepartmentClock(database.db, DEFAULT_TIME_ZONE, () => new Date(`${TODAY}T20:00:00Z`));
  await clock.ready();
  const config = loadConfig({ NODE_ENV: 'test' });
  const logger = pino({ level: process.env.LOG_COMPARE ?? 'silent' });
  await prepareInstallation(database.db, { ...config, demo: true }, logger, () => {}, clock.today(), clock.timeZone);
  app = createApp({ db: database.db, config, logger, sessionSecret: 'test', mailer: createMailer(null, logger), clock }).app;
});
afterAll(() => database.close());

type Expected = { site_id: number; acres: number; hours: number; kg_n: number; orders: number };

/** Written apart from the service: per site, area from its fields and the season's done work. */
async function expectedBySite(from: string, to: string): Promise<Map<number, Expected>> {
  const res = await database.db.execute<Expected>(sql`
    select s.id as site_id,
      (select coalesce(sum(area_m2), 0) from fields where site_id = s.id)::float8 / ${ACRE_M2} as acres,
      (select coalesce(sum((case when actual_hours is null then planned_hours else actual_hours end)::float8), 0) from work_orders
        where site_id = s.id and status = 'done' and planned_date >= ${from}::date and planned_date <= ${to}::date)::float8 as hours,
      (select count(*) from work_orders where site_id = s.id and status = 'done' and planned_date >= ${from}::date and planned_date <= ${to}::date)::int as orders,
      (select coalesce(sum((w.details->>'nGPerM2')::float8 * f.area_m2 / 1000), 0) from work_orders w join fields f on f.id = w.field_id
        where w.site_id = s.id and w.task = 'feed' and w.status = 'done' and w.planned_date >= ${from}::date and w.planned_date <= ${to}::date)::float8 as kg_n
    from sites s`);
  return new Map(res.rows.map((r) => [r.site_id, r]));
}

describe('sites compared', () => {
  test('should give each site hours, kg N and money per acre equal to sums over the demo rows', async () => {
    const head = await agent('head');
    const res = await head.get('/api/compare/sites');
    expect(res.status).toBe(200);
    const body = res.body as CompareSitesAnswer;
    expect(body.period).toEqual({ kind: 'season', from: '2026-01-01', to: TODAY });
    const expected = await expectedBySite('2026-01-01', TODAY);
    expect(body.rows.length).toBe(expected.size);
    let workedSites = 0;
    for (const r of body.rows) {
      const e = expected.get(r.siteId)!;
      expect(r.acres, r.siteName).toBeCloseTo(e.acres, 9);
      expect(r.hours, r.siteName).toBeCloseTo(e.hours, 6);
      expect(r.ordersDone, r.siteName).toBe(e.orders);
      expect(r.fertiliserKgN, r.siteName).toBeCloseTo(e.kg_n, 6);
      if (e.acres > 0) expect(r.hoursPerAcre!, r.siteName).toBeCloseTo(e.hours / e.acres, 6);
      // The demo sets no crew rates: every hour at the department's rate; fertiliser at its price per kg N.
      expect(r.cost.labour, r.siteName).toBeCloseTo(e.hours * DEFAULT_COSTS.labourRatePerHour, 4);
      expect(r.cost.fertiliser, r.siteName).toBeCloseTo(e.kg_n * DEFAULT_COSTS.fertiliserPricePerKgN, 4);
      expect(r.cost.total, r.siteName).toBeCloseTo(r.cost.labour + r.cost.fuel + r.cost.inputs, 6);
      if (e.hours > 0) workedSites++;
    }
    expect(workedSites).toBeGreaterThan(10);
    const sum = (f: (e: Expected) => number) => [...expected.values()].reduce((t, e) => t + f(e), 0);
    expect(body.totals.hours).toBeCloseTo(sum((e) => e.hours), 4);
    expect(body.totals.fertiliserKgN).toBeCloseTo(sum((e) => e.kg_n), 4);
    expect(body.totals.hoursPerAcre!).toBeCloseTo(sum((e) => e.hours) / sum((e) => e.acres), 6);
    // Fuel: mowing hours burn on a mower; the seed's mowings are the bulk of the season.
    expect(body.totals.cost.fuel).toBeGreaterThan(0);
    expect(body.rows.some((r) => r.surfaceScore !== null && r.surfaceScore > 0 && r.surfaceScore <= 100)).toBe(true);
  });

  test('should price a line painting, a colourant job and an overseeding with the department’s prices', async () => {
    const [field] = (await database.db.execute<{ id: number; site_id: number; district_id: number }>(sql`select f.id, f.site_id, s.district_id from fields f join sites s on s.id = f.site_id order by f.id limit 1`)).rows;
    const head = await agent('head');
    const before = (await head.get('/api/compare/sites')).body as CompareSitesAnswer;
    const was = before.rows.find((r) => r.siteId === field!.site_id)!;
    await database.db.execute(sql`insert into work_orders (field_id, site_id, district_id, task, week_start, planned_date, planned_hours, actual_hours, status, origin, details)
      values (${field!.id}, ${field!.site_id}, ${field!.district_id}, 'paint_lines', '2026-11-30', '2026-11-30', 2, 2, 'done', 'manual', '{"paintL": 10}'),
             (${field!.id}, ${field!.site_id}, ${field!.district_id}, 'colourant', '2026-11-30', '2026-12-01', 1, null, 'done', 'manual', '{"colourant": {"product": "Green", "rateMlPerM2": 5, "areaM2": 2000}}')`);
    await database.db.execute(sql`insert into applications (field_id, site_id, district_id, task, product, rate, rate_unit, area_m2, applied_on, applicator)
      values (${field!.id}, ${field!.site_id}, ${field!.district_id}, 'overseed', 'Rye mix', 25, 'g/m²', 800, '2026-10-01', 'Demo crew')`);
    const now = ((await head.get('/api/compare/sites')).body as CompareSitesAnswer).rows.find((r) => r.siteId === field!.site_id)!;
    // By hand: 10 L paint × $3.20 = $32; 5 mL/m² × 2,000 m² = 10 L colourant × $8 = $80; 25 g/m² × 800 m² = 20 kg seed × $9 = $180.
    expect(now.paintL - was.paintL).toBeCloseTo(10, 9);
    expect(now.cost.paint - was.cost.paint).toBeCloseTo(32, 6);
    expect(now.colourantL - was.colourantL).toBeCloseTo(10, 9);
    expect(now.cost.colourant - was.cost.colourant).toBeCloseTo(80, 6);
    expect(now.seedKg - was.seedKg).toBeCloseTo(20, 9);
    expect(now.cost.seed - was.cost.seed).toBeCloseTo(180, 6);
    // Hours: 2 h done + 1 h planned (no actual reported), at $38/h; fuel: 2 h line marker × 0.5 L/h + 1 h sprayer × 2 L/h = 3 L × $1.00.
    expect(now.hours - was.hours).toBeCloseTo(3, 6);
    expect(now.cost.labour - was.cost.labour).toBeCloseTo(3 * 38, 6);
    expect(now.cost.fuel - was.cost.fuel).toBeCloseTo(3, 6);
  });

  test('should answer from the rows again after only a seed application is recorded (the cached answer is not kept)', async () => {
    const [field] = (await database.db.execute<{ id: number; site_id: number; district_id: number }>(sql`select f.id, f.site_id, s.district_id from fields f join sites s on s.id = f.site_id order by f.id desc limit 1`)).rows;
    const head = await agent('head');
    const read = async () => ((await head.get('/api/compare/sites')).body as CompareSitesAnswer).rows.find((r) => r.siteId === field!.site_id)!;
    const was = await read();
    expect((await read()).seedKg).toBe(was.seedKg);
    await database.db.execute(sql`insert into applications (field_id, site_id, district_id, task, product, rate, rate_unit, area_m2, applied_on, applicator)
      values (${field!.id}, ${field!.site_id}, ${field!.district_id}, 'overseed', 'Rye mix', 10, 'g/m²', 500, '2026-11-02', 'Demo crew')`);
    // 10 g/m² × 500 m² = 5 kg seed.
    expect((await read()).seedKg - was.seedKg).toBeCloseTo(5, 9);
  });

  test('should work the table out again in two statements after a write, to the same figures', async () => {
    const head = await agent('head');
    const read = async () => (await head.get('/api/compare/sites')).body as CompareSitesAnswer;
    const before = await read();
    const statements = vi.spyOn(database.db, 'execute');
    try {
      // A write the table does not show (a field renamed to its own name) makes the cached answer stale all the same.
      await database.db.execute(sql`update fields set name = name where id = (select min(id) from fields)`);
      statements.mockClear();
      const full = comparisonBuilds.full;
      const again = await read();
      expect(comparisonBuilds.full).toBe(full + 1);
      // The counters with the loose days' work, then its facts, months of work per crew and per
      // machine, seed and scores (plus, on PostgreSQL, the change counters' fingerprint), not six.
      expect(statements.mock.calls.length).toBeLessThanOrEqual(database.kind === 'postgres' ? 3 : 2);
      expect(again).toEqual(before);
    } finally {
      statements.mockRestore();
    }
  });

  test('should read again only the sites whose work orders changed, to the figures of the rows and of a table worked out in full', async () => {
    const head = await agent('head');
    const read = async () => (await head.get('/api/compare/sites')).body as CompareSitesAnswer;
    const check = async (answer: CompareSitesAnswer) => {
      const expected = await expectedBySite('2026-01-01', TODAY);
      for (const r of answer.rows) {
        const e = expected.get(r.siteId)!;
        expect(r.hours, r.siteName).toBeCloseTo(e.hours, 6);
        expect(r.ordersDone, r.siteName).toBe(e.orders);
        expect(r.fertiliserKgN, r.siteName).toBeCloseTo(e.kg_n, 6);
      }
    };
    await read();
    const order = async (where: ReturnType<typeof sql>) =>
      (await database.db.execute<{ id: number; site_id: number }>(sql`select id, site_id from work_orders where status = 'done' and field_id is not null and ${where} order by id limit 1`)).rows[0]!;
    const [field] = (await database.db.execute<{ id: number; site_id: number; district_id: number }>(sql`select f.id, f.site_id, s.district_id from fields f join sites s on s.id = f.site_id order by f.id limit 1`)).rows;
    const writes: Array<[string, () => Promise<unknown>]> = [
      ['a mowing done on a loose day of this month', () =>
        database.db.execute(sql`insert into work_orders (field_id, site_id, district_id, task, week_start, planned_date, planned_hours, actual_hours, status, origin, details)
          values (${field!.id}, ${field!.site_id}, ${field!.district_id}, 'mow', '2026-11-30', '2026-12-01', 1, 1.5, 'done', 'manual', '{}')`)],
      ['an order of October logged again with other hours', async () => {
        const o = await order(sql`planned_date between '2026-10-01' and '2026-10-31'`);
        await database.db.execute(sql`update work_orders set actual_hours = coalesce(actual_hours, planned_hours) + 1 where id = ${o.id}`);
      }],
      ['a feed of June moved to a field of another site', async () => {
        const o = await order(sql`planned_date between '2026-06-01' and '2026-06-30' and task = 'feed'`);
        const [to] = (await database.db.execute<{ id: number; site_id: number; district_id: number }>(sql`select f.id, f.site_id, s.district_id from fields f join sites s on s.id = f.site_id where f.site_id <> ${o.site_id} order by f.id desc limit 1`)).rows;
        await database.db.execute(sql`update work_orders set site_id = ${to!.site_id}, field_id = ${to!.id}, district_id = ${to!.district_id} where id = ${o.id}`);
      }],
      ['a done order of March marked skipped', async () => {
        const o = await order(sql`planned_date between '2026-03-01' and '2026-03-31'`);
        await database.db.execute(sql`update work_orders set status = 'skipped', reason = 'Logged on the wrong field' where id = ${o.id}`);
      }],
      // The database clears the links of the checks and seed records to a removed order, as an
      // update of both tables even when none names it: that alone is no change to them.
      ['a done order of May removed', async () => {
        const o = await order(sql`planned_date between '2026-05-01' and '2026-05-31'
          and not exists (select 1 from field_checks c where c.work_order_id = work_orders.id)
          and not exists (select 1 from applications a where a.work_order_id = work_orders.id)`);
        await database.db.execute(sql`delete from work_orders where id = ${o.id}`);
      }],
    ];
    for (const [what, write] of writes) {
      await write();
      const [full, again] = [comparisonBuilds.full, comparisonBuilds.sitesReadAgain];
      const answer = await read();
      expect(comparisonBuilds.full, what).toBe(full);
      expect(comparisonBuilds.sitesReadAgain, what).toBe(again + 1);
      await check(answer);
      // A write to another table: the table worked out in full, to the same figures to the bit.
      await database.db.execute(sql`update districts set name = name where id = ${field!.district_id}`);
      const inFull = await read();
      expect(comparisonBuilds.full, what).toBe(full + 1);
      expect(inFull, what).toEqual(answer);
    }
  });

  test('should write a CSV that parses back to the same numbers', async () => {
    const head = await agent('head');
    const json = (await head.get('/api/compare/sites').query({ period: 'last12' })).body as CompareSitesAnswer;
    const res = await head.get('/api/compare/sites.csv').query({ period: 'last12' });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="sites-2025-12-03-to-2026-12-02\.csv"/);
    const parsed = Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.length).toBe(json.rows.length);
    json.rows.forEach((r, i) => {
      const line = parsed.data[i]!;
      expect(line.site).toBe(r.siteName);
      expect(Number(line.level)).toBe(r.level);
      expect(Number(line.orders_done)).toBe(r.ordersDone);
      expect(Number(line.hours)).toBeCloseTo(r.hours, 2);
      expect(Number(line.acres)).toBeCloseTo(r.acres, 2);
      expect(Number(line.total_cost)).toBeCloseTo(r.cost.total, 2);
      expect(Number(line.fertiliser_kg_n)).toBeCloseTo(r.fertiliserKgN, 2);
      if (r.costPerAcre === null) expect(line.cost_per_acre).toBe('');
      else expect(Number(line.cost_per_acre)).toBeCloseTo(r.costPerAcre, 2);
      if (r.surfaceScore === null) expect(line.surface_score).toBe('');
      else expect(Number(line.surface_score)).toBeCloseTo(r.surfaceScore, 1);
    });
  });

  test('should show a foreman his district only and refuse another district’s figures', async () => {
    const foreman = await agent('foreman');
    const mine = await foreman.get('/api/compare/sites');
    expect(mine.status).toBe(200);
    const own = (mine.body as CompareSitesAnswer).districtId!;
    expect(own).toBeGreaterThan(0);
    expect((mine.body as CompareSitesAnswer).rows.every((r) => r.districtId === own)).toBe(true);
    const head = await agent('head');
    const all = (await head.get('/api/compare/sites')).body as CompareSitesAnswer;
    const other = all.rows.find((r) => r.districtId !== own)!.districtId;
    expect(all.rows.filter((r) => r.districtId === own).length).toBe((mine.body as CompareSitesAnswer).rows.length);
    for (const path of ['/api/compare/sites', '/api/compare/sites.csv']) {
      const refused = await foreman.get(path).query({ districtId: other });
      expect(refused.status, path).toBe(403);
      expect(refused.text).not.toContain(all.rows.find((r) => r.districtId === other)!.siteName);
    }
    for (const who of ['crew', 'partner'] as const) {
      const a = await agent(who);
      expect((await a.get('/api/compare/sites')).status, who).toBe(403);
      expect((await a.get('/api/compare/sites.csv')).status, who).toBe(403);
    }
    expect((await supertest(app).get('/api/compare/sites')).status).toBe(401);
  });

  test('should refuse a bad period with a clear message', async () => {
    const head = await agent('head');
    const backwards = await head.get('/api/compare/sites').query({ period: 'range', from: '2026-06-01', to: '2026-05-01' });
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.details.issues[0]).toMatchObject({ path: 'query.to', message: 'the to date is before the from date' });
    expect((await head.get('/api/compare/sites').query({ period: 'range', from: '2026-06-01' })).status).toBe(400);
    expect((await head.get('/api/compare/sites').query({ period: 'fortnight' })).status).toBe(400);
    expect((await head.get('/api/compare/sites').query({ districtId: 'x' })).status).toBe(400);
    const range = await head.get('/api/compare/sites').query({ period: 'range', from: '2026-06-01', to: '2026-06-30' });
    expect(range.body.period).toEqual({ kind: 'range', from: '2026-06-01', to: '2026-06-30' });
  });
});
