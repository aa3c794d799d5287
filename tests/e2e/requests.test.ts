/**
 * A partner on a phone files a game-day request with the keyboard alone (and a photo); the
 * district foreman finds it from his landing page and turns it into work; the partner sees it
 * scheduled.
 */
import path from 'node:path';
import { describe, expect, inject, test } from 'vitest';
import { addDaysIso, localToday } from '@swardwise/domain';
import { checkA11y, openDialogByKeyboard, PHONE, pickOption, shots, tabTo, turfPhoto, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

// The steps run in order, each its own test: the request the partner files is the one the foreman schedules.
describe('requests', () => {
  let requestId = 0;

  test('should let a partner file a game request from a phone with the keyboard, with a photo', async () => {
    await withPage({ role: 'partner', keyboard: true, device: PHONE }, async (page) => {
      const timeZone = await page.evaluate(async () => (await (await fetch('/api/auth/me')).json()).timeZone as string);
      const gameOn = addDaysIso(localToday(timeZone), 9);
      await page.goto(`${baseUrl}/requests`);
      const dialog = await openDialogByKeyboard(page, '[data-test="new-request"]', '[data-test="request-dialog"]');
      // The dialog as it opens, before a picker's panel is open over it (the panel is Element Plus's unnamed popup).
      await checkA11y(page);
      await tabTo(page, '[data-test="request-field"]');
      await pickOption(page, 'Stadium field · Kestrel Hill High School');
      await tabTo(page, '[data-test="request-date"]');
      await page.keyboard.type(gameOn);
      await page.keyboard.press('Enter');
      // A football field has one layout: it is chosen already.
      await expect.poll(() => dialog.locator('[data-test="request-layout"]').innerText()).toMatch(/American football/);
      await tabTo(page, '[data-test="request-description"]');
      await page.keyboard.type('Homecoming game, varsity; please freshen the numbers');
      await dialog.locator('[data-test="request-photos"]').setInputFiles(await turfPhoto('end-zone.jpg', 800, 600));
      await checkA11y(page);
      await page.screenshot({ path: path.join(shots, 'request-new-phone.png') });
      await tabTo(page, '[data-test="request-submit"]');
      await page.keyboard.press('Enter');
      await dialog.waitFor({ state: 'hidden' });
      const drawer = page.locator('[data-test="request-detail"]');
      await drawer.waitFor();
      await expect.poll(() => drawer.locator('[data-test="request-state"]').innerText()).toBe('Requested');
      await expect.poll(() => drawer.locator('img').count()).toBe(1);
      requestId = Number(new URL(page.url()).searchParams.get('open'));
      expect(requestId).toBeGreaterThan(0);
      await page.screenshot({ path: path.join(shots, 'request-filed-phone.png') });
    });
  });

  test('should let the foreman find it from his district page, answer it and turn it into a booking', async () => {
    expect(requestId, 'the request filed before').toBeGreaterThan(0);
    await withPage({ role: 'foreman', landing: '/district', device: { viewport: { width: 1400, height: 900 } } }, async (desk) => {
      const link = desk.locator('[data-test="open-requests"]');
      // The count shows 0 until the list has loaded, which on a busy machine takes more than the poll's default second.
      await expect.poll(async () => Number(await link.locator('[data-test="open-requests-count"]').innerText()), { timeout: 20_000 }).toBeGreaterThan(0);
      await link.click();
      await desk.waitForURL((url) => url.pathname === '/requests');
      await desk.locator(`[data-test="open-request-${requestId}"]`).click();
      const drawer = desk.locator('[data-test="request-detail"]');
      await drawer.waitFor();
      await expect.poll(() => drawer.innerText()).toMatch(/Homecoming game/);
      await desk.screenshot({ path: path.join(shots, 'request-foreman-desktop.png') });
      await drawer.locator('[data-test="request-message"] textarea, textarea[data-test="request-message"]').first().fill('We will paint on the last working day before the game.');
      await drawer.locator('[data-test="request-send"]').click();
      await expect.poll(() => drawer.locator('[data-test="request-thread"]').innerText().catch(() => '')).toMatch(/last working day/);
      await drawer.locator('[data-test="request-schedule"]').click();
      const dialog = desk.locator('[data-test="decision-dialog"]');
      await dialog.waitFor();
      expect(await dialog.locator('[data-test="decision-game"]').innerText()).toMatch(/booked on Stadium field/);
      await checkA11y(desk);
      await desk.locator('[data-test="decision-submit"]').click();
      await dialog.waitFor({ state: 'hidden' });
      await expect.poll(() => drawer.locator('[data-test="request-state"]').innerText()).toBe('Scheduled');
      await desk.screenshot({ path: path.join(shots, 'request-scheduled-desktop.png') });
      const booked = await desk.evaluate(async (id) => (await (await fetch(`/api/requests/${id}`)).json()).request.eventId as number | null, requestId);
      expect(booked).not.toBeNull();
    });
  });

  test('should show the partner the request scheduled, with the foreman’s answer', async () => {
    expect(requestId, 'the request scheduled before').toBeGreaterThan(0);
    await withPage({ role: 'partner', device: PHONE }, async (page) => {
      await page.goto(`${baseUrl}/requests`);
      const row = page.locator('[data-test="request-state"]').first();
      await row.waitFor();
      await page.screenshot({ path: path.join(shots, 'requests-list-phone.png'), fullPage: true });
      await page.goto(`${baseUrl}/requests?open=${requestId}`);
      const drawer = page.locator('[data-test="request-detail"]');
      await drawer.waitFor();
      await expect.poll(() => drawer.locator('[data-test="request-state"]').innerText()).toBe('Scheduled');
      await expect.poll(() => drawer.innerText()).toMatch(/last working day before the game/);
      await page.screenshot({ path: path.join(shots, 'request-scheduled-phone.png'), fullPage: true });
    });
  });
});
