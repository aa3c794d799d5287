/**
 * Map benchmark: the demo city plus 3,000 generated fields (with 3 field checks each) in an
 * in-memory PGlite; `GET /api/map` (first answer and cached answers) and `GET /api/fields`
 * timed over loopback against a listening server, then the map page in chromium from
 * navigation start to all polygons drawn (`data-ready`). All data is invented.
 * Needs a built portal (`npm run build`) for the browser part.
 * Run: node --import tsx tests/bench/map.ts
 */
import { performance } from 'node:perf_hooks';
import { addDaysIso } from '@swardwise/domain';
import { fieldChecks } from '../../apps/api/src/db/schema/index.ts';
import { demoCityWithFields, fmt, listenSignedIn, portalPage } from './support.ts';

const EXTRA_FIELDS = 3000;
const RUNS = 40;

const { rand, database, db, inserted } = await demoCityWithFields(20261201, EXTRA_FIELDS, ({ rand, pick }) => ({
  status: pick(['open', 'open', 'open', 'restricted', 'closed'] as const),
  lastMowedOn: addDaysIso('2026-11-30', -Math.floor(rand() * 30)),
}));
const checks = inserted.flatMap((f) =>
  [0, 1, 2].map((k) => ({ fieldId: f.id, checkedOn: addDaysIso('2026-08-01', k * 30), turfCoverPct: 90, weedsPct: 3, barePct: 4, score: 50 + rand() * 50 })),
);
for (let i = 0; i < checks.length; i += 1000) await db.insert(fieldChecks).values(checks.slice(i, i + 1000));

const { config, server, base, cookie } = await listenSignedIn(db, 'head');

async function timeGet(url: string): Promise<{ ms: number; bytes: number; body: unknown }> {
  const t0 = performance.now();
  const res = await fetch(`${base}${url}`, { headers: { cookie } });
  const text = await res.text();
  if (res.status !== 200) throw new Error(`${url}: ${res.status} ${text.slice(0, 200)}`);
  return { ms: performance.now() - t0, bytes: text.length, body: JSON.parse(text) };
}

const first = await timeGet('/api/map');
const total = (first.body as { fields: unknown[] }).fields.length;
console.log(`fields on the map: ${total}; answer ${(first.bytes / 1024).toFixed(0)} kB`);
console.log(`GET /api/map first (uncached): ${first.ms.toFixed(1)} ms`);
const mapTimes: number[] = [];
for (let i = 0; i < RUNS; i++) mapTimes.push((await timeGet('/api/map')).ms);
console.log(`GET /api/map cached, ${RUNS} sequential: ${fmt(mapTimes)}`);
const fieldTimes: number[] = [];
for (let i = 0; i < RUNS; i++) fieldTimes.push((await timeGet('/api/fields')).ms);
console.log(`GET /api/fields, ${RUNS} sequential: ${fmt(fieldTimes)}`);
// After a write the cache misses: time the rebuild.
const rebuild: number[] = [];
for (let i = 0; i < 5; i++) {
  await db.insert(fieldChecks).values({ fieldId: inserted[i]!.id, checkedOn: '2026-11-30', turfCoverPct: 90, weedsPct: 3, barePct: 4, score: 70 });
  rebuild.push((await timeGet('/api/map')).ms);
}
console.log(`GET /api/map after a write (rebuild), 5 runs: ${fmt(rebuild)}`);

const portal = await portalPage(config.portalDist, base, cookie, { width: 1440, height: 900 });
if (portal) {
  const { browser, page } = portal;
  const pageTimes: number[] = [];
  for (let i = 0; i < 5; i++) {
    await page.goto(`${base}/map`);
    const ms = await page.waitForFunction(() => document.querySelector('[data-test="field-map"][data-ready="true"]') && performance.now(), undefined, { timeout: 30_000 });
    pageTimes.push((await ms.jsonValue()) as number);
    const count = await page.getAttribute('[data-test="field-map"]', 'data-field-count');
    if (Number(count) !== total) throw new Error(`map drew ${count} fields, expected ${total}`);
  }
  console.log(`map page, navigation start → ${total} polygons drawn, 5 loads: ${fmt(pageTimes)}`);
  const themeMs = await page.evaluate(async () => {
    const t0 = performance.now();
    (document.querySelector('[data-test="theme-score"]') as HTMLElement).click();
    await new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)));
    return performance.now() - t0;
  });
  console.log(`theme switch (restyle ${total} polygons, 2 frames): ${themeMs.toFixed(1)} ms`);
  await browser.close();
}

server.close();
await database.close();
