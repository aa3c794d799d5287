/**
 * Overview benchmark on the big city (the demo city plus 1,000 sites, 3,000 fields and three
 * seasons of work, about 1.5 M work orders; tests/bench/big-city.ts builds it once):
 * `GET /api/overview` over loopback as the head (the department, one district, last season)
 * and as a foreman (his district). Target: p95 under 300 ms. All data is invented.
 * Run: node --import tsx tests/bench/overview.ts
 */
import { sql } from 'drizzle-orm';
import { openBigCity } from './big-city.ts';
import { fmt, listenSignedIn, pct, timeGets } from './support.ts';

const RUNS = Number(process.env.RUNS ?? 40);
const { database, db, summary } = await openBigCity();
console.log(`big city: ${summary.sites} sites, ${summary.fields} fields, ${summary.workOrders.toLocaleString('en-US')} work orders`);
const [d] = (await db.execute<{ id: number }>(sql`select id from districts order by id limit 1`)).rows;

let worst = 0;
for (const role of ['head', 'foreman'] as const) {
  const { server, base, cookie } = await listenSignedIn(db, role);
  const paths = role === 'head' ? ['/api/overview', `/api/overview?districtId=${d!.id}`, '/api/overview?season=2025'] : ['/api/overview'];
  for (const path of paths) {
    // The first answer warms PGlite's caches and the planner; it is shown apart.
    const { times, first } = await timeGets(base, cookie, path, RUNS);
    worst = Math.max(worst, pct(times, 95));
    console.log(`${role.padEnd(7)} GET ${path.padEnd(32)} first ${first.ms.toFixed(0)} ms; ${fmt(times)} (${RUNS} runs)`);
  }
  server.close();
}
console.log(`overview p95 (worst of the above): ${worst.toFixed(1)} ms — target < 300 ms: ${worst < 300 ? 'met' : 'NOT met'}`);
await database.close();
