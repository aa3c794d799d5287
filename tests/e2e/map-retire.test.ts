/**
 * Deleting a field with work on record from the map: the API refuses, the map offers to retire
 * the field instead, and the field is retired. On a server of its own, so the retired field is
 * no other test's surprise.
 */
import path from 'node:path';
import { describe, expect, test } from 'vitest';
import { fieldChecks } from '../../apps/api/src/db/schema/index.ts';
import { checkA11y, shots, useBrowser, withPage } from './browser.ts';
import { useOwnServer } from './own-server.ts';

useBrowser();
const own = useOwnServer();

describe('retiring a field from the map', () => {
  test('should offer a foreman to retire a field with a check on record instead of deleting it', async () => {
    const fieldId = own.fixture.fields.northLawn;
    await own.database.db.insert(fieldChecks).values({ fieldId, checkedOn: '2026-05-20', turfCoverPct: 90, weedsPct: 5, barePct: 5, score: 80 });
    await withPage({}, async (page) => {
      await own.signIn(page, 'foreman');
      await page.goto(`${own.baseUrl}/map`);
      await page.locator('[data-test="field-map"][data-ready="true"]').waitFor();
      const name = (await (await page.request.get(`${own.baseUrl}/api/fields/${fieldId}`)).json()).field.name as string;

      // Found with the map's search: its list of hits passes the accessibility check while open.
      await page.locator('input[data-test="map-search"], [data-test="map-search"] input').fill(name.slice(0, 5));
      const hit = page.locator('.el-autocomplete-suggestion li:visible', { hasText: name });
      await hit.first().waitFor();
      await checkA11y(page);
      await hit.first().click();
      await expect.poll(() => page.locator('[data-test="summary-name"]').textContent()).toBe(name);

      // Its outline's corners, while being edited, are named controls.
      await page.locator('[data-test="summary-edit"]').click();
      await page.locator('[data-test="outline-panel"]').waitFor();
      await expect.poll(() => page.locator('.marker-icon[aria-label="Corner 1 of the outline"]').count()).toBe(1);
      await checkA11y(page);
      await page.locator('[data-test="outline-panel"]').getByRole('button', { name: 'Cancel' }).click();
      await page.locator('[data-test="summary-delete"]').waitFor();

      await page.locator('[data-test="summary-delete"]').click();
      await page.locator('.el-message-box').getByRole('button', { name: 'Delete' }).click();
      // Work on record: the field is not deleted, and retiring it is offered instead.
      const offer = page.locator('.el-message-box', { hasText: 'cannot be deleted' });
      await offer.waitFor();
      await page.waitForFunction(() => document.getAnimations().every((a) => a.playState !== 'running'));
      await page.screenshot({ path: path.join(shots, 'map-retire-offer.png') });
      await offer.getByRole('button', { name: 'Retire field' }).click();
      await expect.poll(() => page.getByText(`${name} is retired.`).count()).toBeGreaterThan(0);
      const after = await (await page.request.get(`${own.baseUrl}/api/fields/${fieldId}`)).json();
      expect(after.field).toMatchObject({ id: fieldId, status: 'retired' });
    });
  });
});
