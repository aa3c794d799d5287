/**
 * A foreman keeps his crews, equipment, weather and bookings: he adds a crew and finds it in
 * the table, checks a station file with one bad row (shown, nothing saved), sees his
 * equipment by kind and a field's coming bookings.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, describe, expect, inject, test } from 'vitest';
import { browser, DESKTOP, followNav, shots, signIn, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'swardwise-pages-'));

useBrowser();
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));

/** Waits for running CSS animations (a dialog opening) to end, so a screenshot shows the settled page. */
async function settled(page: Page) {
  await page.evaluate(() => Promise.all(document.getAnimations().map((a) => a.finished.catch(() => undefined))));
}

describe('crews, equipment, weather and bookings pages', () => {
  test('should let a foreman add a crew and find it in the crews table', async () => {
    await withPage({ role: 'foreman', nav: 'crews' }, async (page) => {
      await page.locator('[data-test="row"]').first().waitFor();
      const before = await page.locator('[data-test="row"]').count();

      await page.locator('[data-test="new-crew"]').click();
      const dialog = page.locator('[data-test="crew-dialog"]');
      await dialog.waitFor();
      // Element Plus puts a field's attributes on its input or on its wrapper, depending on the control.
      const field = (key: string) => dialog.locator(`[data-test="${key}"] input, input[data-test="${key}"]`).first();
      await field('crew-name').fill('Ridge Crew Q');
      await field('crew-hours').fill('9');
      await dialog.locator('[data-test="crew-day-fri"]').click();
      await dialog.locator('[data-test="crew-day-sat"]').click();
      const members = field('crew-members');
      for (const name of ['T. Bracken', 'U. Sorrel']) {
        await members.fill(name);
        await members.press('Enter');
      }
      await settled(page);
      await page.screenshot({ path: path.join(shots, 'crews-dialog.png') });
      await dialog.locator('[data-test="crew-submit"]').click();
      await dialog.waitFor({ state: 'hidden' });

      const row = page.locator('[data-test="row"]', { hasText: 'Ridge Crew Q' });
      await row.waitFor();
      expect(await page.locator('[data-test="row"]').count()).toBe(before + 1);
      const text = await row.innerText();
      expect(text).toContain('North Ridge');
      expect(text).toContain('T. Bracken, U. Sorrel');
      expect(text).toContain('9:00 h');
      expect(text).toContain('Mon–Thu, Sat');
      await page.screenshot({ path: path.join(shots, 'crews.png'), fullPage: true });
    });
  });

  test('should show the head crews and equipment read-only', async () => {
    const context = await browser.newContext(DESKTOP);
    const page = await context.newPage();
    try {
      await signIn(page, 'head');
      await page.locator('[data-test="nav-crews"]').click();
      await page.locator('[data-test="row"]').first().waitFor();
      expect(await page.locator('[data-test="new-crew"]').count()).toBe(0);
      expect(await page.locator('[data-test^="edit-crew-"], [data-test^="delete-crew-"]').count()).toBe(0);
      // Every district's crews.
      const districts = await page.locator('[data-test="row"] td:nth-child(2)').allInnerTexts();
      expect(new Set(districts).size).toBe(3);
      await page.screenshot({ path: path.join(shots, 'crews-head.png'), fullPage: true });
      await page.locator('[data-test="nav-weather"]').click();
      await page.locator('[data-test="weather-strip"]').waitFor();
      expect(await page.locator('[data-test="weather-upload"]').count()).toBe(0);
    } finally {
      await context.close();
    }
  });

  test('should show a station file’s bad row with its error and not let it be saved', async () => {
    await withPage({ role: 'foreman', nav: 'weather' }, async (page) => {
      await page.locator('[data-test="weather-strip"]').waitFor();
      await page.screenshot({ path: path.join(shots, 'weather.png'), fullPage: true });

      const file = path.join(work, 'station.csv');
      fs.writeFileSync(
        file,
        ['date,tmax_c,tmin_c,rh_max_pct,rh_min_pct,wind_ms,sunshine_h,solar_mj,rain_mm', '2026-11-20,14.5,4.1,93,52,2.8,6.5,,0', '2026-11-21,warm,5.0,,,,,,1.2', '2026-11-22,12.0,3.2,,,,,,4.4', ''].join('\n'),
      );
      await page.setInputFiles('[data-test="weather-file"]', file);
      await page.locator('[data-test="weather-row-bad"]').waitFor();
      expect(await page.locator('[data-test="weather-row-bad"]').count()).toBe(1);
      const bad = await page.locator('[data-test="weather-row-bad"]').innerText();
      expect(bad).toContain('3');
      expect(bad).toContain('tmax_c');
      expect(bad).toContain('not a number');
      expect(await page.locator('[data-test="weather-row-ok"]').count()).toBe(2);
      expect(await page.locator('[data-test="weather-upload-summary"]').innerText()).toContain('1 with errors');
      expect(await page.locator('[data-test="weather-commit"]').isDisabled()).toBe(true);
      await page.locator('[data-test="weather-upload"]').screenshot({ path: path.join(shots, 'weather-upload-errors.png') });
      await page.screenshot({ path: path.join(shots, 'weather-with-preview.png'), fullPage: true });
    });
  });

  test('should list equipment by kind with blade care, and a field’s coming bookings', async () => {
    await withPage({ role: 'foreman' }, async (page) => {
      const { districtId, crewId } = await page.evaluate(async () => {
        const crews = (await (await fetch('/api/crews')).json()).items as { id: number; districtId: number }[];
        return { districtId: crews[0]!.districtId, crewId: crews[0]!.id };
      });
      const post = (body: object) =>
        page.evaluate(async (b) => (await fetch('/api/equipment', { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(b) })).status, body);
      expect(
        await post({ districtId, crewId, kind: 'rotary_mower', name: 'Rotary 72 (R-4)', cuttingWidthM: 1.83, speedKmh: 8, fieldEfficiency: 0.8, hocMinMm: 25, hocMaxMm: 115, hourMeterH: 412, sharpenIntervalH: 25, lastSharpenedAtH: 380 }),
      ).toBe(201);
      expect(await post({ districtId, kind: 'reel_mower', name: 'Reel 5-gang (R-1)', cuttingWidthM: 3.4, speedKmh: 7, fieldEfficiency: 0.75, hocMinMm: 10, hocMaxMm: 38, hourMeterH: 96, sharpenIntervalH: 50, lastSharpenedAtH: 80 })).toBe(201);
      expect(await post({ districtId, kind: 'line_marker', name: 'Line marker (M-2)', hourMeterH: 40 })).toBe(201);

      await followNav(page, 'equipment');
      await page.locator('[data-test="row"]', { hasText: 'Rotary 72' }).waitFor();
      const kinds = await page.locator('[data-test="row"]').evaluateAll((rows) => rows.map((r) => (r as HTMLElement).innerText.split('\t')[0]!.trim()));
      expect(kinds).toEqual([...kinds].sort());
      expect(await page.locator('[data-test="row"]', { hasText: 'Rotary 72' }).innerText()).toContain('Sharpen now');
      await page.screenshot({ path: path.join(shots, 'equipment.png'), fullPage: true });
      await page.locator('[data-test="row"]', { hasText: 'Line marker (M-2)' }).locator('[data-test^="edit-equipment-"]').click();
      await page.locator('[data-test="equipment-dialog"]').waitFor();
      expect(await page.locator('[data-test="mower-fields"]').count()).toBe(0);
      await page.locator('[data-test="equipment-dialog"]').getByRole('button', { name: 'Cancel' }).click();
      await page.locator('[data-test="row"]', { hasText: 'Rotary 72' }).locator('[data-test^="edit-equipment-"]').click();
      await page.locator('[data-test="mower-fields"]').waitFor();
      await settled(page);
      await page.screenshot({ path: path.join(shots, 'equipment-dialog.png') });

      // Out of season the demo books nothing for weeks: the foreman books a game a week ahead on one of his fields.
      const fieldId = await page.evaluate(async () => {
        const fieldsAnswer = await (await fetch('/api/fields')).json();
        const field = (fieldsAnswer.items as { id: number }[])[0]!;
        const on = new Date(Date.now() + 7 * 86_400_000);
        const startsOn = `${on.getFullYear()}-${String(on.getMonth() + 1).padStart(2, '0')}-${String(on.getDate()).padStart(2, '0')}`;
        const res = await fetch('/api/field-events', {
          method: 'POST',
          headers: { Accept: 'application/json', 'Content-Type': 'application/json' },
          body: JSON.stringify({ fieldId: field.id, kind: 'game', title: 'Winter friendly', startsOn }),
        });
        if (res.status !== 201) throw new Error(`booking refused: ${res.status} ${await res.text()}`);
        return field.id;
      });
      await page.goto(`${baseUrl}/fields/${fieldId}`);
      await page.locator('[data-test="booking"]').first().waitFor();
      expect(await page.locator('[data-test="new-booking"]').count()).toBe(1);
      await page.screenshot({ path: path.join(shots, 'field-bookings.png'), fullPage: true });
    });
  });

  test('should let a partner book a game on his school’s field from a phone', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    try {
      await signIn(page, 'partner');
      const fieldId = await page.evaluate(async () => ((await (await fetch('/api/fields')).json()).items as { id: number }[])[0]!.id);
      await page.goto(`${baseUrl}/fields/${fieldId}`);
      await page.locator('[data-test="field-bookings"]').waitFor();
      // Count only once the card has its bookings (they load after the card appears).
      await page.waitForLoadState('networkidle');
      const before = await page.locator('[data-test="booking"]').count();
      await page.locator('[data-test="new-booking"]').click();
      const dialog = page.locator('[data-test="booking-dialog"]');
      await dialog.waitFor();
      // The dialog fits the phone's screen: nothing to scroll sideways to reach its fields or buttons.
      expect((await dialog.boundingBox())!.width).toBeLessThanOrEqual(390);
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
      await dialog.locator('[data-test="booking-title"] input, input[data-test="booking-title"]').first().fill('Kestrel Hill JV v Copperbeech');
      await dialog.locator('[data-test="booking-submit"]').click();
      await dialog.waitFor({ state: 'hidden' });
      await expect.poll(() => page.locator('[data-test="booking"]', { hasText: 'Kestrel Hill JV v Copperbeech' }).count()).toBe(1);
      expect(await page.locator('[data-test="booking"]').count()).toBe(before + 1);
      const mine = page.locator('[data-test="booking"]', { hasText: 'Kestrel Hill JV v Copperbeech' });
      expect(await mine.locator('[data-test^="edit-booking-"]').count()).toBe(1);
      await page.locator('[data-test="field-bookings"]').scrollIntoViewIfNeeded();
      await page.screenshot({ path: path.join(shots, 'field-bookings-partner-phone.png') });
    } finally {
      await context.close();
    }
  });
});

