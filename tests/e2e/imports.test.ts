/**
 * A foreman imports sites from a CSV file: a file with a bad row shows the row's error and
 * cannot be imported; a clean file is imported, its site shows in the Sites list, and
 * "Undo last import" removes it again.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, describe, expect, inject, test } from 'vitest';
import { checkA11y, followNav, shots, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-imports-'));

useBrowser();
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));

const HEADER = 'site,district,kind,owner,address,lat,lng,notes';
const SITE = 'Quillwort Meadow';

function csvFile(name: string, ...lines: string[]): string {
  const file = path.join(work, name);
  fs.writeFileSync(file, [HEADER, ...lines].join('\n') + '\n');
  return file;
}

async function sitesListed(page: Page, name: string): Promise<number> {
  await page.goto(`${baseUrl}/sites`);
  await page.locator('[data-test="row"]').first().waitFor();
  await page.locator('input[data-test="table-search"]').fill(name);
  return page.locator('[data-test="row"]', { hasText: name }).count();
}

describe('importing sites', () => {
  test('should show a bad row’s error, import a clean file, list the new site and undo it', async () => {
    await withPage({ role: 'foreman', landing: '/district', device: { viewport: { width: 1360, height: 900 } }, nav: 'imports' }, async (page) => {

      await page.setInputFiles(
        '[data-test="import-file"]',
        csvFile('bad.csv', `${SITE},north,park,city,3 Quillwort Lane,37.569,-66.451,invented`, 'Sedge Corner,north,park,city,,not-a-latitude,-66.45,'),
      );
      await page.locator('[data-test="import-row-bad"]').waitFor();
      expect(await page.locator('[data-test="import-row-bad"]').textContent()).toContain('is not a number');
      expect(await page.locator('[data-test="import-row-ok"]').count()).toBe(1);
      expect(await page.locator('[data-test="import-commit"]').isDisabled()).toBe(true);
      // The upload's progress bar stays after the upload: checked by name, not only when a
      // background check happens to run late enough to see it.
      await checkA11y(page);
      await page.screenshot({ path: path.join(shots, 'imports-errors.png'), fullPage: true });

      await page.setInputFiles('[data-test="import-file"]', csvFile('good.csv', `${SITE},north,park,city,3 Quillwort Lane,37.569,-66.451,invented`));
      await expect.poll(() => page.locator('[data-test="import-summary"]').textContent()).toContain('0 with errors');
      const commit = page.locator('[data-test="import-commit"]');
      expect(await commit.textContent()).toContain('Import 1 row');
      await commit.click();
      await page.locator('[data-test="import-notice"]').waitFor();
      expect(await page.locator('[data-test="import-notice"]').textContent()).toContain('1 created');

      expect(await sitesListed(page, SITE)).toBe(1);

      await followNav(page, 'imports');
      const undo = page.locator('[data-test="undo-last"]');
      await expect.poll(() => undo.isEnabled()).toBe(true);
      await undo.click();
      await page.getByRole('button', { name: 'Undo import' }).click();
      await expect.poll(() => page.locator('[data-test="import-notice"]').textContent()).toContain('1 removed');

      expect(await sitesListed(page, SITE)).toBe(0);
    });
  });
});
