/**
 * What-if: the head chooses fields with the keyboard, a level to move them to, and reads the
 * season's change (table and chart) before anything is saved; saves it and a second scenario
 * and sets the two side by side.
 */
import path from 'node:path';
import { describe, expect, inject, test } from 'vitest';
import type { FieldList, WhatIfAnswer } from '@swardwise/domain';
import { shots, tabTo, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

describe('what-if', () => {
  test('should show the head the season’s change for fields moved to another level, saving nothing', async () => {
    await withPage({ role: 'head', nav: 'what-if' }, async (page) => {
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

      // Save it, then a Standards change as a second scenario, and compare the two.
      await page.locator('[data-test="what-if-name"]').fill('Two fields to open space');
      await page.locator('[data-test="what-if-save"]').click();
      await page.getByText('Scenario “Two fields to open space” saved.').waitFor();
      await page.locator('[data-test="what-if-target"]').click();
      await page.locator('.el-select-dropdown__item:visible').filter({ hasText: 'Keep their level' }).click();
      for (const [key, value] of [['minMowingsPerWeek', '5'], ['lineRepaintDays', '4']] as const) {
        await page.locator(`[data-test="what-if-std-${key}"] input`).fill(value);
        await page.keyboard.press('Tab');
      }
      const second = page.waitForResponse((r) => r.url().endsWith('/api/what-if') && r.request().method() === 'POST');
      await page.locator('[data-test="what-if-preview"]').click();
      expect((await second).request().postDataJSON()).toMatchObject({ moves: [], standards: { '1': { minMowingsPerWeek: 5, lineRepaintDays: 4 } } });
      await page.locator('[data-test="what-if-name"]').fill('Level 1 mowed and painted more');
      await page.locator('[data-test="what-if-save"]').click();
      await page.getByText('Scenario “Level 1 mowed and painted more” saved.').waitFor();
      const saved = page.locator('[data-test="what-if-saved"] tbody tr');
      await expect.poll(() => saved.count()).toBeGreaterThanOrEqual(2);
      const first = await saved.nth(0).innerText();
      expect(first, first).toContain('Level 1: least mowings per week: 5; repaint lines every: 4 days');
      expect(await saved.nth(1).innerText()).toContain('2 fields to level 4');
      for (const i of [0, 1]) await saved.nth(i).locator('input[type="checkbox"]').check();
      await page.locator('[data-test="what-if-compare-button"]').click();
      const compare = page.locator('[data-test="what-if-compare"]');
      await compare.locator('canvas').waitFor();
      const heads = await compare.locator('thead th').allInnerTexts();
      expect(heads.slice(1).map((h) => h.split('\n')[0])).toEqual(['Level 1 mowed and painted more', 'Two fields to open space']);
      expect(await compare.locator('tbody tr').first().innerText()).toMatch(/Mowings\s+\+[\d,]+\s+−[\d,]+/);
      await page.screenshot({ path: path.join(shots, 'what-if-compare.png'), fullPage: true });
      await compare.locator('[data-test="what-if-chart"]').screenshot({ path: path.join(shots, 'what-if-compare-chart.png') });
    });
  });
});
