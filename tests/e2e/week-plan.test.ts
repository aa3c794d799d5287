/**
 * The week plan board in chromium: a foreman generates a week (preview, then apply), drags
 * work orders onto another crew's day and the API has them assigned; a stale card answers
 * with a reload; the crew sheet prints; the head sees the board read-only.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, inject, test } from 'vitest';
import { dragCard, followNav, shots, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');
// A week inside the demo season, with weather for every day; no other browser test plans it.
const WEEK = '2026-07-13';

interface Board {
  districtId: number;
  crews: { id: number; name: string }[];
  orders: { id: number; crewId: number | null; plannedDate: string; status: string; pinned: boolean; version: number }[];
}

useBrowser();

/**
 * Tall enough for the whole board, the demo season's done work included: Playwright's drag
 * scrolls to the target after pressing on the source, which on a scrolled page would pick up
 * whatever card is then under the mouse.
 */
const TALL = { viewport: { width: 1366, height: 3600 } };

async function openWeek(page: Page) {
  await followNav(page, 'week');
  await page.goto(`${baseUrl}/week?week=${WEEK}`);
  await page.locator('[data-test="week-grid"]').waitFor();
}

/** The board as the API has it, read with the page's own session. */
function apiBoard(page: Page, districtId: number): Promise<Board> {
  return page.evaluate(async ([d, w]) => (await fetch(`/api/week-plans?districtId=${d}&weekStart=${w}`)).json(), [districtId, WEEK] as const);
}

const myDistrict = (page: Page): Promise<number> => page.evaluate(async () => (await (await fetch('/api/auth/me')).json()).user.districtId as number);
const cell = (page: Page, crew: number | 'none', date: string) => page.locator(`[data-test="board-cell"][data-crew="${crew}"][data-date="${date}"]`);
const card = (page: Page, id: number) => page.locator(`[data-test="order-card"][data-order-id="${id}"]`);

