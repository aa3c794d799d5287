/**
 * What-if over 300 fields: the demo city's fields (apps/api/src/db/seed/demo-city.ts) plus
 * invented copies of them at other sizes and levels, to 300, each with its nearest station's
 * season of weather. A scenario moves 60 fields a level and changes level 3's Standards (which
 * touches every level-3 field), and the preview works out the season before and after
 * (`whatIf`, the same call the API's POST /api/what-if makes). Target: under 1 s.
 *
 * Then the same through HTTP on the big city (tests/bench/big-city.ts), signed in as the head:
 * `POST /api/what-if` for the department with 300 fields taken evenly from every district
 * moved a level and level 3's Standards changed (also each after a crew logs work), and
 * `GET /api/what-if/scenarios/compare` of two such scenarios saved (removed again at the end).
 * WHAT_IF_RUNS sets the number of timed requests (default 10), WHAT_IF_API=0 skips this part.
 * Run: node --import tsx tests/bench/what-if.ts
 */
import { DEFAULT_COSTS, DEFAULT_PARAMETERS, DEFAULT_STANDARDS, polygonAreaM2, whatIf, type Level, type WhatIfField } from '@swardwise/domain';
import { asc, desc, eq, max } from 'drizzle-orm';
import { fields as fieldsTable, sites, weatherDays, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { buildDemoCity } from '../../apps/api/src/db/seed/demo-city.ts';
import { openBigCity } from './big-city.ts';
import { demoWeather, fmt, listenSignedIn, pct, seeded } from './support.ts';

const FIELDS = 300;
const RUNS = 7;
const city = buildDemoCity();
const weatherAt = demoWeather(city);
const siteOf = new Map(city.sites.map((s) => [s.key, s]));
const { rand } = seeded(15);
const fields: WhatIfField[] = [];
for (let i = 0; i < FIELDS; i++) {
  const f = city.fields[i % city.fields.length]!;
  const site = siteOf.get(f.siteKey)!;
  const copy = i >= city.fields.length;
  fields.push({
    field: {
      id: i + 1,
      districtId: site.districtCode,
      areaM2: polygonAreaM2(f.geometry) * (copy ? 0.6 + rand() * 0.8 : 1),
      sport: f.sport,
      grass: f.grass,
      maintenanceLevel: copy ? ((1 + Math.floor(rand() * 4)) as Level) : f.maintenanceLevel,
      hocOverrideMm: f.hocOverrideMm,
      clippings: f.clippings,
      irrigation: f.irrigation,
    },
    weather: weatherAt(site),
  });
}
const moves = fields.filter((_, i) => i % 5 === 0).map((f) => ({ fieldId: f.field.id, level: (((f.field.maintenanceLevel as number) % 4) + 1) as Level }));
const scenario = { moves, standards: { 3: { minMowingsPerWeek: 2, annualNShare: 0.8, lineRepaintDays: 10 } } };

const times: number[] = [];
let last: ReturnType<typeof whatIf> | null = null;
for (let r = 0; r < RUNS; r++) {
  const t0 = performance.now();
  last = whatIf(fields, DEFAULT_STANDARDS, DEFAULT_PARAMETERS, DEFAULT_COSTS, scenario);
  times.push(performance.now() - t0);
}
const days = fields[0]!.weather.dates.length;
console.log(`what-if over ${FIELDS} fields (${days} days of weather), ${moves.length} moved + level 3 changed: ${last!.fieldsTouched} fields worked out again`);
console.log(`  ${fmt(times)} (target < 1000 ms)`);
console.log(`  change: ${last!.delta.totals.mowings} mowings, ${last!.delta.totals.labourHours.toFixed(0)} h, ${last!.delta.totals.waterM3.toFixed(0)} m³, ${last!.delta.totals.nKg.toFixed(0)} kg N, USD ${last!.delta.lines.labour.cost!.toFixed(0)} labour`);

if (process.env.WHAT_IF_API !== '0') {
  const API_RUNS = Number(process.env.WHAT_IF_RUNS ?? 10);
  const TARGET_MS = 1000;
  const { database, db, summary } = await openBigCity();
  console.log(`big city: ${summary.sites} sites, ${summary.fields} fields, ${summary.workOrders} work orders`);
  const [latest] = await db.select({ d: max(weatherDays.date) }).from(weatherDays);
  const season = Number(String(latest!.d).slice(0, 4));
  // 300 fields spread over the districts: every k-th field of each district, as many from each as it has in proportion.
  const all = await db.select({ id: fieldsTable.id, districtId: sites.districtId, level: fieldsTable.maintenanceLevel }).from(fieldsTable).innerJoin(sites, eq(sites.id, fieldsTable.siteId)).orderBy(asc(fieldsTable.id));
  const step = all.length / FIELDS;
  const chosen = Array.from({ length: FIELDS }, (_, i) => all[Math.floor(i * step)]!);
  const districtsHit = new Set(chosen.map((f) => f.districtId)).size;
  const body = (shift: number) => ({
    season,
    moves: chosen.map((f) => ({ fieldId: f.id, level: (((f.level - 1 + shift) % 4) + 1) as Level })),
    standards: { 3: { minMowingsPerWeek: 2, annualNShare: 0.8, lineRepaintDays: 10 } },
  });
  const { server, base, cookie } = await listenSignedIn(db, 'head');
  const headers = { cookie, 'Content-Type': 'application/json', Origin: base };
  const call = async (method: string, path: string, payload?: unknown) => {
    const start = performance.now();
    const res = await fetch(`${base}${path}`, { method, headers, ...(payload === undefined ? {} : { body: JSON.stringify(payload) }) });
    const text = await res.text();
    const ms = performance.now() - start;
    if (res.status >= 300) throw new Error(`${method} ${path}: ${res.status} ${text.slice(0, 300)}`);
    return { ms, json: text ? (JSON.parse(text) as Record<string, unknown>) : null };
  };
  const timedCalls = async (method: string, path: string, payload?: unknown) => {
    const times: number[] = [];
    let json: Record<string, unknown> | null = null;
    // The first answer is timed apart (plans, the database's caches); then the timed ones.
    const first = await call(method, path, payload);
    for (let i = 0; i < API_RUNS; i++) {
      const r = await call(method, path, payload);
      times.push(r.ms);
      json = r.json;
    }
    return { first: first.ms, times, json };
  };
  const saved: number[] = [];
  try {
    const preview = await timedCalls('POST', '/api/what-if', body(1));
    const touched = (preview.json!.result as { fieldsTouched: number }).fieldsTouched;
    console.log(`POST /api/what-if, head, department, season ${season}: ${FIELDS} fields from ${districtsHit} districts moved a level + level 3 changed (${touched} fields worked out again)`);
    console.log(`  first ${preview.first.toFixed(0)} ms; ${fmt(preview.times)} (${API_RUNS} runs; target p95 < ${TARGET_MS} ms: ${pct(preview.times, 95) < TARGET_MS ? 'met' : 'MISSED'})`);
    // A crew logging work (a done order's hours) before each preview: the outlooks are kept, as they read no work order.
    const [order] = await db.select({ id: workOrders.id, hours: workOrders.actualHours }).from(workOrders).where(eq(workOrders.status, 'done')).orderBy(desc(workOrders.id)).limit(1);
    const afterWork: number[] = [];
    for (let i = 0; i < API_RUNS; i++) {
      await db.update(workOrders).set({ actualHours: (order!.hours ?? 1) + ((i + 1) % 2) * 0.25 }).where(eq(workOrders.id, order!.id));
      afterWork.push((await call('POST', '/api/what-if', body(1))).ms);
    }
    await db.update(workOrders).set({ actualHours: order!.hours }).where(eq(workOrders.id, order!.id));
    console.log(`  after work is logged: ${fmt(afterWork)} (${API_RUNS} runs)`);
    for (const shift of [1, 2]) saved.push(((await call('POST', '/api/what-if/scenarios', { name: `Bench scenario ${shift}`, change: body(shift) })).json!.scenario as { id: number }).id);
    const compare = await timedCalls('GET', `/api/what-if/scenarios/compare?ids=${saved.join(',')}`);
    console.log(`GET /api/what-if/scenarios/compare, two saved scenarios of ${FIELDS} fields each`);
    console.log(`  first ${compare.first.toFixed(0)} ms; ${fmt(compare.times)} (${API_RUNS} runs; target p95 < ${TARGET_MS} ms: ${pct(compare.times, 95) < TARGET_MS ? 'met' : 'MISSED'})`);
  } finally {
    for (const id of saved) await call('DELETE', `/api/what-if/scenarios/${id}`);
    server.close();
    await database.close();
  }
}
