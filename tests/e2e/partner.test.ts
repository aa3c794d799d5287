/**
 * The athletic director's own view: My fields and a field's own page in plain words, on a
 * desktop and on a phone, with no cost, crew or internal note on either.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, inject, test } from 'vitest';
import { browser, checkA11y, PHONE, shots, signIn, useBrowser, withPage } from './browser.ts';

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
    await withPage({}, async (page) => {
      const id = await walk(page, 'desktop');
      await page.goto(`${baseUrl}/fields/${id}`);
      await page.waitForURL((url) => url.pathname === `/my-fields/${id}`);
      await page.locator('[data-test="partner-status"]').waitFor();
    });
  });

  test('should fit a phone', async () => {
    const context = await browser.newContext(PHONE);
    try {
      await walk(await context.newPage(), 'phone');
    } finally {
      await context.close();
    }
  });

  test('should give a partner a private calendar address, shown once, that a new one or Stop turns off', async () => {
    const page = await browser.newPage({ viewport: { width: 1366, height: 900 } });
    const status = (url: string) => page.evaluate(async (u) => (await fetch(new URL(u).pathname, { credentials: 'omit' })).status, url);
    try {
      await signIn(page, 'partner', '/my-fields');
      const card = page.locator('[data-test="calendar-feeds"]');
      await card.waitFor();
      const slot = card.locator('[data-test="calendar-feed-own"]');
      await slot.locator('[data-test="calendar-feed-make"]').click();
      const input = slot.locator('[data-test="calendar-feed-url"] input');
      await input.waitFor();
      const first = await input.inputValue();
      expect(first).toMatch(/\/api\/calendar\/[A-Za-z0-9_-]{43}\.ics$/);
      const ics = await page.evaluate(async (u) => (await fetch(new URL(u).pathname, { credentials: 'omit' })).text(), first);
      expect(ics).toContain('BEGIN:VCALENDAR');
      expect(ics).toContain('BEGIN:VTIMEZONE');
      await card.scrollIntoViewIfNeeded();
      await page.screenshot({ path: path.join(shots, 'partner-calendar-desktop.png') });
      // A new address stops the old one.
      await slot.locator('[data-test="calendar-feed-make"]').click();
      await page.locator('.el-message-box').getByRole('button', { name: 'Make a new address' }).click();
      await expect.poll(() => input.inputValue()).not.toBe(first);
      const second = await input.inputValue();
      expect(await status(first)).toBe(404);
      expect(await status(second)).toBe(200);
      await slot.locator('[data-test="calendar-feed-stop"]').click();
      await page.locator('.el-message-box').getByRole('button', { name: 'Stop it' }).click();
      await expect.poll(() => slot.locator('[data-test="calendar-feed-state"]').innerText()).toBe('No address yet');
      expect(await status(second)).toBe(404);
    } finally {
      await page.close();
    }
  });

  test('should give a foreman one calendar address per crew on the crews page, on a phone too', async () => {
    await withPage({ role: 'foreman', device: PHONE }, async (page) => {
      await page.goto(`${baseUrl}/crews`);
      const card = page.locator('[data-test="calendar-feeds"]');
      await card.waitFor();
      const slots = card.locator('[data-test^="calendar-feed-crew-"]');
      await slots.first().waitFor();
      expect(await slots.count()).toBeGreaterThan(0);
      await slots.first().locator('[data-test="calendar-feed-make"]').click();
      await slots.first().locator('[data-test="calendar-feed-url"] input').waitFor();
      await card.scrollIntoViewIfNeeded();
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
      await page.screenshot({ path: path.join(shots, 'foreman-calendar-phone.png') });
    });
  });

  for (const [name, options] of [
    ['desktop', { viewport: { width: 1366, height: 900 } }],
    ['phone', PHONE],
  ] as const) {
    test(`should list the partner’s request on the field’s page with its state and let them change it while requested (${name})`, async () => {
      await withPage({ role: 'partner', landing: '/my-fields', device: options }, async (page) => {
        const card = page.locator('[data-test="my-field"]').first();
        await card.waitFor();
        await card.locator('a').first().click();
        await page.waitForURL((url) => /^\/my-fields\/\d+$/.test(url.pathname));
        const fieldId = Number(new URL(page.url()).pathname.split('/').pop());
        const filed = await page.evaluate(async (id) => {
          const res = await fetch('/api/requests', { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ fieldId: id, kind: 'wet_area', description: 'Water stands by the north gate' }) });
          return (await res.json()).request as { id: number };
        }, fieldId);
        await page.reload();
        const row = page.locator('[data-type="request"]').filter({ has: page.locator(`[data-test="edit-request-${filed.id}"]`) });
        await row.waitFor();
        expect(await row.locator('[data-test="request-state"]').innerText()).toBe('Requested');
        await page.waitForLoadState('networkidle');
        await checkA11y(page);
        expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(page.viewportSize()!.width);
        await row.scrollIntoViewIfNeeded();
        await page.screenshot({ path: path.join(shots, `partner-field-request-${name}.png`) });

        await row.locator(`[data-test="edit-request-${filed.id}"]`).click();
        const dialog = page.locator('[data-test="request-dialog"]');
        await dialog.waitFor();
        await page.waitForLoadState('networkidle');
        await checkA11y(page);
        await page.screenshot({ path: path.join(shots, `partner-request-edit-${name}.png`) });
        const area = dialog.locator('textarea');
        await area.fill('Water stands by the north gate after every rain');
        await dialog.locator('[data-test="request-submit"]').click();
        await dialog.waitFor({ state: 'hidden' });
        await expect.poll(() => row.innerText()).toMatch(/Request · Wet area/);
        await expect.poll(() => page.locator('[data-type="request"]').allInnerTexts()).toEqual(expect.arrayContaining([expect.stringMatching(/after every rain/)]));
      });
    });
  }
});
