/**
 * What-if: the head chooses fields with the keyboard, a level to move them to, and reads the
 * season's change (table and chart) before anything is saved.
 */
import path from 'node:path';
import { describe, expect, inject, test } from 'vitest';
import type { FieldList, WhatIfAnswer } from '@swardwise/domain';
import { browser, shots, signIn, tabTo, useBrowser } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

describe('what-if', () => {
  test('should show the head the season’s change for fields moved to another level, saving nothing', async () => {
    const page = await browser.newPage({ viewport: { width: 1366, height: 900 } });
    try {
      await signIn(page, 'head');
      await page.locator('[data-test="nav-what-if"]').click();
      await page.waitForURL((url) => url.pathname === '/what-if');
      const boxes = page.locator('[data-test^="what-if-field-"]');
      await boxes.first().waitFor();
      const levels = async () => new Map(((await (await page.request.get(`${baseUrl}/api/fields`)).json()) as FieldList).items.map((f) => [f.id, f.maintenanceLevel]));
      const levelsBefore = await levels();

      // Keyboard: to the first field's box, Space; the next box, Space.
      await tabTo(page, '[data-test^="what-if-field-"]');
      await page.keyboard.press('Space');
      await page.keyboard.press('Tab');
      await page.keyboard.press('Space');
      await page.locator('[data-test="what-if-chosen-count"]').filter({ hasText: /^2 of/ }).waitFor();
      const chosen = await Promise.all([0, 1].map(async (i) => Number((await boxes.nth(i).getAttribute('data-test'))!.replace('what-if-field-', ''))));

      await tabTo(page, '[data-test="what-if-target"]');
      await page.keyboard.press('Enter');
      await page.locator('.el-select-dropdown__item:visible').filter({ hasText: 'Level 4: Open space' }).click();
      const answered = page.waitForResponse((r) => r.url().endsWith('/api/what-if') && r.request().method() === 'POST');
      await tabTo(page, '[data-test="what-if-preview"]');
      await page.keyboard.press('Enter');
      const res = await answered;
      expect(res.status()).toBe(200);
      const sent = res.request().postDataJSON() as { moves: Array<{ fieldId: number; level: number }> };
      expect(sent.moves).toEqual(chosen.map((fieldId) => ({ fieldId, level: 4 })));
      const answer = (await res.json()) as WhatIfAnswer;
      await page.locator('[data-test="what-if-chart"] canvas').waitFor();
      const mowings = await page.locator('[data-test="what-if-row-mowings"] td').allInnerTexts();
      expect(mowings[0]).toBe(Math.round(answer.result.before.totals.mowings).toLocaleString('en-US'));
      expect(mowings[1]).toBe(Math.round(answer.result.after.totals.mowings).toLocaleString('en-US'));
      expect(await page.locator('[data-test="what-if-row-equipment"] td').first().innerText()).toMatch(/^[\d,]+(\.\d)? h$/);
      expect(await page.locator('[data-test="what-if-row-total"]').innerText()).toMatch(/Total cost/);
      await page.screenshot({ path: path.join(shots, 'what-if.png'), fullPage: true });
      await page.locator('[data-test="what-if-chart"]').screenshot({ path: path.join(shots, 'what-if-chart.png') });

      // Nothing saved: the fields keep their levels.
      expect(await levels()).toEqual(levelsBefore);
    } finally {
      await page.close();
    }
  });
});
