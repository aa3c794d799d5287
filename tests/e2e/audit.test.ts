/**
 * The head reads the audit log as a person would: a change to a site shows the site by its
 * name and each changed attribute in words, before and after.
 */
import path from 'node:path';
import { describe, expect, inject, test } from 'vitest';
import { shots, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

describe('audit log in words', () => {
  test('should show a changed site by name with its attributes before and after', async () => {
    await withPage({ role: 'head' }, async (page) => {
      const sites = (await (await page.request.get(`${baseUrl}/api/sites`)).json()) as { items: { id: number; name: string; version: number; notes: string | null }[] };
      const site = sites.items[0]!;
      const notes = `Gate code changed ${Date.now()}`;
      const res = await page.request.patch(`${baseUrl}/api/sites/${site.id}`, { data: { version: site.version, notes } });
      expect(res.status()).toBe(200);

      await page.goto(`${baseUrl}/audit`);
      const row = page.locator('[data-test="row"]').filter({ hasText: notes }).first();
      await row.waitFor();
      await expect.poll(() => row.innerText()).toContain(site.name);
      const text = await row.innerText();
      expect(text).toContain('Notes:');
      expect(text).toContain(`${site.notes ?? '—'} → ${notes}`);
      expect(text).not.toMatch(/Version|Updated at/);
      await page.screenshot({ path: path.join(shots, 'audit-log.png') });
    });
  });
});
