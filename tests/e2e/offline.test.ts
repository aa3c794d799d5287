/**
 * A crew lead opens Today once with a signal, then again with none at all (a yard with no
 * coverage): the service worker has kept the app shell and Today's reads, the page says the
 * jobs are the last ones loaded, and nothing else is answered from its copies.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, test } from 'vitest';
import { PHONE, shots, useBrowser, withPage } from './browser.ts';

useBrowser();

const TODAY_API_CACHE = 'swardwise-today-api';

/** Resolves once the service worker controls the page and holds Today's reads. */
async function keptForOffline(page: Page) {
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null, undefined, { timeout: 30_000 });
  const kept = () =>
    page.evaluate(async (name) => (await (await caches.open(name)).keys()).map((r) => new URL(r.url).pathname), TODAY_API_CACHE);
  await expect.poll(kept, { timeout: 30_000 }).toEqual(expect.arrayContaining(['/api/auth/me', '/api/work-orders', '/api/crews']));
}

describe('Today with no signal', () => {
  test('should open after one visit with the last known jobs, marked as such, and answer nothing else from the copies', async () => {
    await withPage({ role: 'crew', landing: '/today', device: PHONE }, async (page) => {
      const context = page.context();
      await page.locator('[data-test="job-card"]').first().waitFor();
      const online = await page.locator('[data-test="job-card"]').count();
      expect(await page.locator('[data-test="today-offline"]').count()).toBe(0);
      await keptForOffline(page);

      await context.setOffline(true);
      await page.reload();
      await page.locator('[data-test="job-card"]').first().waitFor();
      expect(await page.locator('[data-test="job-card"]').count()).toBe(online);
      expect(await page.locator('[data-test="today-offline"]').innerText()).toMatch(/No connection[\s\S]*last loaded/);
      await page.screenshot({ path: path.join(shots, 'today-phone-offline.png'), fullPage: true });

      // Only Today's reads come from the copies: another read, and any write, finds no network.
      const tried = await page.evaluate(async () => {
        const attempt = (init?: RequestInit, url = '/api/fields') => fetch(url, init).then((r) => `answered ${r.status}`, () => 'failed');
        return {
          fields: await attempt(),
          write: await attempt({ method: 'POST', headers: { 'Content-Type': 'application/json' }, body: '{}' }, '/api/work-orders/1/reports'),
        };
      });
      expect(tried).toEqual({ fields: 'failed', write: 'failed' });

      // Back online, signing out forgets the kept answers: the next person on this phone does not see them.
      await context.setOffline(false);
      await page.reload();
      await page.locator('[data-test="job-card"]').first().waitFor();
      // On a phone, signing out is in the menu drawer.
      await page.locator('[data-test="phone-menu"]').click();
      await page.locator('[data-test="phone-drawer"] [data-test="sign-out"]').click();
      await page.waitForURL((url) => url.pathname === '/sign-in');
      await expect.poll(() => page.evaluate(async (name) => (await caches.has(name) ? (await (await caches.open(name)).keys()).length : 0), TODAY_API_CACHE)).toBe(0);
    });
  });
});
