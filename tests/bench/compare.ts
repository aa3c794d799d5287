/**
 * Compare sites benchmark on the big invented city (1,000 more sites, 3,000 fields, three
 * seasons, ~1.5 M work orders; tests/bench/big-city.ts): `GET /api/compare/sites` timed over
 * loopback for the head (every district) and a foreman (his district), for the season, the
 * last 12 months and the CSV. Target: p95 under 200 ms for the head's season table.
 * Run: node --import tsx tests/bench/compare.ts (builds the big city on first use).
 */
import { openBigCity } from './big-city.ts';
import { fmt, listenSignedIn, pct, timeGets } from './support.ts';

const RUNS = Number(process.env.COMPARE_RUNS ?? 30);
const TARGET_P95_MS = 200;

const { database, db, summary } = await openBigCity();
console.log(`big city: ${summary.sites} sites, ${summary.fields} fields, ${summary.workOrders} work orders`);

let failed = false;
for (const role of ['head', 'foreman'] as const) {
  const { server, base, cookie } = await listenSignedIn(db, role);
  for (const path of ['/api/compare/sites', '/api/compare/sites?period=last12', '/api/compare/sites.csv']) {
    // One warm-up answer (plans, caches of the database), then the timed ones.
    const { first, times } = await timeGets(base, cookie, path, RUNS);
    const rows = path.includes('.csv') ? first.text.split('\n').length - 1 : (JSON.parse(first.text) as { rows: unknown[] }).rows.length;
    console.log(`${role.padEnd(7)} ${path.padEnd(36)} ${String(rows).padStart(5)} sites  ${fmt(times)}`);
    if (role === 'head' && path === '/api/compare/sites' && pct(times, 95) >= TARGET_P95_MS) failed = true;
  }
  server.close();
}
await database.close();
console.log(failed ? `FAIL: the head's season table is over ${TARGET_P95_MS} ms at p95` : `ok: the head's season table answers under ${TARGET_P95_MS} ms at p95`);
process.exit(failed ? 1 : 0);
