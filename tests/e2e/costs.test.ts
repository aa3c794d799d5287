/**
 * The department head sets the costs and rates in his own units and finds the change in the
 * audit log in words; a foreman reads them but cannot change them.
 */
import path from 'node:path';
import { describe, expect, inject, test } from 'vitest';
import { shots, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

describe('costs and rates', () => {
  test('should let the head change the water price per 1,000 gallons and see it saved and audited', async () => {
    await withPage({ role: 'head', nav: 'costs' }, async (page) => {
      const water = page.locator('[data-test="costs-waterPricePerM3"] input');
      await water.waitFor();
      await page.screenshot({ path: path.join(shots, 'costs.png'), fullPage: true });
      // Keyboard only: into the field, type the new price, submit with Enter.
      await water.focus();
      await page.keyboard.press('ControlOrMeta+a');
      await page.keyboard.type('6.25');
      await page.keyboard.press('Enter');
      await page.getByText('Costs and rates saved').waitFor();

      const answer = (await (await page.request.get(`${baseUrl}/api/costs`)).json()) as { costs: { waterPricePerM3: number }; source: string };
      expect(answer.source).toBe('setting');
      // $6.25 per 1,000 US gal ÷ 3.785411784 m³ (1 US gal = 3.785411784 L, exact).
      expect(answer.costs.waterPricePerM3).toBeCloseTo(6.25 / 3.785411784, 5);

      await page.goto(`${baseUrl}/audit`);
      const row = page.locator('[data-test="row"]').filter({ hasText: 'Water price per m³' }).first();
      await row.waitFor();
      expect(await row.innerText()).toContain('1.65');
    });
  });

  test('should show a foreman the rates read-only', async () => {
    await withPage({ role: 'foreman' }, async (page) => {
      await page.locator('[data-test="nav-costs"]').click();
      await page.getByText('Read only: the department head sets costs and rates.').waitFor();
      expect(await page.locator('[data-test="costs-save"]').count()).toBe(0);
      expect(await page.locator('[data-test="costs-waterPricePerM3"] input').isDisabled()).toBe(true);
      await page.screenshot({ path: path.join(shots, 'costs-foreman.png'), fullPage: true });
    });
  });
});
