/**
 * A foreman closes a field with planned work on it and chooses what becomes of the work; the
 * public status board shows the closure to anyone, on a phone, without signing in.
 */
import path from 'node:path';
import { describe, expect, inject, test } from 'vitest';
import { addDaysIso, localToday } from '@swardwise/domain';
import { browser, PHONE, shots, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

describe('closures', () => {
  test('should let a foreman close a field with planned work, cancel the work, see it on the public board, and reopen it', async () => {
    await withPage({ role: 'foreman', device: { viewport: { width: 1400, height: 900 } } }, async (page) => {
      const setup = await page.evaluate(async () => {
        const me = await (await fetch('/api/auth/me')).json();
        const fields = (await (await fetch('/api/fields')).json()).items as { id: number; name: string; siteName: string; status: string }[];
        const crews = (await (await fetch('/api/crews')).json()).items as { id: number }[];
        return { timeZone: me.timeZone as string, field: fields.find((f) => f.status === 'open')!, crewId: crews[0]?.id ?? null };
      });
      expect(setup.field, 'an open field in the foreman’s district').toBeTruthy();
      const plannedDate = addDaysIso(localToday(setup.timeZone), 2);
      const order = await page.evaluate(
        async ({ fieldId, crewId, plannedDate }) => {
          const res = await fetch('/api/work-orders', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ fieldId, task: 'aerate', plannedDate, crewId, plannedHours: 2 }) });
          return { status: res.status, body: await res.json() };
        },
        { fieldId: setup.field.id, crewId: setup.crewId, plannedDate },
      );
      expect(order.status).toBe(201);
      const orderId = order.body.id as number;

      await page.goto(`${baseUrl}/fields/${setup.field.id}`);
      const card = page.locator('[data-test="field-closures"]');
      await card.locator('[data-test="close-field"]').click();
      const dialog = page.locator('[data-test="closure-dialog"]');
      await dialog.waitFor();
      // The reason's caution shows as it is chosen.
      await dialog.locator('[data-test="closure-reason"]').click();
      await page.getByRole('option', { name: 'Lightning' }).click();
      await expect.poll(() => dialog.locator('[data-test="closure-caution"]').innerText()).toMatch(/30 minutes after the last thunder/);
      await dialog.locator('[data-test="closure-note"] textarea, textarea[data-test="closure-note"]').first().fill('Storm cell over the yard');
      const work = dialog.locator('[data-test="closure-work"]');
      await work.waitFor();
      expect(await work.innerText()).toMatch(/Aerat/i);
      // Without a choice the server asks for one, beside the choices.
      await page.locator('[data-test="closure-submit"]').click();
      await expect.poll(() => dialog.innerText()).toMatch(/choose what to do with/i);
      await dialog.locator('[data-test="closure-work-cancel"]').click();
      await page.screenshot({ path: path.join(shots, 'closure-dialog-desktop.png') });
      await page.locator('[data-test="closure-submit"]').click();
      await dialog.waitFor({ state: 'hidden' });
      await card.locator('[data-test="closure-in-force"]').waitFor();
      expect(await card.locator('[data-test="closure-in-force"]').innerText()).toMatch(/Closed: Lightning/);
      await page.screenshot({ path: path.join(shots, 'closure-field-page-desktop.png'), fullPage: true });
      const cancelled = await page.evaluate(async (id) => (await (await fetch(`/api/work-orders/${id}`)).json()), orderId);
      expect(JSON.stringify(cancelled)).toMatch(/"status":"skipped"/);

      // Anyone, signed in or not, sees it on the board, on a phone.
      const phone = await browser.newContext(PHONE);
      try {
        const board = await phone.newPage();
        await board.goto(`${baseUrl}/status`);
        await board.locator('[data-test="status-field"]').first().waitFor();
        expect(board.url()).toMatch(/\/status$/);
        await board.locator('[data-test="status-search"]').fill(setup.field.name);
        const row = board.locator('[data-test="status-field"]', { hasText: setup.field.name }).filter({ hasText: 'Closed' }).first();
        await row.waitFor();
        expect(await row.innerText()).toMatch(/Lightning in the area/);
        expect(await board.content()).not.toMatch(/Storm cell over the yard/);
        await board.locator('[data-test="status-search"]').fill('');
        await board.locator('[data-test="status-not-open"]').check();
        const width = await board.evaluate(() => document.documentElement.scrollWidth);
        expect(width).toBeLessThanOrEqual(390);
        await board.screenshot({ path: path.join(shots, 'status-board-phone.png') });
        await board.locator('[data-test="status-not-open"]').uncheck();
        await board.screenshot({ path: path.join(shots, 'status-board-phone-all.png') });
      } finally {
        await phone.close();
      }

      await card.locator('[data-test="reopen-field"]').click();
      await page.locator('[data-test="closure-submit"]').click();
      await card.locator('[data-test="closure-in-force"]').waitFor({ state: 'detached' });
      expect(await card.innerText()).toMatch(/History \(2\)/);
    });
  });
});
