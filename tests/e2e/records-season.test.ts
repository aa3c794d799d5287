/**
 * Records over the demo's season in chromium: a foreman picks "This year" and reads his
 * district's season (hours planned and worked, mowings asked, done, late and missed, and the
 * late mowings).
 */
import path from 'node:path';
import { describe, expect, test } from 'vitest';
import { shots, useBrowser, withPage } from './browser.ts';

useBrowser();

describe('records over the demo season', () => {
  test('should show a foreman his district’s season with late and missed mowings', async () => {
    await withPage({ role: 'foreman', open: '/records' }, async (page) => {
      await page.locator('[data-test="records-totals"]').waitFor();
      await page.locator('.el-range-input').first().click();
      await page.locator('.el-picker-panel__shortcut', { hasText: 'This year' }).click();
      // The season's mowings: hundreds asked, some late.
      await expect.poll(async () => Number(((await page.locator('[data-test="records-mowings"]').innerText()).match(/\d+/g) ?? []).map(Number).sort((a, b) => b - a)[0] ?? 0), { timeout: 20_000 }).toBeGreaterThan(200);
      await page.locator('[data-test="late-mowings"]').waitFor();
      await page.screenshot({ path: path.join(shots, 'records-season.png'), fullPage: true });
    });
  });
});
