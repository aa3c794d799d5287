/**
 * The season budget: the head sets a line with the keyboard and sees it beside the outlook and
 * the actual to date, with the chart; a foreman reads his own district's, read-only.
 */
import path from 'node:path';
import { describe, expect, inject, test } from 'vitest';
import type { BudgetAnswer } from '@swardwise/domain';
import { shots, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

describe('season budget', () => {
  test('should let the head set the labour line and read it against the outlook, with the chart and exports', async () => {
    await withPage({ role: 'head', nav: 'budget' }, async (page) => {
      await page.locator('[data-test="budget-chart"] canvas').waitFor();
      const input = page.locator('[data-test="budget-input-labour"] input');
      await input.waitFor();
      // Keyboard only: into the field, type the budget, submit with Enter.
      await input.focus();
      await page.keyboard.press('ControlOrMeta+a');
      await page.keyboard.type('250000');
      await page.keyboard.press('Enter');
      await page.getByText('Labour budget saved.').waitFor();
      await page.locator('[data-test="budget-total"]').filter({ hasText: '$250,000' }).waitFor();
      await page.screenshot({ path: path.join(shots, 'budget.png'), fullPage: true });

      const season = Number((await page.locator('[data-test="budget-note"]').innerText()).match(/season (\d{4})/)![1]);
      const answer = (await (await page.request.get(`${baseUrl}/api/budget?season=${season}`)).json()) as BudgetAnswer;
      expect(answer.lines.find((l) => l.line === 'labour')!.budget).toBe(250000);
      expect(answer.lines.find((l) => l.line === 'labour')!.outlook.quantity).toBeGreaterThan(0);
      const csv = await page.request.get(`${baseUrl}${await page.locator('[data-test="budget-csv"]').getAttribute('href')}`);
      expect(csv.status()).toBe(200);
      expect(await csv.text()).toContain('labour,Labour,h,250000,USD');
    });
  });

  test('should show a foreman his district read-only', async () => {
    await withPage({ role: 'foreman' }, async (page) => {
      await page.locator('[data-test="nav-budget"]').click();
      await page.getByText('Read only: the department head sets the budget.').waitFor();
      await page.locator('[data-test="budget-row-labour"]').waitFor();
      expect(await page.locator('[data-test="budget-input-labour"]').count()).toBe(0);
      expect(await page.locator('[data-test="budget-district"]').count()).toBe(0);
      await page.screenshot({ path: path.join(shots, 'budget-foreman.png'), fullPage: true });
    });
  });
});
