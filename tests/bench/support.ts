/**
 * What the benchmarks share: seeded invented data, percentiles, invented field rows placed
 * around real sites of the demo city, and the app listening on loopback with a signed-in
 * cookie, the built portal in chromium. Not a benchmark itself (`run.ts` skips it).
 */
import fs from 'node:fs';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { pino } from 'pino';
import type { Browser, Page } from 'playwright-core';
import { GRASSES, SPORTS, greatCircleKm, longAxis, polygonAreaM2, prepareWeather, type Level, type Polygon, type Role } from '@swardwise/domain';
import type { PreparedWeather } from '@swardwise/domain/engine';
import { createApp } from '../../apps/api/src/app.ts';
import { loadConfig } from '../../apps/api/src/config.ts';
import { openDatabase, type Database, type Db } from '../../apps/api/src/db/client.ts';
import { fields, sites } from '../../apps/api/src/db/schema/index.ts';
import { DEMO_SIGN_INS, type buildDemoCity } from '../../apps/api/src/db/seed/demo-city.ts';
import { seedDemoCity } from '../../apps/api/src/db/seed/index.ts';
import { mulberry32, type Rng } from '../../apps/api/src/db/seed/prng.ts';
import { createMailer } from '../../apps/api/src/mail/mailer.ts';
import { launchBrowser } from '../e2e/browser.ts';

/** A seeded generator and a pick from a list with it: the same invented data on every run. */
export function seeded(seed: number): { rand: Rng; pick: <T>(xs: readonly T[]) => T } {
  const rand = mulberry32(seed);
  return { rand, pick: <T>(xs: readonly T[]): T => xs[Math.floor(rand() * xs.length)] as T };
}

/** The p-th percentile (nearest rank) of times in ms. */
export const pct = (xs: number[], p: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor((p / 100) * xs.length))]!;
export const fmt = (xs: number[]) => `p50 ${pct(xs, 50).toFixed(1)} ms, p95 ${pct(xs, 95).toFixed(1)} ms, max ${Math.max(...xs).toFixed(1)} ms`;

/** A w × l m rectangle with its south-west corner at (lat, lng), roughly at 37° N. */
export function rect(lat: number, lng: number, w: number, l: number): Polygon {
  const dLat = l / 111_000;
  const dLng = w / 88_000;
  return { type: 'Polygon', coordinates: [[[lng, lat], [lng + dLng, lat], [lng + dLng, lat + dLat], [lng, lat + dLat], [lng, lat]]] };
}

/** An invented field row near a site: rectangle, area and long axis from its outline, any sport, grass and level. */
export function benchField(site: { id: number; lat: number; lng: number }, i: number, { rand, pick }: ReturnType<typeof seeded>, spread: { lat: number; lng: number }) {
  const geometry = rect(site.lat + (rand() - 0.5) * spread.lat, site.lng + (rand() - 0.5) * spread.lng, 40 + rand() * 40, 70 + rand() * 50);
  return {
    siteId: site.id,
    name: `Bench field ${i + 1}`,
    sport: pick(SPORTS),
    grass: pick(GRASSES),
    rootzone: 'native_soil' as const,
    maintenanceLevel: (1 + Math.floor(rand() * 4)) as Level,
    clippings: 'returned' as const,
    geometry,
    areaM2: polygonAreaM2(geometry),
    longAxisDeg: longAxis(geometry).bearingDeg,
  };
}

/** A fresh in-memory PGlite with the demo city seeded into it. */
export async function openDemoCity(): Promise<Database> {
  const database = await openDatabase({ pgliteDir: 'memory://' });
  await seedDemoCity(database.db);
  return database;
}

/**
 * `count` invented fields (`benchField`, no irrigation) at random sites of the database, with
 * what `more` adds to each row; inserted 500 at a time. Answers their ids and statuses.
 */
