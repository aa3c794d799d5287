/**
 * A district foreman's ordinary morning in chromium: the district landing opens with today and
 * what is late, the fields list sorts by what is overdue, a busy crew-day on the board shows
 * every card, and the crew sheet names each mower and address. Screenshots of each.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, inject, test } from 'vitest';
import { browser, shots, signIn, useBrowser } from './browser.ts';

const baseUrl = inject('baseUrl');
const SUMMER_WEEK = '2026-06-15';
useBrowser();

async function foreman(viewport = { width: 1366, height: 900 }): Promise<Page> {
  const page = await browser.newPage({ viewport });
  await signIn(page, 'foreman');
  return page;
}

describe('a foreman\u2019s morning', () => {
  test('should open the district landing with today and what is late', async () => {
    const page = await foreman();
    try {
      await page.goto(`${baseUrl}/district`);
      await page.locator('[data-test="district-today"]').waitFor();
      await page.locator('[data-test="district-late"]').waitFor();
      // The work orders and the map answer have come: the counts stop loading.
      await expect.poll(() => page.locator('[data-test="district-today"] .el-loading-mask').first().isVisible().catch(() => false), { timeout: 20_000 }).toBe(false);
      await expect.poll(() => page.locator('[data-test="district-late"] .el-loading-mask').first().isVisible().catch(() => false), { timeout: 20_000 }).toBe(false);
      expect(await page.locator('[data-test="district-today"] h2').textContent()).toMatch(/^Today/);
      expect(Number(await page.locator('[data-test="late-checks"]').textContent())).toBeGreaterThanOrEqual(0);
      await page.screenshot({ path: path.join(shots, 'district-landing.png'), fullPage: true });
    } finally {
      await page.close();
    }
  });

  test('should list the fields with last mowed, next due, overdue and surface score, sorted by what is overdue', async () => {
    const page = await foreman();
    try {
      await page.goto(`${baseUrl}/fields`);
      await page.locator('[data-test="sort-overdue"]').waitFor();
      for (const id of ['lastMowed', 'mowDue', 'overdue', 'checkDue', 'score']) expect(await page.locator(`[data-test="sort-${id}"]`).count(), id).toBe(1);
      await page.locator('[data-test="sort-overdue"]').click();
      await page.screenshot({ path: path.join(shots, 'fields-list.png'), fullPage: true });
    } finally {
      await page.close();
    }
  });

  test('should show every card of the busiest crew-day and print its sheet with mowers and addresses', async () => {
    const page = await foreman({ width: 1440, height: 1000 });
    try {
      // A summer week no other browser test plans, generated: a full week of mowing.
      await page.goto(`${baseUrl}/week?week=${SUMMER_WEEK}`);
      await page.locator('[data-test="week-grid"]').waitFor();
      await page.locator('[data-test="generate-week"]').click();
      await page.locator('[data-test="diff-apply"]').click();
      await page.locator('[data-test="order-card"]').first().waitFor();
      // The crew-day with the most cards.
      const busiest = await page.$$eval('[data-test="board-cell"]:not([data-crew="none"])', (cells) =>
        cells.map((c) => ({ crew: c.getAttribute('data-crew')!, date: c.getAttribute('data-date')!, n: c.querySelectorAll('[data-test="order-card"]').length })).sort((a, b) => b.n - a.n)[0]!,
      );
      expect(busiest.n).toBeGreaterThan(0);
      const cell = page.locator(`[data-test="board-cell"][data-crew="${busiest.crew}"][data-date="${busiest.date}"]`);
      // Nothing scrolls inside the cell: every card is in view of the page.
      const inner = await cell.locator('.cell__cards').evaluate((ul) => ({ scroll: ul.scrollHeight, client: ul.clientHeight }));
      expect(inner.scroll).toBeLessThanOrEqual(inner.client + 1);
      await cell.scrollIntoViewIfNeeded();
      await page.screenshot({ path: path.join(shots, 'board-busy-day.png'), fullPage: true });

      await page.goto(`${baseUrl}/week/sheet?crewId=${busiest.crew}&date=${busiest.date}`);
      await page.locator('[data-test="sheet-jobs"]').waitFor();
      const equipment = await page.locator('[data-test="sheet-equipment"]').allTextContents();
      const tasks = await page.locator('[data-test="sheet-job"] td:nth-child(4)').allTextContents();
      tasks.forEach((t, i) => {
        if (/^Mow/.test(t.trim())) expect(equipment[i]!.trim(), `row ${i + 1}`).toMatch(/mower|[A-Z]-/);
      });
      expect(await page.locator('[data-test="sheet-address"]').count()).toBeGreaterThan(0);
      await page.screenshot({ path: path.join(shots, 'crew-sheet.png'), fullPage: true });
      await page.setViewportSize({ width: 390, height: 844 });
      await page.screenshot({ path: path.join(shots, 'crew-sheet-phone.png'), fullPage: true });
    } finally {
      await page.close();
    }
  });
});
