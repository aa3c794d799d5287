/**
 * Cultural work in chromium: the head sets a level's aeration program on the Standards page,
 * a foreman generates a week and finds the aeration on the board with its reason, then records
 * an application on a weed-control job, and finds it in Records with the day's weather.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, inject, test } from 'vitest';
import { browser, checkA11y, shots, signIn, useBrowser } from './browser.ts';

const baseUrl = inject('baseUrl');
// A September week of the demo season (cool-season turf growing); no other browser test plans it.
const WEEK = '2026-09-07';
const COOL = ['kentucky_bluegrass', 'perennial_ryegrass', 'tall_fescue', 'fine_fescue'];

useBrowser();

type Order = { id: number; fieldId: number; task: string; reason: string; status: string; crewId: number | null; plannedDate: string };

/** Opens an order's card, showing every job of its cell first when the cell shows counts. */
async function openCard(page: Page, o: Order) {
  const cell = page.locator(`[data-test="board-cell"][data-crew="${o.crewId ?? 'none'}"][data-date="${o.plannedDate}"]`);
  const card = cell.locator(`[data-test="order-card"][data-order-id="${o.id}"]`);
  const expand = cell.locator('[data-test="cell-expand"]');
  await expect.poll(async () => (await card.count()) + (await expand.count()), { timeout: 20_000 }).toBeGreaterThan(0);
  if (await expand.count()) await expand.click();
  await card.click();
}
const json = <T>(page: Page, url: string): Promise<T> => page.evaluate(async (u) => (await fetch(u)).json(), url) as Promise<T>;

