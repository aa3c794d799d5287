/**
 * Each role's main task with the keyboard alone (Tab, typing, Enter, arrows; no mouse, no
 * `click`, no `fill`): a crew lead logs a job done from Today, a foreman generates and applies
 * a week and moves a job to another crew, a partner asks for a booking, the head reaches the
 * overview and a site. Each open dialog is checked with axe as well.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, inject, test } from 'vitest';
import { checkA11y, openDialogByKeyboard, PHONE, pickOption, shots, tabTo, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');
// A week of the demo season no other browser test plans.
const WEEK = '2026-08-10';

useBrowser();

/** The element that has the focus, as its data-test key or tag. */
const focused = (page: Page) => page.evaluate(() => document.activeElement?.closest('[data-test]')?.getAttribute('data-test') ?? document.activeElement?.tagName);

describe('each role’s main task with the keyboard alone', () => {
  test('should let a crew lead log a job done from Today', async () => {
    await withPage({ role: 'crew', landing: '/today', keyboard: true, device: PHONE }, async (page) => {
      await page.locator('[data-test="job-card"]').first().waitFor();
      const open = page.locator('[data-test="job-card"]:not([data-status="done"]):not([data-status="skipped"])').first();
      const id = Number(await open.getAttribute('data-order-id'));
      await tabTo(page, `[data-test="job-card"][data-order-id="${id}"] [data-test="job-done"]`);
      await page.keyboard.press('Enter');
      const dialog = page.locator('[data-test="report-dialog"]').or(page.locator('.el-dialog').filter({ has: page.locator('[data-test="report-submit"]') })).first();
      await dialog.waitFor();
      await tabTo(page, '[data-test="report-hours"]');
      await page.keyboard.press('ControlOrMeta+A');
      await page.keyboard.type('1.5');
      await tabTo(page, '[data-test="report-note"]');
      await page.keyboard.type('Cut with the keyboard test');
      await checkA11y(page);
      await tabTo(page, '[data-test="report-submit"]');
      await page.keyboard.press('Enter');
      await page.locator(`[data-test="job-card"][data-order-id="${id}"][data-status="done"]`).waitFor();
      await page.locator('[data-test="outbox-waiting"]').waitFor({ state: 'detached' });
      const order = await page.evaluate(async (o) => (await (await fetch(`/api/work-orders/${o}`)).json()).order, id);
      expect(order).toMatchObject({ status: 'done', actualHours: 1.5 });
    });
  });

  test('should let a foreman generate and apply a week, then move a job to another crew', async () => {
    await withPage({ role: 'foreman', landing: '/district', keyboard: true }, async (page) => {
      await tabTo(page, '[data-test="nav-week"]');
      await page.keyboard.press('Enter');
      await page.waitForURL((url) => url.pathname === '/week');
      // The week is chosen by its address, as a bookmark or a typed URL would.
      await page.goto(`${baseUrl}/week?week=${WEEK}`);
      await page.locator('[data-test="week-grid"]').waitFor();
      await page.waitForLoadState('networkidle');
      // The demo season already holds the week's done work: the plan adds to it (a full cell shows counts, not cards, so the API counts).
      const districtId = await page.evaluate(async () => (await (await fetch('/api/auth/me')).json()).user.districtId as number);
      const readBoard = () =>
        page.evaluate(
          async ([d, w]) => (await (await fetch(`/api/week-plans?districtId=${d}&weekStart=${w}`)).json()) as { crews: { id: number; name: string }[]; orders: { id: number; crewId: number | null; status: string }[] },
          [districtId, WEEK] as const,
        );
      const before = (await readBoard()).orders.length;

      await tabTo(page, '[data-test="generate-week"]');
      await page.keyboard.press('Enter');
      await page.locator('[data-test="diff-summary"]').waitFor();
      const added = Number(/(\d+) added/.exec((await page.locator('[data-test="diff-summary"]').textContent()) ?? '')?.[1]);
      expect(added).toBeGreaterThan(0);
      await checkA11y(page);
      await tabTo(page, '[data-test="diff-apply"]');
      await page.keyboard.press('Enter');
      await expect.poll(async () => (await readBoard()).orders.length, { timeout: 15_000 }).toBe(before + added);
      await page.locator('[data-test="diff-summary"]').waitFor({ state: 'hidden' });
      await expect.poll(() => page.locator('[data-test="week-grid"] .el-loading-mask').first().isVisible().catch(() => false), { timeout: 20_000 }).toBe(false);

      // The keyboard's way of dragging: Enter on a card, then its crew in the dialog.
      const board = await readBoard();
      const shown = new Set((await page.locator('[data-test="order-card"]').evaluateAll((els) => els.map((e) => e.getAttribute('data-order-id')))).map(Number));
      const job = board.orders.find((o) => o.status === 'planned' && o.crewId !== null && shown.has(o.id))!;
      const other = board.crews.find((c) => c.id !== job.crewId)!;
      await tabTo(page, `[data-test="order-card"][data-order-id="${job.id}"]`, { max: 600 });
      await page.keyboard.press('Enter');
      await page.locator('[data-test="order-dialog"]').or(page.locator('.el-dialog').filter({ has: page.locator('[data-test="order-crew"]') })).first().waitFor();
      await tabTo(page, '[data-test="order-crew"]');
      await checkA11y(page);
      await pickOption(page, other.name);
      const patched = page.waitForResponse((r) => r.url().endsWith(`/api/work-orders/${job.id}`) && r.request().method() === 'PATCH');
      await tabTo(page, '[data-test="order-save"]');
      await page.keyboard.press('Enter');
      expect((await patched).status()).toBe(200);
      const moved = await page.evaluate(async (o) => (await (await fetch(`/api/work-orders/${o}`)).json()).order, job.id);
      expect(moved).toMatchObject({ crewId: other.id, status: 'assigned' });
      await page.screenshot({ path: path.join(shots, 'keyboard-week.png') });
    });
  });

  test('should let a partner ask for a booking on his field from a phone', async () => {
    await withPage({ role: 'partner', landing: '/my-fields', keyboard: true, device: PHONE }, async (page) => {
      await page.locator('[data-test="my-field"]').first().waitFor();
      await tabTo(page, '[data-test="my-field"] a');
      await page.keyboard.press('Enter');
      // The partner's own page of the field, not the staff's.
      await page.waitForURL((url) => /^\/my-fields\/\d+$/.test(url.pathname));
      await page.locator('[data-test="partner-status"]').waitFor();
      await page.locator('[data-test="field-bookings"]').waitFor();
      const dialog = await openDialogByKeyboard(page, '[data-test="new-booking"]', '[data-test="booking-dialog"]');
      await tabTo(page, '[data-test="booking-title"]');
      await page.keyboard.type('Keyboard Cup semi-final');
      await checkA11y(page);
      await tabTo(page, '[data-test="booking-submit"]');
      await page.keyboard.press('Enter');
      await dialog.waitFor({ state: 'hidden' });
      await expect.poll(() => page.locator('[data-test="booking"]', { hasText: 'Keyboard Cup semi-final' }).count()).toBe(1);
    });
  });

  test('should let the head reach the overview and a site', async () => {
    await withPage({ role: 'head', landing: '/overview', keyboard: true }, async (page) => {
      await page.locator('[data-test="city-totals"]').waitFor();
      // From a district's card to its sites, then into the first site.
      await tabTo(page, '[data-test^="district-"] a[href^="/sites"]');
      await page.keyboard.press('Enter');
      await page.waitForURL((url) => url.pathname === '/sites');
      await page.locator('[data-test="row"]').first().waitFor();
      await tabTo(page, '[data-test="row"] a[href^="/sites/"]');
      const name = await page.evaluate(() => document.activeElement?.textContent?.trim());
      await page.keyboard.press('Enter');
      await page.waitForURL((url) => /^\/sites\/\d+$/.test(url.pathname));
      await expect.poll(() => page.locator('[data-test="page-title"]').first().textContent()).toContain(name!);
      // And back to the overview through the navigation.
      await tabTo(page, '[data-test="nav-overview"]', { back: true });
      expect(await focused(page)).toBe('nav-overview');
      await page.keyboard.press('Enter');
      await page.waitForURL((url) => url.pathname === '/overview');
    });
  });
});