describe('the week plan board', () => {
  test('should let a foreman generate the week and assign two jobs to a crew by dragging them', async () => {
    await withPage({ role: 'foreman', device: TALL }, async (page) => {
      try {
        await openWeek(page);
        const districtId = await myDistrict(page);
        // The demo's season already holds this week's work done; the plan adds what it still asks.
        const before = (await apiBoard(page, districtId)).orders.length;

        await page.locator('[data-test="generate-week"]').click();
        await page.locator('[data-test="diff-summary"]').waitFor();
        const summary = await page.locator('[data-test="diff-summary"]').textContent();
        const added = Number(/(\d+) added/.exec(summary ?? '')?.[1]);
        expect(added).toBeGreaterThan(0);
        // The preview writes nothing.
        expect((await apiBoard(page, districtId)).orders).toHaveLength(before);
        await page.screenshot({ path: path.join(shots, 'week-diff.png'), clip: { x: 0, y: 0, width: 1366, height: 900 } });
        await page.locator('[data-test="diff-apply"]').click();
        // Applying writes every order in one transaction: seconds on a busy machine.
        await expect.poll(() => page.locator('[data-test="order-card"]').count(), { timeout: 15_000 }).toBe(before + added);
        // The board reloads after applying; a drag that starts under the loading mask is lost.
        await expect.poll(() => page.locator('[data-test="week-grid"] .el-loading-mask').first().isVisible().catch(() => false), { timeout: 20_000 }).toBe(false);
        await page.screenshot({ path: path.join(shots, 'week-board.png'), clip: { x: 0, y: 0, width: 1366, height: 900 } });

        const board = await apiBoard(page, districtId);
        expect(board.crews.length).toBeGreaterThanOrEqual(2);
        const [from, to] = board.crews;
        const target = '2026-07-15'; // the Wednesday
        const jobs = board.orders.filter((o) => o.crewId === from!.id && o.status === 'planned').slice(0, 2);
        expect(jobs).toHaveLength(2);
        for (const job of jobs) {
          expect((await dragCard(page, job.id, cell(page, to!.id, target))).status()).toBe(200);
          await expect.poll(() => cell(page, to!.id, target).locator(`[data-order-id="${job.id}"]`).count()).toBe(1);
        }

        const after = await apiBoard(page, districtId);
        for (const job of jobs) {
          expect(after.orders.find((o) => o.id === job.id)).toMatchObject({ crewId: to!.id, plannedDate: target, status: 'assigned', pinned: true });
        }
        expect(await card(page, jobs[0]!.id).locator('[data-test="mark-pinned"]').count()).toBe(1);
      } catch (e) {
        await page.screenshot({ path: path.join(shots, 'week-drag-failed.png'), fullPage: true });
        throw e;
      }
    });
  });

  test('should reload and say so when someone else changed a card before it was dropped', async () => {
    await withPage({ role: 'foreman', device: TALL }, async (page) => {
      await openWeek(page);
      await page.locator('[data-test="order-card"]').first().waitFor();
      const districtId = await myDistrict(page);
      const board = await apiBoard(page, districtId);
      const job = board.orders.find((o) => o.status === 'planned' && o.crewId !== null)!;
      await expect.poll(() => page.locator('[data-test="week-grid"] .el-loading-mask').first().isVisible().catch(() => false), { timeout: 20_000 }).toBe(false);
      const other = board.crews.find((c) => c.id !== job.crewId)!;
      // Another session changes the order behind the board's back.
      const res = await page.evaluate(
        async ([id, version]) => (await fetch(`/api/work-orders/${id}`, { method: 'PATCH', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ version, plannedHours: 2.5 }) })).status,
        [job.id, job.version] as const,
      );
      expect(res).toBe(200);
      expect((await dragCard(page, job.id, cell(page, other.id, job.plannedDate))).status()).toBe(409);
      await expect.poll(() => page.getByText('Someone else changed this work order since you opened it').count()).toBeGreaterThan(0);
      // The reloaded card shows the other change and stays with its crew.
      await expect.poll(() => cell(page, job.crewId!, job.plannedDate).locator(`[data-order-id="${job.id}"]`).textContent()).toContain('2:30 h');
      const after = (await apiBoard(page, districtId)).orders.find((o) => o.id === job.id)!;
      expect(after.crewId).toBe(job.crewId);
    });
  });

  test('should print a crew sheet with the route, each job with blanks for hours and notes, and the cautions', async () => {
    await withPage({ role: 'foreman' }, async (page) => {
      await openWeek(page);
      const link = page.locator('[data-test="print-sheet"]').first();
      const href = (await link.getAttribute('href'))!;
      await page.goto(`${baseUrl}${href}`);
      await page.locator('[data-test="sheet-jobs"]').waitFor();
      const jobs = await page.locator('[data-test="sheet-job"]').count();
      expect(jobs).toBeGreaterThan(0);
      expect(await page.locator('[data-test="sheet-route"] li').count()).toBeGreaterThanOrEqual(3);
      expect(await page.locator('[data-test="sheet-cautions"]').textContent()).toMatch(/Lightning/);
      await page.emulateMedia({ media: 'print' });
      expect(await page.locator('[data-test="sheet-print"]').isVisible()).toBe(false);
      await page.screenshot({ path: path.join(shots, 'week-sheet-print.png'), fullPage: true });
    });
  });

  test('should show the head the board of a district read-only', async () => {
    await withPage({ role: 'head' }, async (page) => {
      await openWeek(page);
      await page.locator('[data-test="week-readonly"]').waitFor();
      expect(await page.locator('[data-test="generate-week"]').count()).toBe(0);
      expect(await page.locator('[data-test="week-district"]').count()).toBe(1);
      const first = page.locator('[data-test="order-card"]').first();
      if (await first.count()) expect(await first.getAttribute('draggable')).toBe('false');
    });
  });
});
