/**
 * The foreman's week in chromium: generating a week again after applying and confirming it
 * proposes nothing new (desktop and phone); a job added by hand and a rain-out on the board,
 * both done with the keyboard through labelled inputs.
 */
import path from 'node:path';
import type { Locator, Page } from 'playwright-core';
import { describe, expect, inject, test } from 'vitest';
import { DESKTOP, PHONE, shots, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');
// Weeks of the demo season no other browser test plans.
const DESKTOP_WEEK = '2026-09-14';
const PHONE_WEEK = '2026-09-21';
const HAND_WEEK = '2026-09-28';

interface Order {
  id: number;
  task: string;
  fieldId: number;
  crewId: number | null;
  plannedDate: string;
  status: string;
  origin: string;
  notes: string;
  details: { eventId?: number; cancelled?: { reason: string } };
}

useBrowser();

async function openWeek(page: Page, week: string) {
  await page.goto(`${baseUrl}/week?week=${week}`);
  await page.locator('[data-test="week-grid"]').waitFor();
}

const myDistrict = (page: Page): Promise<number> => page.evaluate(async () => (await (await fetch('/api/auth/me')).json()).user.districtId as number);
const apiOrders = (page: Page, districtId: number, week: string): Promise<Order[]> =>
  page.evaluate(async ([d, w]) => (await (await fetch(`/api/week-plans?districtId=${d}&weekStart=${w}`)).json()).orders, [districtId, week] as const);

/** Generate → the diff → Apply; answers the diff's summary line. */
async function generateAndApply(page: Page): Promise<string> {
  await page.locator('[data-test="generate-week"]').click();
  const summary = page.locator('[data-test="diff-summary"]');
  await summary.waitFor();
  const text = (await summary.textContent()) ?? '';
  await page.locator('[data-test="diff-apply"]').click();
  await page.locator('[data-test="diff-dialog"]').waitFor({ state: 'hidden' });
  return text;
}

/** Picks an option of an Element Plus select with the keyboard: focus, open with Enter, arrow down to the label, Enter. */
async function chooseByKeyboard(page: Page, dialog: Locator, label: string, option: string | RegExp) {
  const input = dialog.getByLabel(label, { exact: true });
  await input.focus();
  await page.keyboard.press('Enter');
  const items = page.locator('.el-select-dropdown:visible .el-select-dropdown__item');
  await items.first().waitFor();
  const texts = await items.allTextContents();
  const index = texts.findIndex((t) => (typeof option === 'string' ? t.trim() === option : option.test(t)));
  expect(index, `${label}: ${String(option)} among ${texts.join(' | ')}`).toBeGreaterThanOrEqual(0);
  // The dropdown opens on the selected option (or none): walk from the top.
  await page.keyboard.press('Home');
  const hovered = async () => items.evaluateAll((els) => els.findIndex((e) => e.classList.contains('is-hovering')));
  for (let guard = 0; guard < 60 && (await hovered()) !== index; guard++) await page.keyboard.press('ArrowDown');
  expect(await hovered()).toBe(index);
  await page.keyboard.press('Enter');
  await expect.poll(() => page.locator('.el-select-dropdown:visible').count()).toBe(0);
}

/** Moves the focus to the button `opener` and presses Enter, as the keyboard opens a dialog; answers the dialog, shown. */
async function openWithEnter(page: Page, opener: string, dialog: string): Promise<Locator> {
  await page.locator(opener).focus();
  await page.keyboard.press('Enter');
  const shown = page.locator(dialog);
  await shown.waitFor();
  return shown;
}

/** Presses Enter on the dialog's `submit` button; answers the status of the POST to `path` it sends. */
async function submitWithEnter(page: Page, submit: string, path: string): Promise<number> {
  await page.locator(submit).focus();
  const sent = page.waitForResponse((r) => r.url().endsWith(path) && r.request().method() === 'POST');
  await page.keyboard.press('Enter');
  return (await sent).status();
}

describe('generating a week again', () => {
  for (const [name, options, week] of [
    ['desktop', DESKTOP, DESKTOP_WEEK],
    ['phone', PHONE, PHONE_WEEK],
  ] as const) {
    test(`should propose nothing new after apply and confirm (${name})`, async () => {
      await withPage({ role: 'foreman', device: options }, async (page) => {
        await openWeek(page, week);
        try {
          const districtId = await myDistrict(page);
          const first = await generateAndApply(page);
          expect(Number(/(\d+) added/.exec(first)?.[1])).toBeGreaterThan(0);
          const applied = await apiOrders(page, districtId, week);
          await page.locator('[data-test="confirm-week"]').click();
          await page.locator('.el-message-box__btns .el-button--primary').click();
          await page.locator('[data-test="confirm-week"]').waitFor({ state: 'hidden' });

          await page.locator('[data-test="generate-week"]').click();
          const again = page.locator('[data-test="diff-summary"]');
          await again.waitFor();
          expect(await again.textContent()).toMatch(/^\s*0 added · 0 changed · 0 removed/);
          await page.screenshot({ path: path.join(shots, `week-again-${name}.png`) });
          await page.locator('[data-test="diff-apply"]').click();
          await page.locator('[data-test="diff-dialog"]').waitFor({ state: 'hidden' });
          const after = await apiOrders(page, districtId, week);
          expect(after.filter((o) => o.task === 'paint_lines').length).toBe(applied.filter((o) => o.task === 'paint_lines').length);
          expect(after.length).toBe(applied.length);
        } catch (e) {
          await page.screenshot({ path: path.join(shots, `week-again-${name}-failed.png`) });
          throw e;
        }
      });
    });
  }
});

describe('work by hand on the board', () => {
  test('should add a one-off job and rain out a day with the keyboard, the crew seeing the reason', async () => {
    await withPage({ role: 'foreman' }, async (page) => {
      await openWeek(page, HAND_WEEK);
      const districtId = await myDistrict(page);
      await generateAndApply(page);

      // A one-off job: every input has a label, the whole form works from the keyboard.
      const dialog = await openWithEnter(page, '[data-test="add-job"]', '[data-test="manual-job-dialog"]');
      await chooseByKeyboard(page, dialog, 'Task', 'Topdress');
      await chooseByKeyboard(page, dialog, 'Field', /·/);
      await chooseByKeyboard(page, dialog, 'Day', /Tue 29 Sep/);
      await chooseByKeyboard(page, dialog, 'Crew', /./);
      await dialog.getByLabel('Hours', { exact: true }).fill('2.5');
      await dialog.getByLabel('Note for the crew', { exact: true }).fill('Sand the goalmouths after the aeration');
      expect(await submitWithEnter(page, '[data-test="manual-job-submit"]', '/api/work-orders')).toBe(201);
      await dialog.waitFor({ state: 'hidden' });
      const manual = (await apiOrders(page, districtId, HAND_WEEK)).find((o) => o.origin === 'manual');
      expect(manual).toMatchObject({ task: 'topdress', plannedDate: '2026-09-29', notes: 'Sand the goalmouths after the aeration' });
      await expect.poll(() => page.locator(`[data-test="order-card"][data-order-id="${manual!.id}"] [data-test="card-note"]`).count()).toBe(1);

      // A rain-out of Thursday for the whole district, planned again at once.
      const thursday = '2026-10-01';
      // Open work only: the demo season has already done some of this week's jobs.
      const open = (o: Order) => o.status !== 'skipped' && o.status !== 'done';
      const before = (await apiOrders(page, districtId, HAND_WEEK)).filter((o) => o.plannedDate === thursday && open(o));
      expect(before.length).toBeGreaterThan(0);
      const rain = await openWithEnter(page, '[data-test="rain-out"]', '[data-test="rain-out-dialog"]');
      await chooseByKeyboard(page, rain, 'Day', /Thu 1 Oct/);
      await expect.poll(async () => page.locator('[data-test="rain-out-count"]').textContent()).toMatch(new RegExp(`^${before.length} open job`));
      await rain.getByLabel('Reason the crews see', { exact: true }).fill('Thunderstorms all day, fields waterlogged');
      expect(await submitWithEnter(page, '[data-test="rain-out-submit"]', '/api/week-plans/generate')).toBe(200);
      await rain.waitFor({ state: 'hidden' });
      const after = await apiOrders(page, districtId, HAND_WEEK);
      for (const o of before) expect(after.find((a) => a.id === o.id)).toMatchObject({ status: 'skipped', details: { cancelled: { reason: 'Thunderstorms all day, fields waterlogged' } } });
      expect(after.filter((o) => o.plannedDate === thursday && open(o))).toEqual([]);
      await expect.poll(() => page.locator('[data-test="card-cancelled"]').count()).toBe(before.length);
      await page.screenshot({ path: path.join(shots, 'week-manual-rain-out.png'), fullPage: true });

      await withPage({ role: 'foreman', device: PHONE }, async (phone) => {
        await openWeek(phone, HAND_WEEK);
        await phone.locator('[data-test="card-cancelled"]').first().waitFor();
        await phone.screenshot({ path: path.join(shots, 'week-manual-rain-out-phone.png') });
        await phone.locator('[data-test="rain-out"]').click();
        await phone.locator('[data-test="rain-out-dialog"]').waitFor();
        // The dialog fades in.
        await phone.waitForTimeout(500);
        await phone.screenshot({ path: path.join(shots, 'week-rain-out-dialog-phone.png') });
      });
    });
  });
});
