/**
 * Map benchmark: the demo city plus 3,000 generated fields (with 3 field checks each) in an
 * in-memory PGlite; `GET /api/map` (first answer and cached answers) and `GET /api/fields`
 * timed over loopback against a listening server, then the map page in chromium from
 * navigation start to all polygons drawn (`data-ready`). All data is invented.
 * Needs a built portal (`npm run build`) for the browser part.
 * Run: node --import tsx tests/bench/map.ts
 */
import fs from 'node:fs';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { pino } from 'pino';
import { chromium } from 'playwright-core';
import { GRASSES, SPORTS, addDaysIso, polygonAreaM2, longAxis, type Level, type Polygon } from '@swardwise/domain';
import { createApp } from '../../apps/api/src/app.ts';
import { loadConfig } from '../../apps/api/src/config.ts';
import { openDatabase } from '../../apps/api/src/db/client.ts';
import { fieldChecks, fields, sites } from '../../apps/api/src/db/schema/index.ts';
import { DEMO_SIGN_INS } from '../../apps/api/src/db/seed/demo-city.ts';
import { seedDemoCity } from '../../apps/api/src/db/seed/index.ts';
import { createMailer } from '../../apps/api/src/mail/mailer.ts';
import { CHROMIUM_ARGS } from '../e2e/browser.ts';

const EXTRA_FIELDS = 3000;
const RUNS = 40;

function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
const rand = rng(20261201);
const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rand() * xs.length)] as T;

function rect(lat: number, lng: number, w: number, l: number): Polygon {
  const dLat = l / 111_000;
  const dLng = w / 88_000;
  return { type: 'Polygon', coordinates: [[[lng, lat], [lng + dLng, lat], [lng + dLng, lat + dLat], [lng, lat + dLat], [lng, lat]]] };
}

const pct = (xs: number[], p: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor((p / 100) * xs.length))]!;
const fmt = (xs: number[]) => `p50 ${pct(xs, 50).toFixed(1)} ms, p95 ${pct(xs, 95).toFixed(1)} ms, max ${Math.max(...xs).toFixed(1)} ms`;

const database = await openDatabase({ pgliteDir: 'memory://' });
const { db } = database;
await seedDemoCity(db);
const siteRows = await db.select({ id: sites.id, lat: sites.lat, lng: sites.lng }).from(sites);
const rows = [];
for (let i = 0; i < EXTRA_FIELDS; i++) {
  const s = pick(siteRows);
  const geometry = rect(s.lat + (rand() - 0.5) * 0.03, s.lng + (rand() - 0.5) * 0.04, 40 + rand() * 40, 70 + rand() * 50);
  rows.push({
    siteId: s.id,
    name: `Bench field ${i + 1}`,
    sport: pick(SPORTS),
    grass: pick(GRASSES),
    rootzone: 'native_soil' as const,
    irrigation: 'none' as const,
    maintenanceLevel: (1 + Math.floor(rand() * 4)) as Level,
    clippings: 'returned' as const,
    status: pick(['open', 'open', 'open', 'restricted', 'closed'] as const),
    geometry,
    areaM2: polygonAreaM2(geometry),
    longAxisDeg: longAxis(geometry).bearingDeg,
    lastMowedOn: addDaysIso('2026-11-30', -Math.floor(rand() * 30)),
  });
}
const inserted: { id: number }[] = [];
for (let i = 0; i < rows.length; i += 500) inserted.push(...(await db.insert(fields).values(rows.slice(i, i + 500)).returning({ id: fields.id })));
const checks = inserted.flatMap((f) =>
  [0, 1, 2].map((k) => ({ fieldId: f.id, checkedOn: addDaysIso('2026-08-01', k * 30), turfCoverPct: 90, weedsPct: 3, barePct: 4, score: 50 + rand() * 50 })),
);
for (let i = 0; i < checks.length; i += 1000) await db.insert(fieldChecks).values(checks.slice(i, i + 1000));

const logger = pino({ level: 'silent' });
const config = loadConfig({ NODE_ENV: 'production', LOG_LEVEL: 'silent', LOGIN_ATTEMPTS: '1000' });
const { app } = createApp({ db, config, logger, sessionSecret: 'bench-secret', mailer: createMailer(null, logger) });
const server = app.listen(0, '127.0.0.1');
await new Promise((r) => server.once('listening', r));
const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

const signIn = await fetch(`${base}/api/auth/sign-in`, {
  method: 'POST',
  headers: { 'Content-Type': 'application/json' },
  body: JSON.stringify(DEMO_SIGN_INS.head),
});
const cookie = signIn.headers.get('set-cookie')!.split(';')[0]!;

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

const index = path.join(config.portalDist, 'index.html');
if (!fs.existsSync(index)) {
  console.log('browser part skipped: build the portal first (npm run build)');
} else {
  const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium', args: CHROMIUM_ARGS });
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
  await context.addCookies([{ name: cookie.split('=')[0]!, value: cookie.slice(cookie.indexOf('=') + 1), url: base }]);
  const page = await context.newPage();
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
