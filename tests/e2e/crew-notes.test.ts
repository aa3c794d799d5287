/**
 * The crew's word reaches the office: a crew lead on a phone logs a job done with a note and a
 * photo, and logs a field check with the field-check form; the foreman, on a desktop, reads the
 * note and sees the photo on the order (week board) and in the field page's work history.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, inject, test } from 'vitest';
import { DEFAULT_TIME_ZONE, localToday, mondayOf } from '@swardwise/domain';
import { browser, fillFieldCheck, PHONE, reportDialog, shots, signIn, turfPhoto, useBrowser } from './browser.ts';

const baseUrl = inject('baseUrl');
const DESKTOP = { width: 1366, height: 1000 };
const NOTE = 'South goalmouth worn bare; left the gate chained';

useBrowser();

/** A POST from inside the signed-in page (same origin, its session). */
const post = (page: Page, url: string, body: unknown) =>
  page.evaluate(
    async ([u, b]) => {
      const res = await fetch(u, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(b) });
      return { status: res.status, body: await res.json() };
    },
    [url, body] as const,
  );

describe('a crew’s note and photo reach the foreman', () => {
  test('should show the note and photo logged on a phone on the order and the field page, and store a field check', async () => {
    const today = localToday(process.env.DEPARTMENT_TIME_ZONE || DEFAULT_TIME_ZONE);
    const context = await browser.newContext(PHONE);
    const phone = await context.newPage();
    const foreman = await browser.newPage({ viewport: DESKTOP });
    try {
      await signIn(phone, 'crew', '/today');
      const crewId = await phone.evaluate(async () => (await (await fetch('/api/auth/me')).json()).user.crewId as number);

      // The foreman gives the crew a mowing and a field check on an open field today.
      await signIn(foreman, 'foreman');
      const districtId = await foreman.evaluate(async () => (await (await fetch('/api/auth/me')).json()).user.districtId as number);
      const fields = await foreman.evaluate(async (d) => (await (await fetch(`/api/fields?districtId=${d}`)).json()).items as { id: number; name: string; status: string; sport: string }[], districtId);
      const field = fields.find((f) => f.status === 'open' && f.sport !== 'lawn')!;
      const mow = await post(foreman, '/api/work-orders', { fieldId: field.id, task: 'mow', plannedDate: today, crewId, plannedHours: 1 });
      const check = await post(foreman, '/api/work-orders', { fieldId: field.id, task: 'field_check', plannedDate: today, crewId, plannedHours: 0.5 });
      expect([mow.status, check.status]).toEqual([201, 201]);

      // On the phone: the mowing done with a note and a photo.
      await phone.reload();
      const job = phone.locator(`[data-test="job-card"][data-order-id="${mow.body.id}"]`);
      await job.waitFor();
      expect(await job.locator('[data-test="job-directions"]').getAttribute('href')).toMatch(/^geo:-?\d+\.\d+,-?\d+\.\d+/);
      await job.locator('[data-test="job-done"]').click();
      const dialog = reportDialog(phone);
      await dialog.waitFor();
      await dialog.locator('[data-test="report-hours"] input').fill('1.3');
      await dialog.locator('textarea').fill(NOTE);
      await dialog.locator('[data-test="report-photos"]').setInputFiles(await turfPhoto('goalmouth.jpg', 1200, 900));
      await dialog.locator('img[alt="goalmouth.jpg"]').waitFor();
      await dialog.locator('[data-test="report-submit"]').click();
      await job.and(phone.locator('[data-status="done"]')).waitFor();
      await phone.locator('[data-test="outbox-waiting"]').waitFor({ state: 'detached' });
      await job.locator('[data-test="job-reopen"]').waitFor();

      // The field check with the form.
      const checkJob = phone.locator(`[data-test="job-card"][data-order-id="${check.body.id}"]`);
      await checkJob.locator('[data-test="job-check"]').click();
      const form = phone.locator('[data-test="check-dialog"]');
      await form.locator('[data-test="field-check-form"]').waitFor();
      await fillFieldCheck(form, ['62', '70', '104']);
      await form.locator('[data-test="check-tips"]').click();
      await form.locator('[data-test="check-photos"]').setInputFiles(await turfPhoto('centre.jpg', 800, 600));
      expect(await phone.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
      // The phone's screen as the crew sees it: the top of the form, then the readings and ratings.
      await form.locator('[data-test="check-turf"]').scrollIntoViewIfNeeded();
      await phone.screenshot({ path: path.join(shots, 'today-phone-field-check.png') });
      await form.locator('[data-test="check-evenness"]').scrollIntoViewIfNeeded();
      await phone.screenshot({ path: path.join(shots, 'today-phone-field-check-readings.png') });
      await form.locator('[data-test="check-save"]').click();
      await form.locator('[data-test="check-result"]').waitFor();
      expect(await form.locator('[data-test="check-result"]').innerText()).toMatch(/Surface score \d+[\s\S]*check blade sharpness before suspecting disease[\s\S]*head injury/i);
      await phone.screenshot({ path: path.join(shots, 'today-phone-field-check-result.png') });

      const checks = await foreman.evaluate(async (f) => (await (await fetch(`/api/fields/${f}/checks`)).json()).items as { workOrderId: number; hardnessReadings: number[] }[], field.id);
      expect(checks[0]).toMatchObject({ workOrderId: check.body.id, hardnessReadings: [62, 70, 104] });
      const checkOrder = await foreman.evaluate(async (id) => (await (await fetch(`/api/work-orders/${id}`)).json()) as { photos: unknown[] }, check.body.id as number);
      expect(checkOrder.photos).toHaveLength(1);

      // On the desktop: the order on the week board carries the note and the photo.
      await foreman.goto(`${baseUrl}/week?week=${mondayOf(today)}`);
      await foreman.locator(`[data-test="order-card"][data-order-id="${mow.body.id}"]`).click();
      const order = foreman.locator('[data-test="order-dialog"]');
      await order.locator('[data-test="crew-note"]').filter({ hasText: NOTE }).waitFor();
      const photo = order.locator('[data-test="crew-photo"] img');
      await foreman.waitForFunction(() => (document.querySelector('[data-test="order-dialog"] [data-test="crew-photo"] img') as HTMLImageElement | null)?.naturalWidth === 1200);
      expect(await photo.getAttribute('alt')).toMatch(/Photo 1 of Mow/);
      await order.locator('[data-test="order-reopen"]').waitFor();
      await foreman.screenshot({ path: path.join(shots, 'order-dialog-crew-note.png') });

      // And the field page's work history, newest first.
      await foreman.goto(`${baseUrl}/fields/${field.id}`);
      const history = foreman.locator('[data-test="field-work-history"]');
      await history.locator('[data-test="crew-note"]').filter({ hasText: NOTE }).waitFor();
      await foreman.waitForFunction(() => Array.from(document.querySelectorAll<HTMLImageElement>('[data-test="field-work-history"] [data-test="crew-photo"] img')).some((i) => i.naturalWidth > 0));
      await foreman.locator('[data-test="field-checks"] [data-test="field-check-row"]').first().waitFor();
      await history.scrollIntoViewIfNeeded();
      await foreman.screenshot({ path: path.join(shots, 'field-page-work-history.png'), fullPage: true });
    } finally {
      await foreman.close();
      await context.close();
    }
  });
});