describe('cultural work', () => {
  test('should plan the aeration the Standards ask for, with its reason, and record an application', async () => {
    const foreman = await browser.newPage({ viewport: { width: 1366, height: 1000 } });
    const head = await browser.newPage({ viewport: { width: 1366, height: 1000 } });
    try {
      await signIn(foreman, 'foreman');
      const me = await json<{ user: { districtId: number } }>(foreman, '/api/auth/me');
      const fields = (await json<{ items: { id: number; grass: string; maintenanceLevel: number; status: string; districtId: number }[] }>(foreman, '/api/fields')).items;
      const field = fields.find((f) => COOL.includes(f.grass) && f.maintenanceLevel <= 3 && f.status !== 'retired');
      expect(field, 'a cool-season field kept at level 1–3 in the foreman’s district').toBeTruthy();
      const level = field!.maintenanceLevel;

      // The head sets the level's aeration to six a season on the Standards page.
      await signIn(head, 'head');
      const before = (await json<{ levels: { level: number; data: { cultural?: Record<string, unknown> } }[] }>(head, '/api/standards')).levels.find((l) => l.level === level)!.data.cultural;
      await head.goto(`${baseUrl}/standards`);
      await head.locator(`[data-test="standards-edit-${level}"]`).click();
      const times = head.locator(`[data-test="standards-form-${level}"] [data-test="cultural-aerate-times"] input`);
      await times.fill('6');
      await times.blur();
      await head.locator('[data-test="std-cultural"]').scrollIntoViewIfNeeded();
      await head.screenshot({ path: path.join(shots, 'standards-cultural-form.png') });
      await head.locator('[data-test="standards-save"]').click();
      // Saving shows the season's change first; confirm it.
      await head.locator('[data-test="standards-preview-confirm"]').click();
      await expect.poll(() => head.getByText(`Level ${level} saved`).count()).toBeGreaterThan(0);
      await expect.poll(() => head.locator('[data-test="standards-table"]').innerText()).toContain('6× core (hollow tine), Apr–Oct');
      await head.screenshot({ path: path.join(shots, 'standards-cultural.png'), fullPage: true });

      // The foreman generates the week: the aeration is on the board with its reason.
      await foreman.goto(`${baseUrl}/week?week=${WEEK}`);
      await foreman.locator('[data-test="week-grid"]').waitFor();
      await foreman.locator('[data-test="generate-week"]').click();
      await foreman.locator('[data-test="diff-summary"]').waitFor();
      await foreman.locator('[data-test="diff-apply"]').click();
      const board = async () => (await json<{ orders: Order[] }>(foreman, `/api/week-plans?districtId=${me.user.districtId}&weekStart=${WEEK}`)).orders;
      await expect.poll(async () => (await board()).some((o) => o.task === 'aerate' && o.fieldId === field!.id), { timeout: 20_000 }).toBe(true);
      const aeration = (await board()).find((o) => o.task === 'aerate' && o.fieldId === field!.id)!;
      expect(aeration.reason).toMatch(new RegExp(`^Level ${level} program: core \\(hollow tine\\) aeration 6× a season in Apr–Oct`));
      await openCard(foreman, aeration);
      const dialog = foreman.locator('[data-test="order-dialog"]');
      await dialog.getByText(`Level ${level} program`).waitFor();
      await foreman.screenshot({ path: path.join(shots, 'week-aeration-order.png') });
      await dialog.getByRole('button', { name: 'Cancel' }).click();

      // A weed-control job on the field, added by hand, takes the application record.
      const made = await foreman.evaluate(
        async (fieldId) => (await fetch('/api/work-orders', { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ fieldId, task: 'weed_control', plannedDate: '2026-09-08', plannedHours: 1 }) })).json(),
        field!.id,
      );
      await foreman.reload();
      await openCard(foreman, made as Order);
      await dialog.locator('[data-test="order-record-application"]').click();
      const form = dialog.locator('[data-test="application-form"]');
      await form.locator('[data-test="application-product"]').fill('Demo broadleaf herbicide');
      // A rate with decimals, as labels give them: the browser's own number check must not block it.
      await form.locator('[data-test="application-rate"] input').fill('1.1');
      await form.locator('[data-test="application-area"] input').fill('5000');
      await form.locator('[data-test="application-licence"]').fill('QA-20417');
      await foreman.screenshot({ path: path.join(shots, 'order-application-form.png') });
      await foreman.setViewportSize({ width: 390, height: 844 });
      await form.locator('[data-test="application-licence"]').scrollIntoViewIfNeeded();
      await checkA11y(foreman);
      await foreman.screenshot({ path: path.join(shots, 'order-application-form-phone.png') });
      // The dialog and its form fit the phone's width (nothing scrolls sideways).
      expect(await foreman.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
      expect((await form.boundingBox())!.width).toBeLessThanOrEqual(390);
      await foreman.setViewportSize({ width: 1366, height: 1000 });
      const save = form.locator('[data-test="application-save"]');
      // The button's text keeps AA contrast when hovered and while the record is being stored.
      await save.hover();
      await checkA11y(foreman);
      let release = () => {};
      const held = new Promise<void>((resolve) => (release = resolve));
      let routed = 0;
      // On the context: the portal's service worker makes the request, which a page route does not see.
      await foreman.context().route(`**/api/work-orders/${made.id}/application`, async (route) => {
        routed += 1;
        await held;
        await route.continue();
      });
      await save.click();
      await expect.poll(() => routed, { timeout: 20_000 }).toBe(1);
      await expect.poll(() => save.getAttribute('class'), { timeout: 20_000 }).toContain('is-loading');
      await checkA11y(foreman);
      await foreman.screenshot({ path: path.join(shots, 'order-application-saving.png') });
      // Held until now, so the answer cannot come before it is awaited.
      const saved = foreman.waitForResponse((r) => r.url().endsWith(`/api/work-orders/${made.id}/application`));
      release();
      expect((await saved).status()).toBe(201);
      await foreman.context().unroute(`**/api/work-orders/${made.id}/application`);
      // The form closes once the record is stored.
      await dialog.locator('[data-test="order-record-application"]').waitFor();

      await foreman.goto(`${baseUrl}/records`);
      const section = foreman.locator('[data-test="records-applications"]');
      await section.getByText('Demo broadleaf herbicide').waitFor();
      expect(await section.innerText()).toContain('licence QA-20417');
      await section.scrollIntoViewIfNeeded();
      await foreman.screenshot({ path: path.join(shots, 'records-applications.png') });

      // Put the Standards back for the other browser tests.
      const status = await head.evaluate(
        async ({ level, before }) => {
          const rows = (await (await fetch('/api/standards')).json()).levels as { level: number; version: number }[];
          const version = rows.find((l) => l.level === level)!.version;
          const res = await fetch(`/api/standards/${level}`, { method: 'PATCH', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ version, cultural: before }) });
          return res.status;
        },
        { level, before },
      );
      expect(status).toBe(200);
    } finally {
      await foreman.close();
      await head.close();
    }
  }, 300_000);
});
