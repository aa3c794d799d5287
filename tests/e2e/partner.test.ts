/**
 * The athletic director's own view: My fields and a field's own page in plain words, on a
 * desktop and on a phone, with no cost, crew or internal note on either.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, inject, test } from 'vitest';
import { browser, PHONE, shots, signIn, useBrowser } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

async function walk(page: Page, name: string) {
  await signIn(page, 'partner', '/my-fields');
  const card = page.locator('[data-test="my-field"]').first();
  await card.waitFor();
  await page.waitForLoadState('networkidle');
  const text = await card.innerText();
  expect(text).toMatch(/Next mowing/);
  expect(text).toMatch(/Next line painting/);
  expect(text).toMatch(/Open for play|restricted play|Closed to play/);
  expect(await page.locator('[data-test="partner-cautions"]').innerText()).toMatch(/30 minutes after the last thunder/);
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(page.viewportSize()!.width);
  await page.screenshot({ path: path.join(shots, `partner-my-fields-${name}.png`), fullPage: true });

  await card.locator('a').first().click();
  await page.waitForURL((url) => /^\/my-fields\/\d+$/.test(url.pathname));
  for (const part of ['partner-status', 'partner-check', 'partner-work', 'field-bookings', 'partner-cautions']) await page.locator(`[data-test="${part}"]`).waitFor();
  await page.waitForLoadState('networkidle');
  const body = await page.locator('main').innerText();
  expect(body).toMatch(/Can it be played\?/);
  expect(body).toMatch(/Bookings and requests/);
  expect(body).toMatch(/governing body/);
  // Nothing of the staff's page: no costs, hours, maintenance level or crews.
  for (const staff of ['$', 'Maintenance level', 'Crew', 'h per week', 'What this field needs']) expect(body, staff).not.toContain(staff);
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(page.viewportSize()!.width);
  await page.screenshot({ path: path.join(shots, `partner-field-${name}.png`), fullPage: true });
  return Number(new URL(page.url()).pathname.split('/').pop());
}

describe('the partner’s own view', () => {
  test('should show My fields and a field’s own page on a desktop, and send the staff address to the partner’s page', async () => {
    const page = await browser.newPage({ viewport: { width: 1366, height: 900 } });
    try {
      const id = await walk(page, 'desktop');
      await page.goto(`${baseUrl}/fields/${id}`);
      await page.waitForURL((url) => url.pathname === `/my-fields/${id}`);
      await page.locator('[data-test="partner-status"]').waitFor();
    } finally {
      await page.close();
    }
  });

  test('should fit a phone', async () => {
    const context = await browser.newContext(PHONE);
    try {
      await walk(await context.newPage(), 'phone');
    } finally {
      await context.close();
    }
  });
});
