/**
 * Today on a crew lead's phone over a slow mobile connection: the demo city in an in-memory
 * PGlite, the built portal served in production mode, chromium at 390 × 844 with the
 * connection and the CPU throttled through the DevTools protocol (1.6 Mbps down, 750 kbps
 * up, 150 ms latency, CPU 4× slower; a common "slow 4G" profile, from memory). Per load: the
 * largest contentful paint, the bytes that crossed the wire (compressed, as sent) and the
 * number of requests, up to the first job card; then a second visit with the browser's and
 * the service worker's caches, and Today opened with no signal at all after that visit.
 * Needs a built portal (`npm run build`).
 * Run: npm run bench -- today
 */
import os from 'node:os';
import type { BrowserContext, CDPSession, Page } from 'playwright-core';
import { firstJobCardAt, launchBrowser, markFirstJobCard, PHONE } from '../e2e/browser.ts';
import { fmt, listenSignedIn, openDemoCity } from './support.ts';

const COLD_LOADS = 5;
const SLOW_4G = { offline: false, latency: 150, downloadThroughput: (1.6e6 / 8) * 0.9, uploadThroughput: (750e3 / 8) * 0.9 };
const CPU_SLOWDOWN = 4;

const database = await openDemoCity();
const { config, server, base, cookie } = await listenSignedIn(database.db, 'crew');
const fs = await import('node:fs');
if (!fs.existsSync(`${config.portalDist}/index.html`)) {
  console.log('skipped: build the portal first (npm run build)');
  process.exit(0);
}

/** Bytes on the wire and requests counted from the protocol's own events (service worker fetches included). */
async function throttled(context: BrowserContext, page: Page) {
  const cdp: CDPSession = await context.newCDPSession(page);
  await cdp.send('Network.enable');
  await cdp.send('Network.emulateNetworkConditions', SLOW_4G);
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: CPU_SLOWDOWN });
  const seen = { bytes: 0, requests: 0, fromCache: 0 };
  cdp.on('Network.requestWillBeSent', () => (seen.requests += 1));
  cdp.on('Network.requestServedFromCache', () => (seen.fromCache += 1));
  cdp.on('Network.loadingFinished', (e: { encodedDataLength: number }) => (seen.bytes += e.encodedDataLength));
  return seen;
}

/** Opens Today and waits for its first job card; the LCP as the page's own observer saw it, and when the first card was put in the page. */
async function openToday(page: Page, seen?: { bytes: number; requests: number }): Promise<{ lcp: number; card: number; bytes: number; requests: number }> {
  await markFirstJobCard(page);
  await page.goto(`${base}/today`);
  await page.locator('[data-test="job-card"]').first().waitFor({ timeout: 60_000 });
  // What it took to show the jobs; the service worker's own downloads come after.
  const counted = { bytes: seen?.bytes ?? 0, requests: seen?.requests ?? 0 };
  // The largest paint can land a frame after the card; let it settle before reading.
  await page.waitForTimeout(500);
  const lcp = await page.evaluate(
    () =>
      new Promise<number>((resolve) => {
        new PerformanceObserver((list) => {
          const entries = list.getEntries();
          resolve(entries[entries.length - 1]!.startTime);
        }).observe({ type: 'largest-contentful-paint', buffered: true });
      }),
  );
  const card = await firstJobCardAt(page);
  return { lcp, card, ...counted };
}

const browser = await launchBrowser();
const cookieOf = { name: cookie.split('=')[0]!, value: cookie.slice(cookie.indexOf('=') + 1), url: base };
const lcp: number[] = [];
const cards: number[] = [];
const bytes: number[] = [];
const requests: number[] = [];
let lastContext: BrowserContext | null = null;
for (let i = 0; i < COLD_LOADS; i++) {
  await lastContext?.close();
  const context = await browser.newContext(PHONE);
  await context.addCookies([cookieOf]);
  const page = await context.newPage();
  const seen = await throttled(context, page);
  const load = await openToday(page, seen);
  lcp.push(load.lcp);
  cards.push(load.card);
  bytes.push(load.bytes);
  requests.push(load.requests);
  lastContext = context;
}
const kb = (b: number) => `${(b / 1024).toFixed(0)} KB`;
// Paint times move with the machine's load (the CPU slowdown multiplies it): say what it was.
const load = os.loadavg().map((l) => l.toFixed(1)).join(' ');
console.log(`Today, first visit, ${COLD_LOADS} fresh phones (slow 4G, CPU ×${CPU_SLOWDOWN}; load average ${load} on ${os.cpus().length} cores): LCP ${fmt(lcp)}`);
console.log(`  first job card in the page: ${fmt(cards)}`);
console.log(`  bytes on the wire to the first job card: ${bytes.map(kb).join(', ')}; requests: ${requests.join(', ')}`);

// The same phone comes back: what its caches (HTTP and service worker) save.
const context = lastContext!;
const page = context.pages()[0]!;
const ready = await page.evaluate(async () => {
  if (!('serviceWorker' in navigator)) return false;
  const timeout = new Promise<false>((r) => setTimeout(() => r(false), 30_000));
  return Promise.race([navigator.serviceWorker.ready.then(() => true), timeout]);
});
// Wait for the service worker to finish precaching before counting the next visit.
await page.waitForTimeout(ready ? 5000 : 0);
const again = await context.newPage();
const seen = await throttled(context, again);
const warm = await openToday(again, seen);
console.log(`Today, second visit on the same phone: LCP ${warm.lcp.toFixed(0)} ms, first job card ${warm.card.toFixed(0)} ms, ${kb(warm.bytes)} on the wire, ${warm.requests} requests`);

// No signal at all: the app shell and the last known jobs, or nothing. A page of its own, as
// the throttled one's protocol session would override the context's offline switch.
await again.close();
await context.setOffline(true);
const offlinePage = await context.newPage();
let offline = 'did not open';
try {
  await offlinePage.goto(`${base}/today`, { timeout: 15_000 });
  await offlinePage.locator('[data-test="job-card"]').first().waitFor({ timeout: 15_000 });
  offline = `opened with ${await offlinePage.locator('[data-test="job-card"]').count()} job cards`;
} catch {
  // recorded as not opening
}
console.log(`Today offline after one visit (service worker ${ready ? 'ready' : 'absent'}): ${offline}`);

await browser.close();
server.close();
await database.close();
