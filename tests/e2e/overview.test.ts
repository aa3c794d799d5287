/**
 * The overview in chromium on the demo city: the head sees the department's cards, the four
 * charts and the districts side by side, and follows a figure to the rows behind it; a foreman
 * sees his own district only.
 */
import path from 'node:path';
import { describe, expect, test } from 'vitest';
import { shots, useBrowser, withPage } from './browser.ts';

useBrowser();

describe('overview', () => {
  test('should show the head cards and charts and lead from fields below target to those fields', async () => {
    await withPage({ role: 'head', open: '/overview' }, async (page) => {
      await page.locator('[data-test="overview-cards"]').waitFor();
      for (const chart of ['area', 'labour', 'mowings', 'score']) await page.locator(`[data-test="chart-${chart}"] canvas`).waitFor();
      expect(await page.locator('[data-test^="district-row-"]').count()).toBeGreaterThan(1);
      const mowings = await page.locator('[data-test="card-mowings"]').innerText();
      expect(Number(mowings.match(/(\d+) late/)?.[1])).toBeGreaterThan(0);
      await page.screenshot({ path: path.join(shots, 'overview-head.png'), fullPage: true });

      const below = Number((await page.locator('[data-test="below-target"]').innerText()).match(/\d+/)?.[0]);
      expect(below).toBeGreaterThan(0);
      await page.locator('[data-test="below-target"]').click();
      await page.waitForURL((url) => url.pathname === '/fields' && url.searchParams.get('target') === 'below');
      await page.locator('[data-test="row"]').first().waitFor();
      // The list holds exactly the fields the card counted.
      await expect.poll(async () => page.locator('[data-test="row"]').count(), { timeout: 20_000 }).toBe(Math.min(below, 25));
    });
  });

  test('should show a foreman his own district only', async () => {
    await withPage({ role: 'foreman', open: '/overview' }, async (page) => {
      await page.locator('[data-test="overview-cards"]').waitFor();
      expect(await page.locator('[data-test="page-title"]').innerText()).toMatch(/^Overview: /);
      expect(await page.locator('[data-test="overview-district"]').count()).toBe(0);
      expect(await page.locator('[data-test^="district-row-"]').count()).toBe(0);
      const answer = await page.evaluate(async () => (await fetch('/api/overview?districtId=999999')).status);
      expect(answer).toBe(403);
      await page.screenshot({ path: path.join(shots, 'overview-foreman.png'), fullPage: true });
    });
  });
});
