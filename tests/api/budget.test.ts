/**
 * The season budget: who reads and sets it, the outlook priced with the cost settings, the
 * actual to date summed from the work records (hand-worked below), the CSV read back and the
 * PDF rendered.
 */
import Papa from 'papaparse';
import sharp from 'sharp';
import { and, eq } from 'drizzle-orm';
import { beforeAll, describe, expect, test } from 'vitest';
import { DEFAULT_COSTS, type BudgetAnswer } from '@swardwise/domain';
import { applications, auditLog, budgetLines, fields, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { useTestApi } from '../support/app.ts';
import { addEquipment } from '../support/fixture.ts';
import { getPdf, renderPdf } from '../support/pdf.ts';

const api = useTestApi();
const SEASON = 2026;

let soccerAreaM2 = 0;

beforeAll(async () => {
  const { db } = api.database;
  const f = api.fixture;
  const head = await api.signIn('head');
  // The north crew has its own rate; everyone else the department's.
  const costs = await head.patch('/api/costs').send({ ...DEFAULT_COSTS, labourRatePerHour: 40, crewRates: [{ crewId: f.crews.north, ratePerHour: 50 }], version: 1 });
  expect(costs.status).toBe(200);
  const reel = await addEquipment(db, { districtId: f.districts.north, kind: 'reel_mower', name: 'Reel 1' });
  const marker = await addEquipment(db, { districtId: f.districts.north, kind: 'line_marker', name: 'Marker 1' });
  const [soccer] = await db.select().from(fields).where(eq(fields.id, f.fields.northSoccer));
  soccerAreaM2 = soccer!.areaM2;
  const north = { fieldId: f.fields.northSoccer, siteId: f.sites.northPark, districtId: f.districts.north, weekStart: '2026-05-04', origin: 'manual' as const };
  await db.insert(workOrders).values([
    // Done: 2 h by the north crew with the reel mower.
    { ...north, task: 'mow', plannedDate: '2026-05-05', plannedHours: 1.5, actualHours: 2, status: 'done', crewId: f.crews.north, equipmentId: reel },
    // Done without hours logged (the planned hour counts), no crew: the department's rate.
    { ...north, task: 'feed', plannedDate: '2026-05-06', plannedHours: 1, status: 'done', details: { nGPerM2: 2.5 } },
    // Done: the controller set for the week's 12,000 L.
    { ...north, task: 'irrigate', plannedDate: '2026-05-06', plannedHours: 0.25, status: 'done', crewId: f.crews.north, details: { system: 'automatic', volumeL: 12000 } },
    // Done: 10 L of concentrate over 3 h with the line marker.
    { ...north, task: 'paint_lines', plannedDate: '2026-05-07', plannedHours: 2, actualHours: 3, status: 'done', crewId: f.crews.north, equipmentId: marker, details: { paintL: 10 } },
    // Not counted: not done; done in another season; a bad detail reads as nothing.
    { ...north, task: 'mow', plannedDate: '2026-05-08', plannedHours: 5, status: 'assigned', crewId: f.crews.north },
    { ...north, task: 'mow', plannedDate: '2025-05-08', plannedHours: 7, status: 'done', crewId: f.crews.north },
    { ...north, task: 'paint_lines', plannedDate: '2026-05-09', plannedHours: 0, status: 'done', details: { paintL: 'lots' } },
    // Another district's work.
    { fieldId: f.fields.southBaseball, siteId: f.sites.southPark, districtId: f.districts.south, weekStart: '2026-05-04', origin: 'manual', task: 'mow', plannedDate: '2026-05-05', plannedHours: 9, status: 'done', crewId: f.crews.south },
  ]);
  const seed = { ...north, workOrderId: null, task: 'overseed' as const, product: 'Test rye', appliedOn: '2026-05-10', applicator: 'A. Tester' };
  await db.insert(applications).values([
    { ...seed, rate: 25, rateUnit: 'g/m²', areaM2: 1000 },
    { ...seed, rate: 1, rateUnit: 'lb/1000 ft²', areaM2: 92.90304 },
    // Not seed: a feed record.
    { ...seed, task: 'feed', rate: 50, rateUnit: 'g/m²', areaM2: 1000 },
  ]);
  const { siteId: _s, districtId: _d, weekStart: _w, origin: _o, ...southSeed } = { ...seed, fieldId: f.fields.southBaseball, siteId: f.sites.southPark, districtId: f.districts.south };
  await db.insert(applications).values({ ...southSeed, siteId: f.sites.southPark, districtId: f.districts.south, rate: 100, rateUnit: 'g/m²', areaM2: 1000 });
});

const line = (b: BudgetAnswer, key: string) => b.lines.find((l) => l.line === key)!;

describe('the season budget', () => {
  test('should sum the actual to date from the work records and price it with the cost settings (hand-worked)', async () => {
    const head = await api.signIn('head');
    const res = await head.get(`/api/budget?season=${SEASON}&districtId=${api.fixture.districts.north}`);
    expect(res.status).toBe(200);
    const b = res.body as BudgetAnswer;
    expect(b).toMatchObject({ season: SEASON, districtId: api.fixture.districts.north, scopeName: 'Test North', currency: 'USD' });
    // Labour: 2 + 0.25 + 3 h at the crew's 50, 1 h at the department's 40.
    expect(line(b, 'labour').actual).toEqual({ quantity: 6.25, cost: 302.5 });
    // Fuel: 2 h reel × 4 L/h + 3 h marker × 0.5 L/h = 9.5 L at 1.00.
    expect(line(b, 'fuel').actual).toEqual({ quantity: 9.5, cost: 9.5 });
    expect(line(b, 'equipment').actual).toEqual({ quantity: 5, cost: null });
    // N: 2.5 g/m² over the field; 4.50 per kg N.
    const nKg = (2.5 * soccerAreaM2) / 1000;
    expect(line(b, 'fertiliser').actual.quantity).toBeCloseTo(nKg, 2);
    expect(line(b, 'fertiliser').actual.cost).toBeCloseTo(nKg * 4.5, 2);
    expect(line(b, 'water').actual).toEqual({ quantity: 12, cost: 15.6 });
    expect(line(b, 'paint').actual).toEqual({ quantity: 10, cost: 32 });
    // Seed: 25 g/m² on 1,000 m² = 25 kg, + 1 lb = 0.45 kg; at 9.00 per kg.
    expect(line(b, 'seed').actual).toEqual({ quantity: 25.45, cost: 229.08 });

    // The department counts both districts: 9 h more at 40, and the south's 100 kg of seed.
    const dept = (await head.get(`/api/budget?season=${SEASON}`)).body as BudgetAnswer;
    expect(dept.districtId).toBeNull();
    expect(line(dept, 'labour').actual).toEqual({ quantity: 15.25, cost: 662.5 });
    expect(line(dept, 'seed').actual.quantity).toBe(125.45);
  });

  test('should price the outlook with the cost settings, so a changed rate changes it', async () => {
    const head = await api.signIn('head');
    const url = `/api/budget?season=${SEASON}&districtId=${api.fixture.districts.north}`;
    const before = (await head.get(url)).body as BudgetAnswer;
    expect(before.outlook.fields).toBe(3);
    const labour = line(before, 'labour').outlook;
    expect(labour.quantity).toBeGreaterThan(0);
    expect(labour.cost).toBeCloseTo(labour.quantity * 40, 0);
    expect(line(before, 'water').outlook.cost).toBeCloseTo(line(before, 'water').outlook.quantity * 1.3, 0);
    const { version } = (await head.get('/api/costs')).body as { version: number };
    await head.patch('/api/costs').send({ ...DEFAULT_COSTS, labourRatePerHour: 80, crewRates: [{ crewId: api.fixture.crews.north, ratePerHour: 50 }], version }).expect(200);
    const after = (await head.get(url)).body as BudgetAnswer;
    expect(line(after, 'labour').outlook.quantity).toBe(labour.quantity);
    expect(line(after, 'labour').outlook.cost).toBeCloseTo(labour.quantity * 80, 0);
    await head.patch('/api/costs').send({ ...DEFAULT_COSTS, labourRatePerHour: 40, crewRates: [{ crewId: api.fixture.crews.north, ratePerHour: 50 }], version: version + 1 }).expect(200);
  });

  test('should let the head set, change and clear a line with its version, audited; a stale version changes nothing', async () => {
    const head = await api.signIn('head');
    const d = api.fixture.districts.north;
    const set = await head.patch('/api/budget/line').send({ season: SEASON, districtId: d, line: 'labour', amount: 25000 });
    expect(set.status).toBe(200);
    expect(set.body.line).toEqual({ line: 'labour', budget: 25000, version: 1 });
    // A second "first" save meets the line already set.
    expect((await head.patch('/api/budget/line').send({ season: SEASON, districtId: d, line: 'labour', amount: 1 })).status).toBe(409);
    const changed = await head.patch('/api/budget/line').send({ season: SEASON, districtId: d, line: 'labour', amount: 27500.5, version: 1 });
    expect(changed.body.line).toEqual({ line: 'labour', budget: 27500.5, version: 2 });
    const stale = await head.patch('/api/budget/line').send({ season: SEASON, districtId: d, line: 'labour', amount: 3, version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('budget_line/version_conflict');
    await head.patch('/api/budget/line').send({ season: SEASON, districtId: null, line: 'equipment', amount: 1200 }).expect(200);
    const b = (await head.get(`/api/budget?season=${SEASON}&districtId=${d}`)).body as BudgetAnswer;
    expect(line(b, 'labour')).toMatchObject({ budget: 27500.5, version: 2 });
    // The department's line is its own, not the district's.
    expect(line(b, 'equipment').budget).toBeNull();
    expect(line((await head.get(`/api/budget?season=${SEASON}`)).body as BudgetAnswer, 'equipment').budget).toBe(1200);
    const entries = await api.database.db.select().from(auditLog).where(eq(auditLog.entity, 'budget_line')).orderBy(auditLog.id);
    expect(entries.map((e) => e.action)).toEqual(['create', 'update', 'create']);
    expect(entries[1]).toMatchObject({ districtId: d, before: { amount: 25000 }, after: { amount: 27500.5 } });
    // Clearing removes the line.
    await head.patch('/api/budget/line').send({ season: SEASON, districtId: null, line: 'equipment', amount: null, version: 1 }).expect(200);
    expect(await api.database.db.select().from(budgetLines).where(and(eq(budgetLines.line, 'equipment')))).toHaveLength(0);
  });

  test('should show a foreman his own district only, read-only; crews and partners nothing', async () => {
    const foreman = await api.signIn('foreman');
    const own = await foreman.get(`/api/budget?season=${SEASON}`);
    expect(own.status).toBe(200);
    expect(own.body.districtId).toBe(api.fixture.districts.north);
    expect((await foreman.get(`/api/budget?season=${SEASON}&districtId=${api.fixture.districts.south}`)).status).toBe(403);
    expect((await foreman.get(`/api/budget/export.csv?season=${SEASON}&districtId=${api.fixture.districts.south}`)).status).toBe(403);
    expect((await foreman.get(`/api/budget/report.pdf?season=${SEASON}&districtId=${api.fixture.districts.south}`)).status).toBe(403);
    expect((await foreman.patch('/api/budget/line').send({ season: SEASON, districtId: api.fixture.districts.north, line: 'fuel', amount: 1 })).status).toBe(403);
    // The other district's foreman sees his own figures, not the north's.
    const south = await api.signIn('foremanSouth');
    const southOwn = (await south.get(`/api/budget?season=${SEASON}`)).body as BudgetAnswer;
    expect(southOwn.districtId).toBe(api.fixture.districts.south);
    expect(line(southOwn, 'labour').actual.quantity).toBe(9);
    for (const who of ['crew', 'partner'] as const) {
      const agent = await api.signIn(who);
      expect((await agent.get(`/api/budget?season=${SEASON}`)).status).toBe(403);
      expect((await agent.get(`/api/budget/export.csv?season=${SEASON}`)).status).toBe(403);
    }
  });

  test('should refuse a bad season, an unknown district, an unknown line and a negative amount with a 400, writing nothing', async () => {
    const head = await api.signIn('head');
    expect((await head.get('/api/budget?season=next')).status).toBe(400);
    expect((await head.get(`/api/budget?season=${SEASON}&districtId=987654`)).status).toBe(400);
    const bad = [
      { season: SEASON, districtId: null, line: 'snacks', amount: 1 },
      { season: SEASON, districtId: null, line: 'fuel', amount: -1 },
      { season: SEASON, districtId: 987654, line: 'fuel', amount: 1 },
      { season: 1850, districtId: null, line: 'fuel', amount: 1 },
    ];
    for (const body of bad) {
      const res = await head.patch('/api/budget/line').send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
    }
    expect(await api.database.db.select().from(budgetLines).where(eq(budgetLines.line, 'fuel'))).toHaveLength(0);
  });
});

describe('the budget exports', () => {
  test('should write a CSV that parses back to the same numbers as the answer', async () => {
    const head = await api.signIn('head');
    const q = `season=${SEASON}&districtId=${api.fixture.districts.north}`;
    const b = (await head.get(`/api/budget?${q}`)).body as BudgetAnswer;
    const res = await head.get(`/api/budget/export.csv?${q}`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const parsed = Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const num = (s: string) => (s === '' ? null : Number(s));
    expect(
      parsed.data.map((r) => ({ line: r.line, budget: num(r.budget!), outlook: { quantity: num(r.outlook_quantity!), cost: num(r.outlook_cost!) }, actual: { quantity: num(r.actual_quantity!), cost: num(r.actual_cost!) } })),
    ).toEqual(b.lines.map((l) => ({ line: l.line, budget: l.budget, outlook: l.outlook, actual: l.actual })));
    expect(parsed.data.find((r) => r.line === 'equipment')!.budget_unit).toBe('h');
  });

  test('should print a report with its chart that renders (pdftoppm)', async () => {
    const head = await api.signIn('head');
    await head.patch('/api/budget/line').send({ season: SEASON, districtId: null, line: 'water', amount: 900 }).expect(200);
    const sheet = renderPdf(await getPdf(head, `/api/budget/report.pdf?season=${SEASON}`), 'budget-report-pdf');
    expect(sheet.pages).toHaveLength(1);
    const { data } = await sharp(sheet.pages[0]!).greyscale().raw().toBuffer({ resolveWithObject: true });
    const dark = data.filter((v) => v < 160).length / data.length;
    // Text, the bars and the table: ink on part of the page, not none, not all.
    expect(dark).toBeGreaterThan(0.02);
    expect(dark).toBeLessThan(0.5);
    const text = sheet.text();
    expect(text).toContain('Cost (USD)');
    expect(text).toContain('Budget line');
    sheet.remove();
  });
});
