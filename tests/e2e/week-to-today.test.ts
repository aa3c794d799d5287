/**
 * The week from both ends: the demo foreman generates this week, drags two jobs onto his
 * first crew's day for today, and that crew's lead, on a phone, finds them on Today and logs
 * one done with a photo. The API then has it done, with the photo and the hours.
 */
import path from 'node:path';
import { describe, expect, inject, test } from 'vitest';
import { DEFAULT_TIME_ZONE, localToday, mondayOf } from '@swardwise/domain';
import { browser, dragCard, PHONE, reportDialog, shots, signIn, turfPhoto, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');
// Tall enough for the whole board with the demo season's done work: a drag on a scrolled page picks up the wrong card.
const TALL = { width: 1366, height: 3600 };

useBrowser();

interface Board {
  crews: { id: number; name: string }[];
  orders: { id: number; crewId: number | null; plannedDate: string; status: string; task: string }[];
}

describe('from the week plan to the crew’s phone', () => {
  test('should carry two jobs the foreman assigns to the crew lead’s Today, where one is logged done with a photo', async () => {
    // The department's clock decides "today" for both the board and Today.
    const today = localToday(process.env.DEPARTMENT_TIME_ZONE || DEFAULT_TIME_ZONE);
    const monday = mondayOf(today);
    const foreman = await browser.newPage({ viewport: TALL });
    let jobIds: number[] = [];
    try {
      await signIn(foreman, 'foreman');
      await foreman.goto(`${baseUrl}/week?week=${monday}`);
      await foreman.locator('[data-test="week-grid"]').waitFor();
      await foreman.locator('[data-test="generate-week"]').click();
      await foreman.locator('[data-test="diff-summary"]').waitFor();
      await foreman.locator('[data-test="diff-apply"]').click();
      await foreman.locator('[data-test="diff-summary"]').waitFor({ state: 'hidden' });

      const districtId = await foreman.evaluate(async () => (await (await fetch('/api/auth/me')).json()).user.districtId as number);
      const read = () => foreman.evaluate(async ([d, w]) => (await (await fetch(`/api/week-plans?districtId=${d}&weekStart=${w}`)).json()) as Board, [districtId, monday] as const);
      const board = await read();
      const crewA = board.crews.find((c) => c.name === 'North Ridge Crew A')!;
      const movable = board.orders.filter((o) => (o.status === 'planned' || o.status === 'assigned') && !(o.crewId === crewA.id && o.plannedDate === today));
      expect(movable.length).toBeGreaterThanOrEqual(2);
      jobIds = movable.slice(0, 2).map((o) => o.id);
      const target = foreman.locator(`[data-test="board-cell"][data-crew="${crewA.id}"][data-date="${today}"]`);
      for (const id of jobIds) {
        expect((await dragCard(foreman, id, target)).status()).toBe(200);
        // Today's cell may already hold more jobs than it lists (the board shows counts then): open it.
        const expand = target.locator('[data-test="cell-expand"]');
        await expect
          .poll(async () => {
            if (await expand.isVisible().catch(() => false)) await expand.click();
            return target.locator(`[data-order-id="${id}"]`).count();
          })
          .toBe(1);
      }
      const after = await read();
      for (const id of jobIds) expect(after.orders.find((o) => o.id === id)).toMatchObject({ crewId: crewA.id, plannedDate: today, status: 'assigned' });
      await foreman.screenshot({ path: path.join(shots, 'week-to-today-board.png'), clip: { x: 0, y: 0, width: 1366, height: 1100 } });
    } catch (e) {
      await foreman.screenshot({ path: path.join(shots, 'week-to-today-failed.png'), fullPage: true });
      throw e;
    } finally {
      await foreman.close();
    }

    await withPage({ role: 'crew', landing: '/today', device: PHONE }, async (phone) => {
      await phone.waitForURL((url) => url.pathname === '/today');
      for (const id of jobIds) await phone.locator(`[data-test="job-card"][data-order-id="${id}"]`).waitFor();
      const job = phone.locator(`[data-test="job-card"][data-order-id="${jobIds[0]}"]`);
      await job.locator('[data-test="job-done"]').click();
      const dialog = reportDialog(phone);
      await dialog.waitFor();
      await dialog.locator('[data-test="report-hours"] input').fill('0.8');
      await dialog.locator('textarea').fill('Done before the rain');
      await dialog.locator('[data-test="report-photos"]').setInputFiles(await turfPhoto('field.jpg', 2400, 1800));
      await dialog.locator('img[alt="field.jpg"]').waitFor();
      await dialog.locator('[data-test="report-submit"]').click();
      await job.and(phone.locator('[data-status="done"]')).waitFor();
      await phone.locator('[data-test="outbox-waiting"]').waitFor({ state: 'detached' });
      await phone.screenshot({ path: path.join(shots, 'week-to-today-phone.png') });
      const detail = await phone.evaluate(async (id) => (await (await fetch(`/api/work-orders/${id}`)).json()), jobIds[0]!);
      expect(detail.order).toMatchObject({ status: 'done', actualHours: 0.8, photoCount: 1 });
      // Shrunk on the server to 1600 px on the long side.
      expect(detail.photos[0]).toMatchObject({ width: 1600, height: 1200 });
      // The second job is still waiting for the crew.
      expect(await phone.locator(`[data-test="job-card"][data-order-id="${jobIds[1]}"]`).getAttribute('data-status')).toBe('assigned');
    });
  });
});
