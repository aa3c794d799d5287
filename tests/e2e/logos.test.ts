/**
 * A foreman opens a field's logos from its page, uploads an SVG, places, scales and turns it
 * with the keyboard, saves, reads the grid and the paint, and downloads the set-out sheet.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, inject, test } from 'vitest';
import { browser, PHONE, shots, signIn, useBrowser } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

/** The native input of an Element Plus input, whether its data-test sits on the input or on its wrapper. */
const inputOf = (page: Page, test: string) => page.locator(`input[data-test="${test}"], [data-test="${test}"] input`).first();

const LOGO_SVG = `<svg xmlns="http://www.w3.org/2000/svg" width="200" height="100" viewBox="0 0 200 100">
  <rect width="100" height="100" fill="#c81010"/><rect x="100" width="100" height="100" fill="#ffffff"/><circle cx="150" cy="50" r="40" fill="#1030c0"/>
  <script>document.title = 'pwned'</script>
</svg>`;

describe('field logos', () => {
  test('should let a foreman place a logo on a field and download its set-out sheet', async () => {
    const context = await browser.newContext({ viewport: { width: 1400, height: 1000 }, acceptDownloads: true });
    const page = await context.newPage();
    try {
      await signIn(page, 'foreman');
      const fields = await page.evaluate(async () => (await (await fetch('/api/fields')).json()).items as { id: number; sport: string; name: string }[]);
      const field = fields.find((f) => f.sport === 'soccer') ?? fields[0]!;
      await page.goto(`${baseUrl}/fields/${field.id}`);
      await page.locator('[data-test="field-logos-link"]').click();
      await page.waitForURL(`**/fields/${field.id}/logos`);
      await page.locator('[data-test="logo-upload"]').waitFor();

      const file = path.join(shots, '..', 'e2e-logo.svg');
      fs.mkdirSync(path.dirname(file), { recursive: true });
      fs.writeFileSync(file, LOGO_SVG);
      await inputOf(page, 'logo-name').fill('Harbor crest');
      await page.locator('[data-test="logo-file"]').setInputFiles(file);
      await page.locator('[data-test="logo-send"]').click();
      await page.locator('[data-test="logo-place"]').waitFor();
      await page.locator('[data-test="logo-plan"] image').first().waitFor();

      // Keyboard placement: type into the number inputs, Tab between them.
      const typeInto = async (test: string, value: string) => {
        const input = inputOf(page, test);
        await input.focus();
        await page.keyboard.press('Control+A');
        await page.keyboard.type(value);
        await page.keyboard.press('Tab');
      };
      await typeInto('logo-x', '30');
      await typeInto('logo-y', '20');
      await typeInto('logo-width', '8');
      await typeInto('logo-rotation', '30');
      await typeInto('logo-grid', '0.5');
      await page.locator('[data-test="logo-save"]').focus();
      await page.keyboard.press('Enter');
      await expect.poll(async () => page.locator('[data-test="logo-reference"]').innerText()).toMatch(/strings every 0\.5 m/);
      // 8 × 4 m turned 30°: the box starts at 30 − (8 cos 30° + 4 sin 30°) ÷ 2 = 25.54 m.
      expect(await page.locator('[data-test="logo-reference"]').innerText()).toMatch(/25\.54 m from the end line/);
      const rows = await page.locator('[data-test="logo-paint"] tbody tr').allInnerTexts();
      expect(rows.some((r) => /White base coat under colours/.test(r))).toBe(true);
      expect(rows.filter((r) => /dark pigment/.test(r))).toHaveLength(2);
      expect(await page.locator('[data-test="logo-caution"]').innerText()).toMatch(/Dark pigments/);
      expect(await page.title()).not.toBe('pwned');
      await page.screenshot({ path: path.join(shots, 'logos-desktop.png'), fullPage: true });

      const [download] = await Promise.all([page.waitForEvent('download'), page.locator('[data-test="logo-pdf"]').click()]);
      const pdf = path.join(shots, '..', 'e2e-logo-grid.pdf');
      await download.saveAs(pdf);
      expect(fs.readFileSync(pdf).subarray(0, 5).toString()).toBe('%PDF-');
      execFileSync('pdftoppm', ['-png', '-r', '60', '-singlefile', pdf, path.join(shots, 'logos-grid-pdf')]);
      expect(fs.statSync(path.join(shots, 'logos-grid-pdf.png')).size).toBeGreaterThan(10_000);
      expect(execFileSync('pdftotext', [pdf, '-']).toString()).toMatch(/Harbor crest[\s\S]*Reference corner R/);
    } finally {
      await context.close();
    }
  });

  test('should show a field’s logos to a foreman on a phone', async () => {
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    try {
      await signIn(page, 'foreman');
      const fields = await page.evaluate(async () => (await (await fetch('/api/fields')).json()).items as { id: number; sport: string }[]);
      const field = fields.find((f) => f.sport === 'soccer') ?? fields[0]!;
      await page.goto(`${baseUrl}/fields/${field.id}/logos`);
      await page.locator('[data-test="logo-upload"]').waitFor();
      await page.locator('[data-test="logo-plan"], [data-test="logos-empty"]').first().waitFor();
      await page.screenshot({ path: path.join(shots, 'logos-phone.png'), fullPage: true });
    } finally {
      await context.close();
    }
  });
});
