/**
 * Compare sites benchmark on the big invented city (1,000 more sites, 3,000 fields, three
 * seasons, ~1.5 M work orders; tests/bench/big-city.ts): `GET /api/compare/sites` timed over
 * loopback for the head (every district) and a foreman (his district), for the season, the
 * last 12 months and the CSV, each twice: read again with nothing written (the cached answer),
 * and the first answer after a write (a done work order of this season logged with other
 * hours before each request, outside the time, so every answer is worked out again: in full
 * the first time, then from the last one with the changed sites read again), after a planned
 * order is added and removed (the changed sites read again too, since migration 0028), and after a
 * field is edited (a table other than the work orders: worked out in full each time).
 * Target: p95 under 200 ms for the head's season table, both ways.
 * Run: node --import tsx tests/bench/compare.ts (builds the big city on first use).
 */
import { and, desc, eq, gte, sql } from 'drizzle-orm';
import { workOrders } from '../../apps/api/src/db/schema/index.ts';
import { comparisonBuilds } from '../../apps/api/src/services/compare.ts';
import { BIG_CITY, openBigCity } from './big-city.ts';
import { fmt, listenSignedIn, pct, timeGets } from './support.ts';

const RUNS = Number(process.env.COMPARE_RUNS ?? 30);
const TARGET_P95_MS = 200;

const { database, db, summary } = await openBigCity();
console.log(`big city: ${summary.sites} sites, ${summary.fields} fields, ${summary.workOrders} work orders`);

// The order logged again before each answer timed "after a write": a done one of this season.
const [order] = await db
  .select({ id: workOrders.id, hours: workOrders.actualHours })
  .from(workOrders)
  .where(and(eq(workOrders.status, 'done'), gte(workOrders.plannedDate, `${BIG_CITY.today.slice(0, 4)}-01-01`)))
  .orderBy(desc(workOrders.id))
  .limit(1);
let logged = 0;
async function logWork(): Promise<void> {
  logged++;
  await db.update(workOrders).set({ actualHours: (order!.hours ?? 1) + (logged % 2) * 0.25 }).where(eq(workOrders.id, order!.id));
}

/** A field written unchanged: a table the compare reads besides the work orders, so it is worked out in full. */
async function editField(): Promise<void> {
  await db.execute(sql`update fields set name = name where id = (select min(id) from fields)`);
}

/**
 * A planned order removed, as generating a week anew removes the ones it no longer asks: added
 * and removed again outside the time. The database clears the links of checks and seed records
 * to it, finding none; that alone is no change to them (migration 0028), so the answer is the
 * last one with the changed sites read again, not the table worked out in full.
 */
async function removeOrder(): Promise<void> {
  const added = (
    await db.execute<{ id: number }>(sql`insert into work_orders (field_id, site_id, district_id, task, week_start, planned_date, planned_hours, status, origin, details)
      select field_id, site_id, district_id, task, week_start, planned_date, planned_hours, 'planned', 'generated', '{}' from work_orders where id = ${order!.id} returning id`)
  ).rows[0];
  await db.delete(workOrders).where(eq(workOrders.id, added!.id));
}

const MODES = [
  ['read again    ', undefined],
  ['work logged   ', logWork],
  ['order removed ', removeOrder],
  ['a field edited', editField],
] as const;
let failed = false;
for (const role of ['head', 'foreman'] as const) {
  const { server, base, cookie } = await listenSignedIn(db, role);
  for (const [mode, before] of MODES) {
    for (const path of ['/api/compare/sites', '/api/compare/sites?period=last12', '/api/compare/sites.csv']) {
      // One warm-up answer (plans, caches of the database), then the timed ones.
      const builds = { ...comparisonBuilds };
      const { first, times } = await timeGets(base, cookie, path, RUNS, before);
      const how = `${comparisonBuilds.full - builds.full} in full, ${comparisonBuilds.sitesReadAgain - builds.sitesReadAgain} with the changed sites read again`;
      const rows = path.includes('.csv') ? first.text.split('\n').length - 1 : (JSON.parse(first.text) as { rows: unknown[] }).rows.length;
      console.log(`${role.padEnd(7)} ${mode} ${path.padEnd(36)} ${String(rows).padStart(5)} sites  ${fmt(times)} (${RUNS} runs; ${how})`);
      if (role === 'head' && path === '/api/compare/sites' && before !== editField && pct(times, 95) >= TARGET_P95_MS) failed = true;
    }
  }
  server.close();
}
// The order as it was.
await db.update(workOrders).set({ actualHours: order!.hours }).where(eq(workOrders.id, order!.id));
await database.close();
console.log(failed ? `FAIL: the head's season table is over ${TARGET_P95_MS} ms at p95 (read again or after work is logged)` : `ok: the head's season table answers under ${TARGET_P95_MS} ms at p95, read again and after work is logged`);
process.exit(failed ? 1 : 0);
