/**
 * Sites compared: the head sorts the table, shows another column, sets three sites side by
 * side, reads the scatter and downloads both CSVs, which parse back to the API's numbers; a
 * foreman does it with the keyboard and sees only his district.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import Papa from 'papaparse';
import type { Page } from 'playwright-core';
import { describe, expect, test } from 'vitest';
import type { CompareSitesAnswer } from '@swardwise/domain';
import { download, followNav, shots, tabTo, useBrowser, withPage } from './browser.ts';


useBrowser();

const TABLE = 'table[aria-label="compare-sites"]';

async function columnValues(page: Page, header: string): Promise<string[]> {
  const headers = await page.locator(`${TABLE} thead th`).allInnerTexts();
  const i = headers.findIndex((h) => h.includes(header));
  expect(i, header).toBeGreaterThanOrEqual(0);
  return page.locator(`${TABLE} tbody tr[data-test="row"] td:nth-child(${i + 1})`).allInnerTexts();
}

describe('compare sites', () => {
  test('should let the head sort, choose columns, set sites side by side and download CSVs that parse back', async () => {
    await withPage({ role: 'head', device: { viewport: { width: 1366, height: 900 }, acceptDownloads: true } }, async (page) => {
      const answered = page.waitForResponse((r) => r.url().includes('/api/compare/sites') && r.status() === 200);
      await followNav(page, 'compare');
      const api = (await (await answered).json()) as CompareSitesAnswer;
      await page.locator(`${TABLE} tbody tr[data-test="row"]`).first().waitFor();
      await page.locator('[data-test="cost-score-chart"] canvas').waitFor();
      expect(await page.locator('[data-test="cost-score-chart"]').innerText()).toMatch(/Cost per acre against surface score/);

      // Sort by surface score, highest first: the column reads downward.
      const scoreHeader = page.locator(`${TABLE} thead th`).filter({ has: page.locator('[data-test="sort-score"]') });
      await page.locator('[data-test="sort-score"]').click();
      if ((await scoreHeader.getAttribute('aria-sort')) !== 'descending') await page.locator('[data-test="sort-score"]').click();
      expect(await scoreHeader.getAttribute('aria-sort')).toBe('descending');
      const scores = (await columnValues(page, 'Surface score')).filter((s) => s !== '—').map(Number);
      expect(scores.length).toBeGreaterThan(3);
      expect([...scores].sort((a, b) => b - a)).toEqual(scores);

      // Show the hidden labour column.
      expect((await page.locator(`${TABLE} thead th`).allInnerTexts()).some((h) => h.includes('Labour'))).toBe(false);
      await page.locator('[data-test="table-columns"]').click();
      await page.locator('[data-test="column-labour"]').click();
      await expect.poll(async () => (await page.locator(`${TABLE} thead th`).allInnerTexts()).some((h) => h.includes('Labour'))).toBe(true);
      await page.keyboard.press('Escape');

      // Three sites side by side; a fifth pick is not offered once four are chosen.
      const picks = page.locator(`${TABLE} .compare__pick`);
      for (let i = 0; i < 3; i++) await picks.nth(i).check();
      const side = page.locator('[data-test="compare-side"]');
      await side.waitFor();
      expect(await side.locator('thead th').count()).toBe(4);
      await picks.nth(3).check();
      expect(await picks.nth(4).isDisabled()).toBe(true);
      await page.screenshot({ path: path.join(shots, 'compare-desktop.png'), fullPage: true });
      await page.locator('[data-test="cost-score-chart"]').screenshot({ path: path.join(shots, 'compare-scatter.png') });

      // The server's CSV: every figure as the API answered it.
      const serverFile = await download(page, '[data-test="compare-csv"]', 'compare-sites.csv');
      const server = Papa.parse<Record<string, string>>(readFileSync(serverFile, 'utf8'), { header: true, skipEmptyLines: true });
      expect(server.errors).toEqual([]);
      expect(server.data.length).toBe(api.rows.length);
      for (const [i, r] of api.rows.entries()) {
        expect(server.data[i]!.site).toBe(r.siteName);
        expect(Number(server.data[i]!.total_cost)).toBeCloseTo(r.cost.total, 2);
        expect(Number(server.data[i]!.hours_per_acre)).toBeCloseTo(r.hoursPerAcre ?? 0, 2);
      }

      // The table's own export: the visible columns in the head's units (per acre).
      const tableFile = await download(page, '[data-test="table-export"]', 'compare-table.csv');
      const table = Papa.parse<Record<string, string>>(readFileSync(tableFile, 'utf8'), { header: true, skipEmptyLines: true });
      expect(table.errors).toEqual([]);
      expect(table.data.length).toBe(api.rows.length);
      const costHeader = Object.keys(table.data[0]!).find((h) => h.startsWith('Cost per ac'))!;
      expect(costHeader).toBe(`Cost per ac (${api.currency})`);
      for (const line of table.data) {
        const r = api.rows.find((x) => x.siteName === line.Site)!;
        if (r.costPerAcre === null) expect(line[costHeader]).toBe('');
        else expect(Number(line[costHeader])).toBeCloseTo(r.costPerAcre, 2);
      }
    });
  });

  test('should let a foreman reach his district’s sites and set two side by side with the keyboard', async () => {
    await withPage({ role: 'foreman', keyboard: true }, async (page) => {
      await tabTo(page, '[data-test="nav-compare"]');
      await page.keyboard.press('Enter');
      await page.waitForURL((url) => url.pathname === '/compare');
      await page.locator(`${TABLE} tbody tr[data-test="row"]`).first().waitFor();
      const districts = new Set(await columnValues(page, 'District'));
      expect(districts.size).toBe(1);
      await tabTo(page, '.compare__pick');
      await page.keyboard.press('Space');
      await tabTo(page, '.compare__pick');
      await page.keyboard.press('Space');
      const side = page.locator('[data-test="compare-side"]');
      await side.waitFor();
      expect(await side.locator('thead th').count()).toBe(3);
    });
  });
});
