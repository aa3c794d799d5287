/**
 * Every page a crew lead or a partner uses, on a phone (390 × 844): nothing scrolls sideways,
 * the navigation takes a small part of the first screen, the map fills the screen, and a
 * dialog's buttons are on the screen. Each page leaves a screenshot to look at.
 */
import path from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, test } from 'vitest';
import type { Role } from '@swardwise/domain';
import { browser, PHONE, shots, signIn, useBrowser } from './browser.ts';

useBrowser();
const baseUrl = inject('baseUrl');
const VIEW = PHONE.viewport;

interface Fit {
  scrollWidth: number;
  /** Shown elements reaching past the right edge of the screen, not inside a box that scrolls sideways. */
  pastEdge: string[];
  /** Height of the navigation visible on the first screen (0 when it is out of sight or closed). */
  navOnScreen: number;
}

/** What a page's layout does at the phone's width, measured in the page itself. */
function fit(page: Page): Promise<Fit> {
  return page.evaluate(() => {
    const visible = (el: Element) => {
      const r = el.getBoundingClientRect();
      const style = getComputedStyle(el);
      if (style.display === 'none' || style.visibility === 'hidden' || r.width === 0) return 0;
      return Math.max(0, Math.min(r.bottom, window.innerHeight) - Math.max(r.top, 0));
    };
    const navs = Array.from(document.querySelectorAll('nav[aria-label="Main"], [data-test="phone-nav"]'));
    // A page can be no wider than the screen and still cut a control off (a box that hides
    // what overflows it), so each element is measured too.
    const scrolls = (el: Element) => ['auto', 'scroll'].includes(getComputedStyle(el).overflowX);
    const pastEdge = Array.from(document.body.querySelectorAll('*'))
      .filter((el) => {
        const r = el.getBoundingClientRect();
        if (r.width === 0 || r.height === 0 || r.right <= window.innerWidth + 0.5 || getComputedStyle(el).visibility === 'hidden') return false;
        // A map draws its tiles past its own box, which clips them.
        for (let box = el.parentElement; box; box = box.parentElement) if (scrolls(box) || box.classList.contains('leaflet-container')) return false;
        return true;
      })
      .map((el) => `${el.tagName.toLowerCase()}.${Array.from(el.classList).join('.')} right ${Math.round(el.getBoundingClientRect().right)}`);
    return {
      scrollWidth: document.scrollingElement!.scrollWidth,
      pastEdge,
      navOnScreen: navs.reduce((s, n) => s + visible(n), 0),
    };
  });
}

async function checkPage(page: Page, name: string) {
  await page.waitForLoadState('networkidle');
  await page.screenshot({ path: path.join(shots, `phone-${name}.png`) });
  const f = await fit(page);
  expect(f.scrollWidth, `${name}: page wider than the phone`).toBeLessThanOrEqual(VIEW.width);
  expect(f.pastEdge, `${name}: past the right edge of the phone`).toEqual([]);
  // A bottom bar of one row of links: well under a tenth of the screen.
  expect(f.navOnScreen, `${name}: navigation height on the first screen`).toBeLessThanOrEqual(VIEW.height * 0.1);
  return f;
}

/** The signed-in phone of a role, shared by its tests. */
function usePhone(role: Role, landing: string) {
  const phone = {} as { context: BrowserContext; page: Page };
  beforeAll(async () => {
    phone.context = await browser.newContext(PHONE);
    phone.page = await phone.context.newPage();
    await signIn(phone.page, role, landing);
  });
  afterAll(() => phone.context?.close());
  return phone;
}

async function go(page: Page, to: string) {
  await page.goto(`${baseUrl}${to}`);
  await page.waitForLoadState('networkidle');
}

/** Opens `to`, waits for the first element of `ready`, and checks the page as `name` (`checkPage`). */
async function showPage(page: Page, to: string, ready: string, name: string) {
  await go(page, to);
  await page.locator(ready).first().waitFor();
  return checkPage(page, name);
}

/** The map of the map page, which should fill most of the phone's screen. */
const MAP = '.leaflet-container';

describe('the sign-in page on a phone', () => {
  test('should fit the phone', async () => {
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail').waitFor();
    await checkPage(page, 'sign-in');
    await context.close();
  });
});

