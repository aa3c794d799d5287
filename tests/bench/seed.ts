/**
 * Demo seed benchmark: a fresh in-memory PGlite seeded with the demo city and its season of
 * history, as every demo start and many tests do. Times the whole seed (first in the process,
 * then with the season already built) and the season's build on its own.
 * Run: node --import tsx tests/bench/seed.ts
 */
import { performance } from 'node:perf_hooks';
import { openDatabase } from '../../apps/api/src/db/client.ts';
import { buildDemoCity } from '../../apps/api/src/db/seed/demo-city.ts';
import { buildDemoSeason } from '../../apps/api/src/db/seed/demo-season.ts';
import { seedDemoCity } from '../../apps/api/src/db/seed/index.ts';
import { fmt } from './support.ts';

const TODAY = '2026-12-02';
const RUNS = Number(process.env.BENCH_RUNS ?? 5);

const city = buildDemoCity();
let t = performance.now();
const season = buildDemoSeason(city, TODAY);
console.log(`season build (${season.orders.length} orders, ${season.checks.length} checks, ${season.weather.length} weather days): ${(performance.now() - t).toFixed(1)} ms`);

const times: number[] = [];
for (let i = 0; i < RUNS; i++) {
  const database = await openDatabase({ pgliteDir: 'memory://' });
  t = performance.now();
  const summary = await seedDemoCity(database.db, TODAY);
  times.push(performance.now() - t);
  if (i === 0) console.log(`first seed: ${times[0]!.toFixed(1)} ms`, summary);
  await database.close();
}
console.log(`seedDemoCity, ${RUNS} fresh databases: ${fmt(times.slice(1))}`);
