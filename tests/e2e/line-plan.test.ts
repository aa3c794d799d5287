/**
 * A foreman lays out a soccer field with a youth layout across it on the field's line plan
 * page, saves it, reads the set-out sheet and downloads its PDF; a crew lead reads the plan
 * on a phone without being offered to change it.
 */
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { describe, expect, inject, test } from 'vitest';
import { browser, download, PHONE, shots, signIn, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

describe('line plan page', () => {
  test('should lay out a soccer field with a 7v7 layout across it and download the set-out PDF', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 900 }, acceptDownloads: true });
    let fieldId = 0;
    try {
      await signIn(page, 'foreman');
      const fields = await page.evaluate(async () => (await (await fetch('/api/fields')).json()).items as { id: number; sport: string; name: string }[]);
      const soccer = fields.filter((f) => f.sport === 'soccer');
      expect(soccer.length, 'a soccer field in the foreman’s district').toBeGreaterThan(0);
      fieldId = soccer[soccer.length - 1]!.id;

      await page.goto(`${baseUrl}/fields/${fieldId}`);
      await page.locator('[data-test="field-line-plan"]').click();
      await page.waitForURL(`**/fields/${fieldId}/lines`);
      await page.locator('[data-test="lines-layouts"]').waitFor();
      // Start from an empty plan whatever an earlier run left.
      while ((await page.locator('[data-test="lines-remove-0"]').count()) > 0) await page.locator('[data-test="lines-remove-0"]').click();

      await page.locator('[data-test="lines-add"]').click();
      await page.getByRole('option', { name: 'Soccer, full size (105 × 68 m)' }).click();
      // Out of the IFAB range: refused with the range shown, nothing to save.
      await page.locator('[data-test="lines-length-0"] input').fill('125');
      await page.locator('[data-test="lines-length-0"] input').press('Tab');
      await expect.poll(() => page.locator('[data-test="lines-problem-0"]').innerText()).toMatch(/between 90 and 120 m \(IFAB Laws of the Game, Law 1\)/);
      expect(await page.locator('[data-test="lines-save"]').isDisabled()).toBe(true);
      await page.locator('[data-test="lines-length-0"] input').fill('100');
      await page.locator('[data-test="lines-length-0"] input').press('Tab');
      await expect.poll(() => page.locator('[data-test="lines-problem-0"]').count()).toBe(0);

      await page.locator('[data-test="lines-add"]').click();
      await page.getByRole('option', { name: 'Soccer 7v7' }).click();
      await page.locator('[data-test="lines-turn-1"]').click();
      await page.getByRole('option', { name: '90°' }).click();
      await page.locator('[data-test="lines-along-1"] input').fill('-22');
      await page.locator('[data-test="lines-along-1"] input').press('Tab');
      await page.locator('[data-test="lines-shift-along"] input').fill('2');
      await page.locator('[data-test="lines-shift-along"] input').press('Tab');

      await page.locator('[data-test="lines-drawn-1"]').waitFor();
      expect(await page.locator('[data-test="lines-plan"] desc').textContent()).toMatch(/drawn to scale.*Soccer 100 × 68 m.*Soccer 7v7/);
      expect(await page.locator('[data-test="lines-total"]').innerText()).toMatch(/All layouts, one painting/);
      const setOut = page.locator('[data-test="lines-setout-0"]');
      expect(await setOut.innerText()).toMatch(/Corner A \(reference\)\s+0\.00\s+0\.00/);
      expect(await page.locator('[data-test="lines-setout"]').innerText()).toMatch(/Diagonal A–C: Corner A \(reference\) to Corner C = 120\.93 m/); // √(100² + 68²) = 120.929

      const saved = page.waitForResponse((r) => r.url().endsWith(`/api/fields/${fieldId}/lines`) && r.request().method() === 'PATCH');
      await page.locator('[data-test="lines-save"]').click();
      expect((await saved).status()).toBe(200);
      await expect.poll(() => page.locator('[data-test="lines-saved"]').innerText()).toMatch(/^Saved/);
      await page.screenshot({ path: path.join(shots, 'line-plan-desktop.png'), fullPage: true });
      await page.locator('[data-test="lines-plan"]').screenshot({ path: path.join(shots, 'line-plan-view.png') });

      const file = await download(page, '[data-test="lines-pdf"]', 'line-plan-set-out.pdf');
      const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
      expect(text).toMatch(/Set-out sheet/);
      expect(text).toMatch(/Soccer 7v7/);
      expect(text).toMatch(/Season shift: 2\.0 m along/);
      execFileSync('pdftoppm', ['-png', '-r', '60', '-f', '1', '-l', '1', file, path.join(shots, 'line-plan-set-out')]);
    } finally {
      await page.close();
    }

    // The crew lead reads the plan of a field of his crew's scope (another field may be denied, as the abilities say).
    await withPage({ role: 'crew', device: { ...PHONE } }, async (phone) => {
      const readable = await phone.evaluate(async () => (await (await fetch('/api/fields')).json()).items as { id: number }[]);
      expect(readable.length, 'a field the crew lead reads').toBeGreaterThan(0);
      const crewField = readable[0]!.id;
      const foreman = await browser.newPage();
      try {
        await signIn(foreman, 'foreman');
        const status = await foreman.evaluate(async (id) => {
          const plan = (await (await fetch(`/api/fields/${id}/lines`)).json()).linePlan;
          const body = { layouts: [{ layout: 'soccer_7v7', lengthM: 55, widthM: 36, colour: '#ffffff', alongM: 0, acrossM: 0, rotationDeg: 0 }], paint: plan.paint, markerId: null, seasonStart: plan.seasonStart, seasonEnd: plan.seasonEnd, shifts: plan.shifts, version: plan.version };
          return (await fetch(`/api/fields/${id}/lines`, { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) })).status;
        }, crewField);
        expect(status).toBe(200);
      } finally {
        await foreman.close();
      }
      await phone.goto(`${baseUrl}/fields/${crewField}/lines`);
      await phone.locator('[data-test="lines-setout"]').waitFor();
      expect(await phone.locator('[data-test="lines-save"]').count()).toBe(0);
      expect(await phone.locator('[data-test="lines-remove-0"]').count()).toBe(0);
      await phone.screenshot({ path: path.join(shots, 'line-plan-phone.png') });
      // Saving is refused to a crew lead on the server too.
      expect(await phone.evaluate(async (id) => (await fetch(`/api/fields/${id}/lines`, { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: '{}' })).status, crewField)).toBe(403);
    });
  });
});