describe('a crew lead on a phone', () => {
  const phone = usePhone('crew', '/today');

  test('should fit Today, with a bottom navigation and the account behind its menu', async () => {
    const { page } = phone;
    await page.locator('[data-test="job-card"]').first().waitFor();
    await checkPage(page, 'crew-today');
    const nav = page.locator('[data-test="phone-nav"]');
    await expect.poll(() => nav.isVisible()).toBe(true);
    expect(await page.locator('aside nav[aria-label="Main"]').isVisible()).toBe(false);
    // The menu opens the whole navigation and the account (units, sign out) on a drawer.
    await page.locator('[data-test="phone-menu"]').click();
    const drawer = page.locator('[data-test="phone-drawer"]');
    await drawer.locator('[data-test="sign-out"]').waitFor();
    await page.waitForTimeout(400);
    await page.screenshot({ path: path.join(shots, 'phone-crew-menu.png') });
    expect(await drawer.locator('[data-test="units-toggle"]').isVisible()).toBe(true);
    const box = (await drawer.locator('[data-test="sign-out"]').boundingBox())!;
    expect(box.x + box.width).toBeLessThanOrEqual(VIEW.width);
    expect(box.y + box.height).toBeLessThanOrEqual(VIEW.height);
    await page.keyboard.press('Escape');
    await drawer.waitFor({ state: 'hidden' });
  });

  test('should fit the fields list as cards', async () => {
    const { page } = phone;
    await showPage(page, '/fields', '[data-test="row"], [data-test="card"]', 'crew-fields');
  });

  test('should show the map over most of the screen with the legend folded away', async () => {
    const { page } = phone;
    await showPage(page, '/map', MAP, 'crew-map');
    const box = (await page.locator(MAP).boundingBox())!;
    expect(box.height).toBeGreaterThanOrEqual(VIEW.height * 0.6);
    expect(box.width).toBeGreaterThanOrEqual(VIEW.width - 40);
    // The legend is one tap away and folds back.
    const legend = page.locator('[data-test="map-legend"]');
    expect(await legend.isVisible()).toBe(false);
    await page.locator('[data-test="legend-toggle"]').click();
    await legend.waitFor();
    await page.screenshot({ path: path.join(shots, 'phone-crew-map-legend.png') });
    const shown = (await legend.boundingBox())!;
    expect(shown.y + shown.height).toBeLessThanOrEqual(VIEW.height);
    expect(await fit(page).then((f) => f.scrollWidth)).toBeLessThanOrEqual(VIEW.width);
  });

  test('should fit a field page', async () => {
    const { page } = phone;
    const id = await page.evaluate(async () => ((await (await fetch('/api/fields')).json()) as { items: { id: number }[] }).items[0]!.id);
    await showPage(page, `/fields/${id}`, 'h1', 'crew-field');
    // The season chart's legend sits under the plot on a phone, not over it.
    const chart = page.locator('[data-test="season-chart"]');
    if (await chart.count()) {
      await chart.scrollIntoViewIfNeeded();
      await page.waitForTimeout(300);
      await chart.screenshot({ path: path.join(shots, 'phone-crew-season-chart.png') });
      expect((await chart.boundingBox())!.width).toBeLessThanOrEqual(VIEW.width);
    }
  });
});

describe('a partner on a phone', () => {
  const phone = usePhone('partner', '/my-fields');

  test('should fit My fields, a field page and the booking dialog', async () => {
    const { page } = phone;
    await checkPage(page, 'partner-my-fields');
    const id = await page.evaluate(async () => ((await (await fetch('/api/fields')).json()) as { items: { id: number }[] }).items[0]!.id);
    await showPage(page, `/fields/${id}`, '[data-test="field-bookings"]', 'partner-field');
    await page.locator('[data-test="new-booking"]').click();
    const dialog = page.locator('[data-test="booking-dialog"]');
    await dialog.waitFor();
    await page.waitForTimeout(400);
    await page.screenshot({ path: path.join(shots, 'phone-partner-booking.png') });
    const d = (await dialog.boundingBox())!;
    expect(d.x).toBeGreaterThanOrEqual(0);
    expect(d.x + d.width).toBeLessThanOrEqual(VIEW.width);
    const save = (await page.locator('[data-test="booking-submit"]').boundingBox())!;
    expect(save.x + save.width, 'save button inside the screen').toBeLessThanOrEqual(VIEW.width);
    expect(save.y + save.height, 'save button inside the screen').toBeLessThanOrEqual(VIEW.height);
    expect((await fit(page)).scrollWidth).toBeLessThanOrEqual(VIEW.width);
  });

  test('should show the map over most of the screen', async () => {
    const { page } = phone;
    await showPage(page, '/map', MAP, 'partner-map');
    expect((await page.locator(MAP).boundingBox())!.height).toBeGreaterThanOrEqual(VIEW.height * 0.6);
  });
});

describe('a foreman on a phone', () => {
  const phone = usePhone('foreman', '/district');

  test('should fit the crew sheet and the records', async () => {
    const { page } = phone;
    await checkPage(page, 'foreman-district');
    // The crew sheet of the first crew-day on the week board, as its print link opens it.
    await go(page, '/week');
    const sheet = page.locator('[data-test="print-sheet"]').first();
    await sheet.waitFor({ state: 'attached' });
    await showPage(page, (await sheet.getAttribute('href'))!, '[data-test="page-title"]', 'foreman-crew-sheet');
    await showPage(page, '/records', 'h1', 'foreman-records');
    // Its date range, open: the calendars fit the screen too.
    await page.locator('.el-range-editor').first().click();
    await page.locator('.el-picker-panel').first().waitFor();
    await page.waitForTimeout(400);
    await checkPage(page, 'foreman-records-range');
  });
});
