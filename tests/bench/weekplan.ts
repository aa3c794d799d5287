/**
 * Week plan benchmark: the demo city's North Ridge district grown to 1,000 fields (invented,
 * placed around its sites, irrigated and not, all levels) and 8 crews in an in-memory
 * PGlite. Times `generateWeek` for a June week: the first run (writes every order), a
 * re-generation (matches against what is there) and dry runs; then the board read.
 * Target: under 2 s for the first run. Run: node --import tsx tests/bench/weekplan.ts
 */
import { performance } from 'node:perf_hooks';
import { eq } from 'drizzle-orm';
import { DEFAULT_TIME_ZONE, addDaysIso, defineAbilityFor, type Actor } from '@swardwise/domain';
import { openDatabase } from '../../apps/api/src/db/client.ts';
import { crews, districts, fields, sites, users, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { seedDemoCity } from '../../apps/api/src/db/seed/index.ts';
import { DepartmentClock } from '../../apps/api/src/services/clock.ts';
import { generateWeek, getWeekBoard } from '../../apps/api/src/services/week-plans.ts';
import { benchField, pct, seeded } from './support.ts';

const TARGET_FIELDS = Number(process.env.BENCH_FIELDS ?? 1000);
const WEEK = '2026-06-15';

const gen = seeded(20261202);
const { rand, pick } = gen;

const database = await openDatabase({ pgliteDir: 'memory://' });
const { db } = database;
await seedDemoCity(db);
const [district] = await db.select().from(districts).where(eq(districts.code, 'north'));
const districtSites = await db.select({ id: sites.id, lat: sites.lat, lng: sites.lng }).from(sites).where(eq(sites.districtId, district!.id));
const have = (await db.select({ id: fields.id }).from(fields).innerJoin(sites, eq(sites.id, fields.siteId)).where(eq(sites.districtId, district!.id))).length;
const rows = [];
for (let i = 0; i < TARGET_FIELDS - have; i++) {
  rows.push({
    ...benchField(pick(districtSites), i, gen, { lat: 0.01, lng: 0.012 }),
    irrigation: pick(['none', 'quick_coupler', 'automatic'] as const),
    lastMowedOn: addDaysIso(WEEK, -1 - Math.floor(rand() * 6)),
  });
}
for (let i = 0; i < rows.length; i += 500) await db.insert(fields).values(rows.slice(i, i + 500));
for (let c = 0; c < 6; c++) await db.insert(crews).values({ districtId: district!.id, name: `Bench crew ${c + 1}`, hoursPerDay: 9, members: [] });
const [foreman] = await db.select().from(users).where(eq(users.role, 'foreman'));
const actor: Actor = { id: foreman!.id, role: 'foreman', districtId: district!.id, crewId: null, siteIds: [] };
const ctx = { db, actor, actorName: foreman!.name, ability: defineAbilityFor(actor), clock: new DepartmentClock(db, DEFAULT_TIME_ZONE) };
const q = { districtId: district!.id, weekStart: WEEK };

const t0 = performance.now();
const first = await generateWeek(ctx, { ...q, dryRun: false });
const firstMs = performance.now() - t0;
const orders = (await db.select({ id: workOrders.id }).from(workOrders).where(eq(workOrders.weekStart, WEEK))).length;

const regen: number[] = [];
for (let i = 0; i < 5; i++) {
  const t = performance.now();
  await generateWeek(ctx, { ...q, dryRun: false });
  regen.push(performance.now() - t);
}
const dry: number[] = [];
for (let i = 0; i < 5; i++) {
  const t = performance.now();
  await generateWeek(ctx, { ...q, dryRun: true });
  dry.push(performance.now() - t);
}
const board: number[] = [];
for (let i = 0; i < 10; i++) {
  const t = performance.now();
  await getWeekBoard(ctx, q);
  board.push(performance.now() - t);
}
const f = (xs: number[]) => `p50 ${pct(xs, 50).toFixed(0)} ms, max ${Math.max(...xs).toFixed(0)} ms`;
console.log(`week plan, district of ${TARGET_FIELDS} fields, ${first.board.crews.length} crews, week of ${WEEK}: ${orders} work orders`);
console.log(`  first generation (writes all): ${firstMs.toFixed(0)} ms (target < 2000 ms)`);
console.log(`  re-generation (${regen.length} runs): ${f(regen)}`);
console.log(`  dry run (${dry.length} runs): ${f(dry)}`);
console.log(`  board read (${board.length} runs): ${f(board)}`);
await database.close();
if (firstMs > 2000) process.exitCode = 1;
