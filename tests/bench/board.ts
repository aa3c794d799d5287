/**
 * Week plan board benchmark: the demo city plus 500 invented work orders in one district's
 * week (in-memory PGlite), `GET /api/week-plans` timed over loopback, then the board page in
 * chromium: navigation start → all 500 cards drawn, and a card dropped on another crew-day →
 * the card re-rendered in its new cell (before the server answers), and → the server's
 * answer and the reloaded board drawn. All data is invented.
 * Needs a built portal (`npm run build`) for the browser part.
 * Run: node --import tsx tests/bench/board.ts
 */
import { performance } from 'node:perf_hooks';
import { eq } from 'drizzle-orm';
import { addDaysIso, WORK_TASKS } from '@swardwise/domain';
import { crews, districts, fields, sites, users, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { DEMO_SIGN_INS } from '../../apps/api/src/db/seed/demo-city.ts';
import { fmt, listenSignedIn, openDemoCity, portalPage, seeded } from './support.ts';

const ORDERS = 500;
const WEEK = '2026-06-15';
const API_RUNS = 30;
const LOADS = 5;
const DRAGS = 20;

const { rand, pick } = seeded(20260615);

const database = await openDemoCity();
const { db } = database;

const [foreman] = await db.select({ districtId: users.districtId }).from(users).where(eq(users.email, DEMO_SIGN_INS.foreman.email));
const districtId = foreman!.districtId!;
const [district] = await db.select({ name: districts.name }).from(districts).where(eq(districts.id, districtId));
const districtFields = await db.select({ id: fields.id, siteId: fields.siteId }).from(fields).innerJoin(sites, eq(sites.id, fields.siteId)).where(eq(sites.districtId, districtId));
const districtCrews = await db.select({ id: crews.id }).from(crews).where(eq(crews.districtId, districtId));
const rows = Array.from({ length: ORDERS }, () => {
  const f = pick(districtFields);
  const crewId = rand() < 0.1 ? null : pick(districtCrews).id;
  return {
    fieldId: f.id,
    siteId: f.siteId,
    districtId,
    task: pick(WORK_TASKS),
    weekStart: WEEK,
    plannedDate: addDaysIso(WEEK, Math.floor(rand() * 5)),
    crewId,
    plannedHours: Math.round((0.25 + rand() * 1.5) * 4) / 4,
    status: crewId ? ('assigned' as const) : ('planned' as const),
    origin: 'generated' as const,
    reason: 'Invented bench order',
    details: {},
  };
});
for (let i = 0; i < rows.length; i += 250) await db.insert(workOrders).values(rows.slice(i, i + 250));

const { config, server, base, cookie } = await listenSignedIn(db, 'foreman');
const boardUrl = `/api/week-plans?districtId=${districtId}&weekStart=${WEEK}`;

const apiTimes: number[] = [];
let bytes = 0;
for (let i = 0; i < API_RUNS; i++) {
  const t0 = performance.now();
  const res = await fetch(`${base}${boardUrl}`, { headers: { cookie } });
  const text = await res.text();
  if (res.status !== 200) throw new Error(`${boardUrl}: ${res.status} ${text.slice(0, 200)}`);
  apiTimes.push(performance.now() - t0);
  bytes = text.length;
}
console.log(`work orders on the board: ${ORDERS} (${district!.name}, week of ${WEEK}); answer ${(bytes / 1024).toFixed(0)} kB`);
console.log(`GET /api/week-plans, ${API_RUNS} sequential: ${fmt(apiTimes)}`);

const portal = await portalPage(config.portalDist, base, cookie, { width: 1366, height: 900 });
if (portal) {
  const { browser, page } = portal;
  const loadTimes: number[] = [];
  for (let i = 0; i < LOADS; i++) {
    await page.goto(`${base}/week?week=${WEEK}`);
    const ms = await page.waitForFunction((n) => document.querySelectorAll('[data-test="order-card"]').length === n && performance.now(), ORDERS, { timeout: 30_000 });
    loadTimes.push((await ms.jsonValue()) as number);
  }
  console.log(`board page, navigation start → ${ORDERS} cards drawn, ${LOADS} loads: ${fmt(loadTimes)}`);

  const crewIds = districtCrews.map((c) => c.id);
  const localTimes: number[] = [];
  const savedTimes: number[] = [];
  for (let i = 0; i < DRAGS; i++) {
    // A card of one crew onto another crew's day, as a drop with the board's own drag payload.
    const target = { crewId: crewIds[(i + 1) % crewIds.length]!, date: addDaysIso(WEEK, i % 5) };
    const reloaded = page.waitForResponse((r) => r.url().endsWith(boardUrl) && r.request().method() === 'GET');
    const t0 = performance.now();
    const local = await page.evaluate(async ({ from, to }) => {
      const card = document.querySelector<HTMLElement>(`[data-test="board-cell"][data-crew="${from}"] [data-test="order-card"][draggable="true"]`);
      const cell = document.querySelector<HTMLElement>(`[data-test="board-cell"][data-crew="${to.crewId}"][data-date="${to.date}"]`);
      if (!card || !cell) throw new Error('no card or cell to drag between');
      const id = card.dataset.orderId!;
      const dt = new DataTransfer();
      dt.setData('application/x-swardwise-order', id);
      const start = performance.now();
      const drawn = new Promise<void>((resolve) => {
        const mo = new MutationObserver(() => {
          if (cell.querySelector(`[data-order-id="${id}"]`)) {
            mo.disconnect();
            resolve();
          }
        });
        mo.observe(cell, { childList: true, subtree: true });
      });
      cell.dispatchEvent(new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }));
      await drawn;
      await new Promise((r) => requestAnimationFrame(() => r(null)));
      return performance.now() - start;
    }, { from: crewIds[i % crewIds.length]!, to: target });
    localTimes.push(local);
    await reloaded;
    await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r))));
    savedTimes.push(performance.now() - t0);
  }
  const count = await page.locator('[data-test="order-card"]').count();
  if (count !== ORDERS) throw new Error(`board shows ${count} cards after the drags, expected ${ORDERS}`);
  console.log(`drag → card re-drawn in its new cell (before the answer, 1 frame), ${DRAGS} drops: ${fmt(localTimes)}`);
  console.log(`drag → PATCH answered, board reloaded and re-drawn (2 frames), ${DRAGS} drops: ${fmt(savedTimes)}`);
  await browser.close();
}

server.close();
await database.close();
