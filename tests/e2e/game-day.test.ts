/**
 * Game-day preparation end to end: the foreman prepares a booking from the field page (with a
 * colourant), its jobs show on the week board, a step is done, and the school's partner sees
 * the checklist's progress in plain words on a desktop and on a phone.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, inject, test } from 'vitest';
import { addDaysIso, localToday, mondayOf } from '@swardwise/domain';
import { browser, checkA11y, PHONE, shots, signIn, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

const TITLE = `Rivals night ${Date.now() % 100000}`;

async function partnerSees(page: Page, fieldId: number, eventId: number, name: string) {
  await signIn(page, 'partner', '/my-fields');
  await page.goto(`${baseUrl}/my-fields/${fieldId}`);
  const card = page.locator(`[data-test="partner-game-day-${eventId}"]`);
  await card.waitFor();
  await page.waitForLoadState('networkidle');
  await expect.poll(() => card.locator('[data-test="partner-game-day-progress"]').innerText()).toBe('1 of 4 steps done');
  const text = await card.innerText();
  expect(text).toContain(TITLE);
  expect(text).toContain('The lines are painted');
  expect(text).toContain('The turf is coloured for the event');
  // Plain words only: no crews, hours or costs.
  expect(text).not.toMatch(/Crew|\d+:\d\d h|\$/);
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(page.viewportSize()!.width);
  await card.scrollIntoViewIfNeeded();
  await checkA11y(page);
  await page.screenshot({ path: path.join(shots, `game-day-partner-${name}.png`), fullPage: true });
}

describe('game-day preparation', () => {
  let fieldId = 0;
  let eventId = 0;

  test('should let the foreman prepare a booking from the field page and put its jobs on the week board', async () => {
    await withPage({ role: 'foreman', device: { viewport: { width: 1400, height: 900 } } }, async (page) => {
      const timeZone = await page.evaluate(async () => (await (await fetch('/api/auth/me')).json()).timeZone as string);
      const today = localToday(timeZone);
      const eventOn = addDaysIso(today, 6);
      const setup = await page.evaluate(
        async ([title, on]) => {
          const fields = (await (await fetch('/api/fields')).json()).items as { id: number; name: string; siteName: string }[];
          const field = fields.find((f) => f.name === 'Stadium field' && f.siteName === 'Kestrel Hill High School')!;
          const res = await fetch('/api/field-events', { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ fieldId: field.id, kind: 'game', title, startsOn: on, startTime: '18:30' }) });
          return { fieldId: field.id, eventId: (await res.json()).event.id as number };
        },
        [TITLE, eventOn] as const,
      );
      fieldId = setup.fieldId;
      eventId = setup.eventId;

      await page.goto(`${baseUrl}/fields/${fieldId}`);
      const prepare = page.locator(`[data-test="prepare-game-day-${eventId}"]`);
      await prepare.waitFor();
      await prepare.click();
      const dialog = page.locator('[data-test="game-day-dialog"]');
      await dialog.waitFor();
      await dialog.locator('[data-test="game-day-step-colourant"]').click();
      await dialog.locator('[data-test="game-day-product"] input, input[data-test="game-day-product"]').first().fill('Meadow Deep pigment');
      await dialog.locator('[data-test="game-day-rate"] input, input[data-test="game-day-rate"]').first().fill('9');
      await dialog.locator('[data-test="game-day-colourant-caution"]').waitFor();
      expect(await dialog.innerText()).toContain('changes colour, not turf health');
      await checkA11y(page);
      await page.screenshot({ path: path.join(shots, 'game-day-dialog-desktop.png') });
      await dialog.getByRole('button', { name: 'Make the checklist' }).click();
      await dialog.waitFor({ state: 'hidden' });
      const prep = page.locator(`[data-test="game-day-${eventId}"]`);
      await expect.poll(() => prep.innerText().catch(() => '')).toContain('0 of 4 done');
      await prep.scrollIntoViewIfNeeded();
      await page.screenshot({ path: path.join(shots, 'game-day-field-desktop.png') });

      // The checklist PDF downloads from the card.
      const pdf = await page.evaluate(async (href) => {
        const r = await fetch(href);
        return { status: r.status, type: r.headers.get('content-type'), head: new TextDecoder().decode((await r.arrayBuffer()).slice(0, 5)) };
      }, (await prep.locator(`[data-test="game-day-pdf-${eventId}"]`).getAttribute('href'))!);
      expect(pdf).toEqual({ status: 200, type: 'application/pdf', head: '%PDF-' });

      // Its jobs are on the week plan of their week, the colourant among them; one is done.
      const answer = await page.evaluate(async (f) => (await (await fetch(`/api/game-days?fieldId=${f}`)).json()).items, fieldId);
      const mine = answer.find((p: { eventId: number }) => p.eventId === eventId);
      const colour = mine.steps.find((s: { step: string }) => s.step === 'colourant');
      await page.goto(`${baseUrl}/week?week=${mondayOf(colour.plannedDate)}`);
      const card = page.locator(`[data-order-id="${colour.workOrderId}"]`).first();
      await card.waitFor();
      expect(await card.innerText()).toContain('Colourant');
      expect(await card.locator('[data-test="mark-game-day"]').innerText()).toBe('Game day');
      await card.scrollIntoViewIfNeeded();
      await page.screenshot({ path: path.join(shots, 'game-day-week-desktop.png') });
      const paint = mine.steps.find((s: { step: string }) => s.step === 'paint_lines');
      const done = await page.evaluate(async (id) => (await fetch(`/api/work-orders/${id}/reports`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ status: 'done', actualHours: 1.5 }) })).status, paint.workOrderId);
      expect(done).toBe(201);
    });
  });

  test('should show the partner the checklist’s progress on a desktop', async () => {
    expect(eventId, 'the booking prepared before').toBeGreaterThan(0);
    await withPage({}, async (page) => {
      await partnerSees(page, fieldId, eventId, 'desktop');
    });
  });

  test('should show it on a phone', async () => {
    expect(eventId, 'the booking prepared before').toBeGreaterThan(0);
    const context = await browser.newContext(PHONE);
    try {
      await partnerSees(await context.newPage(), fieldId, eventId, 'phone');
    } finally {
      await context.close();
    }
  });
});
