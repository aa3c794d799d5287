/**
 * The map in chromium: themes and legend, drawing a new field outline with its live area,
 * and a partner who sees only his own sites' fields.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, inject, test } from 'vitest';
import type { Role } from '@swardwise/domain';
import { browser, checkA11y, followNav, shots, signIn, useBrowser } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

async function openMap(role: Role): Promise<Page> {
  const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
  await signIn(page, role);
  await followNav(page, 'map');
  await page.locator('[data-test="field-map"][data-ready="true"]').waitFor();
  return page;
}

describe('the map', () => {
  test('should let a foreman switch themes and draw, measure and save a new field', async () => {
    const page = await openMap('foreman');
    try {
      // The demo has weather through yesterday and a week of forecast: no "no weather after" notice.
      await page.locator('[data-test="map-legend"]').waitFor();
      expect(await page.locator('[data-test="map-weather-note"]').count()).toBe(0);
      expect(await page.locator('[data-test="map-legend"]').getAttribute('data-theme')).toBe('level');
      await page.locator('[data-test="theme-score"]').click();
      await expect.poll(() => page.locator('[data-test="map-legend"]').getAttribute('data-theme')).toBe('score');
      expect(await page.locator('[data-test="legend-score-high"]').count()).toBe(1);
      await page.locator('[data-test="theme-mowing"]').click();
      await expect.poll(() => page.locator('[data-test="legend-mow-overdue"]').count()).toBe(1);
      expect(new URL(page.url()).searchParams.get('theme')).toBe('mowing');

      // Zoom in so the new outline is field-sized, then click its corners on the canvas.
      const map = page.locator('[data-test="field-map"] .leaflet-container');
      for (let i = 0; i < 3; i++) {
        await page.locator('.leaflet-control-zoom-in').click();
        await page.waitForTimeout(350);
      }
      await page.locator('[data-test="map-draw"]').click();
      await expect.poll(() => page.locator('[data-test="field-map"]').getAttribute('data-drawing')).toBe('true');
      const box = (await map.boundingBox())!;
      const x0 = box.x + box.width / 2 - 30;
      const y0 = box.y + box.height / 2 - 45;
      const corners: [number, number][] = [
        [x0, y0],
        [x0 + 60, y0],
        [x0 + 60, y0 + 90],
        [x0, y0 + 90],
      ];
      for (const [x, y] of corners) {
        await page.mouse.click(x, y);
        await page.waitForTimeout(120);
      }
      await expect.poll(() => page.locator('[data-test="outline-area"]').count()).toBe(1);
      // Drawing, with the cursor marker on the map: no nameless control among its pieces.
      await checkA11y(page);
      await page.mouse.click(corners[0]![0], corners[0]![1]);
      await page.locator('[data-test="new-field-form"]').waitFor();
      const area = await page.locator('[data-test="outline-area"]').textContent();
      expect(area).toMatch(/ac · [\d,]+ ft²/);
      expect(await page.locator('[data-test="outline-axis"]').textContent()).toContain('N–S');

      await page.locator('[data-test="new-field-site"]').click();
      await page.locator('.el-select-dropdown__item:visible').first().click();
      await page.locator('input[data-test="new-field-name"], [data-test="new-field-name"] input').fill('Drawn practice pitch');
      await page.screenshot({ path: path.join(shots, 'map-draw-foreman.png') });
      await page.locator('[data-test="new-field-save"]').click();
      await expect.poll(() => page.locator('[data-test="new-field-form"]').count()).toBe(0);

      const saved = await page.evaluate(async () => {
        const items = (await (await fetch('/api/fields')).json()).items as { name: string; areaM2: number }[];
        return items.find((f) => f.name === 'Drawn practice pitch') ?? null;
      });
      expect(saved).not.toBeNull();
      expect(saved!.areaM2).toBeGreaterThan(1000);
      await expect.poll(() => page.locator('[data-test="summary-name"]').textContent()).toBe('Drawn practice pitch');
      await page.screenshot({ path: path.join(shots, 'map-saved-foreman.png') });

      // The new field's page shows what the turf engine works out for it.
      const drawnId = await page.evaluate(async () => {
        const items = (await (await fetch('/api/fields')).json()).items as { id: number; name: string }[];
        return items.find((f) => f.name === 'Drawn practice pitch')!.id;
      });
      // A second window signed in as the same foreman, so the map keeps its selection.
      const second = await browser.newContext({ storageState: await page.context().storageState() });
      const fieldPage = await second.newPage();
      await fieldPage.goto(`${baseUrl}/fields/${drawnId}`);
      await fieldPage.locator('[data-test="needs-hoc"]').waitFor();
      expect(await fieldPage.locator('[data-test="needs-hoc"]').innerText()).toMatch(/^(\d+|\d*[⅛¼⅜½⅝¾⅞]) in$/);
      expect(await fieldPage.locator('[data-test="needs-mowings-per-week"]').innerText()).toMatch(/^\d+(\.\d)?$/);
      await second.close();

      // Deleting asks first, then the field is gone from the map and the API.
      const before = Number(await page.locator('[data-test="field-map"]').getAttribute('data-field-count'));
      await page.locator('[data-test="summary-delete"]').click();
      await page.locator('.el-message-box').getByRole('button', { name: 'Delete' }).click();
      await expect.poll(() => page.locator('[data-test="field-map"]').getAttribute('data-field-count')).toBe(String(before - 1));
      const stillThere = await page.evaluate(async () => {
        const items = (await (await fetch('/api/fields')).json()).items as { name: string }[];
        return items.some((f) => f.name === 'Drawn practice pitch');
      });
      expect(stillThere).toBe(false);
    } finally {
      await page.close();
    }
  });

  test('should show a partner only the fields of his own sites and no drawing tools', async () => {
    let partnerCount = 0;
    const page = await openMap('partner');
    try {
      const { mine, sites } = await page.evaluate(async () => {
        const me = (await (await fetch('/api/auth/me')).json()).user as { siteIds: number[] };
        const map = (await (await fetch('/api/map')).json()) as { fields: { siteId: number }[] };
        return { mine: map.fields.length, sites: [...new Set(map.fields.map((f) => f.siteId))].every((id) => me.siteIds.includes(id)) };
      });
      expect(sites).toBe(true);
      expect(mine).toBeGreaterThan(0);
      expect(Number(await page.locator('[data-test="field-map"]').getAttribute('data-field-count'))).toBe(mine);
      expect(await page.locator('[data-test="map-draw"]').count()).toBe(0);
      partnerCount = mine;
      await page.screenshot({ path: path.join(shots, 'map-partner.png') });
    } finally {
      await page.close();
    }
    const head = await openMap('head');
    try {
      // The head sees the whole city on the same page: the partner's map was a subset.
      const all = Number(await head.locator('[data-test="field-map"]').getAttribute('data-field-count'));
      expect(all).toBeGreaterThan(partnerCount);
    } finally {
      await head.close();
    }
  });
});
