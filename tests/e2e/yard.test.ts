/**
 * Blade sharpening at the yard in chromium: a foreman's mower is past its sharpening interval,
 * the week's generation puts "Sharpen blades" on the board at the yard, and the crew lead finds
 * it on Today on a phone with the blade cautions, logs it done with the hour meter reading, and
 * the mower is no longer due.
 */
import path from 'node:path';
import { DEFAULT_TIME_ZONE, localToday, mondayOf } from '@swardwise/domain';
import type { Page } from 'playwright-core';
import { describe, expect, inject, test } from 'vitest';
import { browser, checkA11y, shots, signIn, useBrowser } from './browser.ts';

const baseUrl = inject('baseUrl');
useBrowser();

type Order = { id: number; fieldId: number | null; task: string; crewId: number | null; plannedDate: string; version: number; equipmentId: number | null };
const call = <T>(page: Page, url: string, method = 'GET', body?: unknown): Promise<{ status: number; body: T }> =>
  page.evaluate(
    async ([u, m, b]) => {
      const res = await fetch(u, { method: m, headers: { 'Content-Type': 'application/json' }, body: b === undefined ? undefined : JSON.stringify(b) });
      return { status: res.status, body: await res.json() };
    },
    [url, method, body] as const,
  ) as Promise<{ status: number; body: T }>;

describe('blade sharpening at the yard', () => {
  test('should put a due mower’s sharpening on the board and on the crew lead’s Today, and clear it when logged', async () => {
    const today = localToday(process.env.DEPARTMENT_TIME_ZONE || DEFAULT_TIME_ZONE);
    const monday = mondayOf(today);
    const foreman = await browser.newPage({ viewport: { width: 1366, height: 1000 } });
    const phone = await browser.newPage({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    try {
      await signIn(foreman, 'foreman');
      await signIn(phone, 'crew', '/today');
      const me = (await call<{ user: { districtId: number } }>(foreman, '/api/auth/me')).body.user;
      const lead = (await call<{ user: { crewId: number } }>(phone, '/api/auth/me')).body.user;

      // 410 h on the meter, sharpened at 380 h, every 25 h (rotary blades: 8–25 h, common practice, from memory): due.
      const made = await call<{ equipment: { id: number } }>(foreman, '/api/equipment', 'POST', {
        districtId: me.districtId, crewId: lead.crewId, kind: 'rotary_mower', name: 'Rotary 60 (M-9)', cuttingWidthM: 1.52, speedKmh: 8, fieldEfficiency: 0.8, hocMinMm: 25, hocMaxMm: 115,
        hourMeterH: 410, sharpenIntervalH: 25, lastSharpenedAtH: 380,
      });
      expect(made.status).toBe(201);
      const mowerId = made.body.equipment.id;

      const generated = await call<{ board: { orders: Order[] } }>(foreman, '/api/week-plans/generate', 'POST', { districtId: me.districtId, weekStart: monday });
      expect(generated.status).toBe(200);
      let job = generated.body.board.orders.find((o) => o.task === 'sharpen_blades' && o.equipmentId === mowerId)!;
      expect(job).toMatchObject({ fieldId: null });
      // On a weekend the plan has no working day left for it: the foreman puts it on the lead's today.
      if (job.plannedDate !== today || job.crewId !== lead.crewId) {
        const moved = await call<Order>(foreman, `/api/work-orders/${job.id}`, 'PATCH', { version: job.version, plannedDate: today, crewId: lead.crewId });
        expect(moved.status).toBe(200);
        job = moved.body;
      }

      // The board: the card reads as work at the yard.
      await foreman.goto(`${baseUrl}/week?week=${monday}`);
      const cell = foreman.locator(`[data-test="board-cell"][data-crew="${job.crewId}"][data-date="${job.plannedDate}"]`);
      const card = cell.locator(`[data-test="order-card"][data-order-id="${job.id}"]`);
      const expand = cell.locator('[data-test="cell-expand"]');
      await expect.poll(async () => (await card.count()) + (await expand.count()), { timeout: 20_000 }).toBeGreaterThan(0);
      if (await expand.count()) await expand.click();
      await expect.poll(() => card.innerText()).toMatch(/Sharpen blades — Rotary 60 \(M-9\)[\s\S]*yard/i);
      await card.scrollIntoViewIfNeeded();
      await foreman.screenshot({ path: path.join(shots, 'yard-board.png') });

      // The crew lead's phone: first on Today, no directions, the blade cautions, an hour meter reading.
      await phone.goto(`${baseUrl}/today`);
      const jobCard = phone.locator(`[data-test="job-card"][data-order-id="${job.id}"]`);
      await jobCard.waitFor({ timeout: 20_000 });
      // Yard work comes before the route: every card ahead of this one is yard work too (other
      // mowers of the district may be due as well).
      const cards = await phone.locator('[data-test="job-card"]').evaluateAll((els) => els.map((el) => ({ id: el.getAttribute('data-order-id'), text: el.textContent ?? '' })));
      const at = cards.findIndex((c) => c.id === String(job.id));
      expect(at).toBeGreaterThanOrEqual(0);
      expect(cards.slice(0, at + 1).every((c) => /Sharpen blades/.test(c.text))).toBe(true);
      expect(await jobCard.locator('[data-test="job-directions"]').count()).toBe(0);
      expect(await jobCard.locator('[data-test="job-blade-caution"]').innerText()).toMatch(/gloves[\s\S]*spark plug[\s\S]*manual/i);
      await checkA11y(phone);
      await phone.screenshot({ path: path.join(shots, 'yard-today-phone.png') });
      expect(await phone.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);

      await jobCard.locator('[data-test="job-done"]').click();
      const dialog = phone.locator('[data-test="report-dialog"]');
      const meter = dialog.locator('[data-test="report-hour-meter"] input');
      await meter.fill('412.5');
      await meter.blur();
      await checkA11y(phone);
      await phone.screenshot({ path: path.join(shots, 'yard-report-phone.png') });
      await dialog.locator('[data-test="report-submit"]').click();
      await expect.poll(() => jobCard.getAttribute('data-status'), { timeout: 20_000 }).toBe('done');

      // The mower's blades are sharp again: sharpened at the reading, 0 h since.
      // The card turns done as soon as the report is on its way (a phone keeps it until sent): wait for the server's record.
      const mower = async () => (await call<{ items: { id: number; hourMeterH: number; lastSharpenedAtH: number | null }[] }>(foreman, '/api/equipment')).body.items.find((e) => e.id === mowerId);
      await expect.poll(mower, { timeout: 20_000 }).toMatchObject({ hourMeterH: 412.5, lastSharpenedAtH: 412.5 });
    } finally {
      await foreman.close();
      await phone.close();
    }
  });
});