export async function addBenchFields(db: Db, count: number, gen: ReturnType<typeof seeded>, more: () => Partial<typeof fields.$inferInsert> = () => ({})) {
  const siteRows = await db.select({ id: sites.id, lat: sites.lat, lng: sites.lng }).from(sites);
  const rows = Array.from({ length: count }, (_, i) => ({ ...benchField(gen.pick(siteRows), i, gen, { lat: 0.03, lng: 0.04 }), irrigation: 'none' as const, ...more() }));
  const inserted: { id: number; status: string }[] = [];
  for (let i = 0; i < rows.length; i += 500) inserted.push(...(await db.insert(fields).values(rows.slice(i, i + 500)).returning({ id: fields.id, status: fields.status })));
  return inserted;
}

/**
 * The demo city in a fresh in-memory PGlite (`openDemoCity`) with `count` invented fields
 * (`addBenchFields`) drawn by the generator of `seed`, which `more` also draws from for what
 * it adds to each row; the generator goes on from there for what the benchmark adds next.
 */
export async function demoCityWithFields(seed: number, count: number, more: (gen: ReturnType<typeof seeded>) => Partial<typeof fields.$inferInsert>) {
  const gen = seeded(seed);
  const database = await openDemoCity();
  const inserted = await addBenchFields(database.db, count, gen, () => more(gen));
  return { ...gen, database, db: database.db, inserted };
}

/** The demo city's station weather, each station's prepared once, and a site's: that of its nearest station. */
export function demoWeather(city: ReturnType<typeof buildDemoCity>): (site: { lat: number; lng: number }) => PreparedWeather {
  const prepared = new Map<string, PreparedWeather>();
  for (const st of city.weatherStations) {
    const days = city.weather.filter((w) => w.stationCode === st.code).map(({ stationCode: _, ...d }) => d);
    prepared.set(st.code, prepareWeather(days, { latDeg: st.lat, elevationM: st.elevationM }));
  }
  const nearest = (site: { lat: number; lng: number }) => [...city.weatherStations].sort((a, b) => greatCircleKm(site, a) - greatCircleKm(site, b))[0]!.code;
  return (site) => prepared.get(nearest(site))!;
}

/** The app in production mode on a free loopback port, and the session cookie of a demo account. */
export async function listenSignedIn(db: Db, role: Role) {
  const logger = pino({ level: 'silent' });
  const config = loadConfig({ NODE_ENV: 'production', LOG_LEVEL: 'silent', LOGIN_ATTEMPTS: '1000' });
  const { app } = createApp({ db, config, logger, sessionSecret: 'bench-secret', mailer: createMailer(null, logger) });
  const server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const res = await fetch(`${base}/api/auth/sign-in`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(DEMO_SIGN_INS[role]) });
  const cookie = res.headers.get('set-cookie')!.split(';')[0]!;
  return { config, server, base, cookie };
}

/**
 * GETs `path` `runs` + 1 times one after another with the session cookie, each timed to the
 * end of its body (ms). The first answer, which warms the database's caches and plans, is
 * given apart with its text; anything but a 200 fails.
 */
export async function timeGets(base: string, cookie: string, path: string, runs: number, before?: () => Promise<void>): Promise<{ first: { ms: number; text: string }; times: number[] }> {
  let first = { ms: 0, text: '' };
  const times: number[] = [];
  for (let i = 0; i <= runs; i++) {
    // Untimed: what each request must come after (a write, so the answer is worked out again).
    if (before) await before();
    const start = performance.now();
    const res = await fetch(`${base}${path}`, { headers: { cookie } });
    const text = await res.text();
    const ms = performance.now() - start;
    if (res.status !== 200) throw new Error(`${path}: ${res.status} ${text.slice(0, 200)}`);
    if (i === 0) first = { ms, text };
    else times.push(ms);
  }
  return { first, times };
}

/** The built portal in chromium, signed in with the cookie; null, and a note, when the portal is not built. */
export async function portalPage(portalDist: string, base: string, cookie: string, viewport: { width: number; height: number }): Promise<{ browser: Browser; page: Page } | null> {
  if (!fs.existsSync(path.join(portalDist, 'index.html'))) {
    console.log('browser part skipped: build the portal first (npm run build)');
    return null;
  }
  const browser = await launchBrowser();
  const context = await browser.newContext({ viewport });
  await context.addCookies([{ name: cookie.split('=')[0]!, value: cookie.slice(cookie.indexOf('=') + 1), url: base }]);
  return { browser, page: await context.newPage() };
}
