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
import { GRASSES, SPORTS, longAxis, polygonAreaM2, type Level, type Polygon, type Role } from '@swardwise/domain';
import { createApp } from '../../apps/api/src/app.ts';
import { loadConfig } from '../../apps/api/src/config.ts';
import type { Db } from '../../apps/api/src/db/client.ts';
import { DEMO_SIGN_INS } from '../../apps/api/src/db/seed/demo-city.ts';
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
