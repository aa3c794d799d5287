/**
 * A crew lead on a phone works through Today: logs a job done with a photo, and logs one
 * while the reports request keeps failing; the report waits on the phone, survives a reload
 * and reaches the server exactly once.
 */
import path from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { describe, expect, test } from 'vitest';
import { browser, PHONE, reportDialog, shots, signIn, turfPhoto, useBrowser } from './browser.ts';


useBrowser();

async function signInCrew(context: BrowserContext): Promise<Page> {
  const page = await context.newPage();
  await signIn(page, 'crew', '/today');
  await page.locator('[data-test="job-card"]').first().waitFor();
  return page;
}

interface OrderDetail {
  order: { id: number; status: string; actualHours: number | null; photoCount: number };
  updates: { status: string; note: string }[];
  photos: { id: number; width: number; height: number; url: string }[];
}
const detail = (page: Page, id: number) => page.evaluate(async (orderId) => (await (await fetch(`/api/work-orders/${orderId}`)).json()) as OrderDetail, id);

/** The first job still open (today's route first), by its order id. */
async function openJob(page: Page, skip: number[] = []): Promise<number> {
  const cards = page.locator('[data-test="job-card"]:not([data-status="done"])');
  const n = await cards.count();
  for (let i = 0; i < n; i++) {
    const id = Number(await cards.nth(i).getAttribute('data-order-id'));
    if (!skip.includes(id)) return id;
  }
  throw new Error('no open job on the page');
}
const card = (page: Page, id: number) => page.locator(`[data-test="job-card"][data-order-id="${id}"]`);

describe('Today on a phone', () => {
  test('should log a job done with a photo, and the API shows it done with the photo', async () => {
    const context = await browser.newContext(PHONE);
    try {
      const page = await signInCrew(context);
      expect(await page.locator('[data-test="today-cautions"]').innerText()).toMatch(/slopes[\s\S]*wet[\s\S]*Lightning/i);
      // Nothing of the page sticks out sideways on a 390 px screen.
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
      await page.screenshot({ path: path.join(shots, 'today-phone.png'), fullPage: true });

      const id = await openJob(page);
      await card(page, id).locator('[data-test="job-done"]').click();
      const dialog = reportDialog(page);
      await dialog.waitFor();
      const planned = await dialog.locator('[data-test="report-hours"] input').inputValue();
      expect(Number(planned)).toBeGreaterThan(0);
      await dialog.locator('[data-test="report-hours"] input').fill('1.75');
      await dialog.locator('textarea').fill('Striped north–south; clippings light');
      await dialog.locator('[data-test="report-photos"]').setInputFiles(await turfPhoto('stripes.png', 640, 480));
      await dialog.locator('img[alt="stripes.png"]').waitFor();
      // The preview is a blob: URL, which the page's content security policy must allow.
      await page.waitForFunction(() => (document.querySelector('img[alt="stripes.png"]') as HTMLImageElement | null)?.naturalWidth === 640);
      await page.screenshot({ path: path.join(shots, 'today-phone-done-dialog.png') });
      await dialog.locator('[data-test="report-submit"]').click();

      await card(page, id).and(page.locator('[data-status="done"]')).waitFor();
      await page.locator('[data-test="outbox-waiting"]').waitFor({ state: 'detached' });
      const sent = await detail(page, id);
      expect(sent.order).toMatchObject({ status: 'done', actualHours: 1.75, photoCount: 1 });
      expect(sent.updates).toEqual([expect.objectContaining({ status: 'done', note: 'Striped north–south; clippings light' })]);
      expect(sent.photos).toEqual([expect.objectContaining({ width: 640, height: 480 })]);
      const photo = await page.evaluate(async (url) => {
        const res = await fetch(url);
        return { status: res.status, type: res.headers.get('content-type'), bytes: (await res.arrayBuffer()).byteLength };
      }, sent.photos[0]!.url);
      expect(photo).toMatchObject({ status: 200, type: 'image/jpeg' });
      expect(photo.bytes).toBeGreaterThan(0);
      await page.screenshot({ path: path.join(shots, 'today-phone-after-done.png'), fullPage: true });
    } finally {
      await context.close();
    }
  });

  test('should keep a report while the connection fails, across a reload, and deliver it once', async () => {
    const context = await browser.newContext(PHONE);
    try {
      const page = await signInCrew(context);
      const id = await openJob(page);
      let tries = 0;
      // First no connection at all, then an answer lost on the way back: the server has it
      // but the phone does not know.
      await context.route('**/api/work-orders/*/reports', async (route) => {
        tries += 1;
        if (tries === 1) return route.abort('internetdisconnected');
        await route.fetch();
        return route.abort('connectionreset');
      });
      await card(page, id).locator('[data-test="job-skip"]').click();
      const dialog = reportDialog(page);
      await dialog.locator('[data-test="report-submit"]').click();
      // A skip needs its reason: nothing is queued without one.
      await dialog.getByText('say why the job was skipped').waitFor();
      await dialog.locator('textarea').fill('Standing water by the north goal');
      await dialog.locator('[data-test="report-submit"]').click();

      const banner = page.locator('[data-test="outbox-waiting"]');
      await banner.waitFor();
      expect(await banner.innerText()).toMatch(/1 report waiting to send/);
      expect(await card(page, id).getAttribute('data-status')).toBe('skipped');
      await page.screenshot({ path: path.join(shots, 'today-phone-waiting.png'), fullPage: true });

      // The page is reloaded (the phone closed the tab): the report is still there and tried again.
      await page.reload();
      await banner.waitFor();
      await expect.poll(() => tries, { timeout: 15_000 }).toBeGreaterThanOrEqual(2);
      await page.waitForFunction(() => !document.querySelector('[data-test="outbox-send"] .is-loading'));
      expect(await banner.innerText()).toMatch(/1 report waiting to send/);

      await context.unroute('**/api/work-orders/*/reports');
      await page.evaluate(() => window.dispatchEvent(new Event('online')));
      await banner.waitFor({ state: 'detached' });
      const got = await detail(page, id);
      expect(got.order.status).toBe('skipped');
      expect(got.updates.filter((u) => u.status === 'skipped')).toEqual([expect.objectContaining({ note: 'Standing water by the north goal' })]);
    } finally {
      await context.close();
    }
  });
});
