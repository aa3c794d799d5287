/**
 * A foreman logs a field check straight from the field page on a phone: the dialog fills the
 * screen, the check is scored, and the page's chart, photos by date and history show it. The
 * same page on a desktop is screenshotted with its growth calibration and cautions.
 */
import path from 'node:path';
import { describe, expect, inject, test } from 'vitest';
import { browser, checkA11y, fillFieldCheck, PHONE, shots, signIn, turfPhoto, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

describe('field checks on the field page', () => {
  test('should let a foreman log a check with a photo at 390 × 844 and show it in the chart, the photos and the history', async () => {
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    try {
      await signIn(page, 'foreman');
      const districtId = await page.evaluate(async () => (await (await fetch('/api/auth/me')).json()).user.districtId as number);
      const fields = await page.evaluate(async (d) => (await (await fetch(`/api/fields?districtId=${d}`)).json()).items as { id: number; status: string; sport: string }[], districtId);
      const field = fields.find((f) => f.status === 'open' && f.sport !== 'lawn')!;
      const before = await page.evaluate(async (id) => (await (await fetch(`/api/fields/${id}/checks`)).json()).items.length as number, field.id);

      await page.goto(`${baseUrl}/fields/${field.id}`);
      const card = page.locator('[data-test="field-checks"]');
      await card.locator('[data-test="log-field-check"]').click();
      const dialog = page.locator('[data-test="staff-check-dialog"]');
      await dialog.locator('[data-test="field-check-form"]').waitFor();
      // Full-screen on a phone: the dialog is as wide as the screen.
      const box = await dialog.boundingBox();
      expect(Math.round(box!.width)).toBe(390);
      await fillFieldCheck(dialog, ['62', '70', '112']);
      await dialog.locator('[data-test="staff-check-photos"]').setInputFiles(await turfPhoto('north-goalmouth.jpg', 800, 600));
      await dialog.getByText('north-goalmouth.jpg').waitFor();
      await checkA11y(page);
      await page.screenshot({ path: path.join(shots, 'field-check-staff-phone-form.png') });
      await dialog.locator('[data-test="staff-check-save"]').click();
      const result = dialog.locator('[data-test="staff-check-result"]');
      await result.waitFor();
      expect(await result.innerText()).toMatch(/Surface score \d+ of 100[\s\S]*consider closing the field[\s\S]*governing body decide/i);
      await page.screenshot({ path: path.join(shots, 'field-check-staff-phone-result.png') });
      await dialog.getByRole('button', { name: 'Close', exact: true }).click();

      // The history has one more check, with its flags in words and its photo.
      await expect.poll(async () => card.locator('[data-test="field-check-row"]').count(), { timeout: 20_000 }).toBe(Math.min(before + 1, 20));
      const latest = card.locator('[data-test="field-check-row"]').first();
      expect(await latest.innerText()).toMatch(/score \d+[\s\S]*height 3 (in|mm)[\s\S]*62, 70, 112 G[\s\S]*Hardness above the tester’s limit: consider closing the field/);
      await card.locator('[data-test="check-photos-by-date"] img').first().waitFor();
      const photo = card.locator('[data-test="check-photos-by-date"] img').last();
      await photo.scrollIntoViewIfNeeded();
      await expect.poll(() => photo.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0), { timeout: 15_000 }).toBe(true);
      expect(await card.locator('[data-test="score-chart-summary"]').innerText()).toMatch(/latest \d+ on [A-Z][a-z]{2} \d+, \d{4}, against the level's target of \d+/);
      await card.locator('[data-test="score-chart"] canvas').first().waitFor();
      await card.locator('[data-test="hardness-caution"]').waitFor();
      expect(await card.locator('[data-test="hardness-caution-link"]').getAttribute('href')).toBe('#field-closures');
      await card.scrollIntoViewIfNeeded();
      await card.locator('[data-test="score-chart"]').scrollIntoViewIfNeeded();
      await page.screenshot({ path: path.join(shots, 'field-check-history-phone.png') });
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);

      // Desktop: the same page with the chart, photos, history and the growth calibration.
      await withPage({ role: 'foreman', device: { viewport: { width: 1400, height: 900 } } }, async (desktop) => {
        await desktop.goto(`${baseUrl}/fields/${field.id}`);
        await desktop.locator('[data-test="field-checks"] [data-test="score-chart"] canvas').first().waitFor();
        await desktop.locator('[data-test="growth-calibration"] p').first().waitFor();
        expect(await desktop.locator('[data-test="growth-calibration"]').innerText()).toMatch(/mowing prediction still uses the default rate/);
        await desktop.locator('[data-test="field-checks"]').screenshot({ path: path.join(shots, 'field-check-history-desktop.png') });
        await desktop.locator('[data-test="growth-calibration"]').screenshot({ path: path.join(shots, 'field-growth-calibration-desktop.png') });
      });
    } finally {
      await context.close();
    }
  });
});
