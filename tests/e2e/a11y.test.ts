/**
 * WCAG 2.1 A/AA with axe-core on every page of every role: each link of the role's side
 * navigation, a site's and a field's page, the crew sheet and the pages before signing in;
 * crew leads' and partners' pages also on a phone. (Every other browser test is checked as
 * well, after each navigation: see axe.ts.)
 */
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, inject, test } from 'vitest';
import type { Role } from '@swardwise/domain';
import { a11yViolations, formatViolations, violationsSoFar, type A11yViolation } from './axe.ts';
import { browser, checkA11y, DESKTOP, PHONE, shots, signIn, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');
/** A role's pages one after the other, each waited for and checked: minutes, not seconds. */
const ROLE_TIMEOUT = 300_000;

useBrowser();

/** Waits for the page's content: its title, no request open, the map's tiles of data placed. */
async function settle(page: Page) {
  await page.locator('[data-test="page-title"]').first().waitFor();
  await page.waitForLoadState('networkidle');
  if (await page.locator('[data-test="field-map"]').count()) await page.locator('[data-test="field-map"][data-ready="true"]').waitFor();
  await page.evaluate(() => Promise.all(document.getAnimations().map((a) => a.finished.catch(() => undefined))));
}

/** The pages a role reaches: its navigation, then a site's, a field's and a crew sheet where it has them. */
async function pagesOf(page: Page): Promise<string[]> {
  const nav = await page.locator('[data-test^="nav-"]').evaluateAll((els) => els.map((el) => el.getAttribute('href')!));
  const details = await page.evaluate(async () => {
    const first = async (url: string, base: string) => {
      const res = await fetch(url);
      if (!res.ok) return [];
      const items = (await res.json()).items as { id: number }[];
      return items.length ? [`${base}/${items[0]!.id}`] : [];
    };
    return [...(await first('/api/sites', '/sites')), ...(await first('/api/fields', '/fields'))];
  });
  const pages = [...nav, ...details];
  if (nav.includes('/week')) {
    await page.goto(`${baseUrl}/week`);
    await page.locator('[data-test="week-grid"]').waitFor();
    const sheet = page.locator('[data-test="print-sheet"]').first();
    if (await sheet.count()) pages.push((await sheet.getAttribute('href'))!);
  }
  return pages;
}

/** Visits each page and answers what axe finds there, by page. */
async function auditPages(page: Page, pages: string[]): Promise<Map<string, A11yViolation[]>> {
  const found = new Map<string, A11yViolation[]>();
  for (const url of pages) {
    await page.goto(`${baseUrl}${url}`);
    await settle(page);
    found.set(url, await a11yViolations(page));
  }
  return found;
}

const summary: Record<string, { elements: number; rules: string[] }> = {};

function expectClean(label: string, found: Map<string, A11yViolation[]>) {
  for (const [url, violations] of found) {
    summary[`${label} ${url}`] = { elements: violations.length, rules: [...new Set(violations.map((v) => v.rule))] };
  }
  fs.writeFileSync(path.join(shots, '..', 'a11y-summary.json'), JSON.stringify(summary, null, 2));
  const all = [...found.values()].flat();
  expect(all, formatViolations(all)).toEqual([]);
}

const ROLES: Role[] = ['admin', 'head', 'foreman', 'crew', 'partner'];

/**
 * The contrast of each visible form control's edge (Element Plus draws it as an inset box
 * shadow) against the card or page behind it: WCAG 1.4.11 asks 3:1, which axe does not check.
 */
function controlEdges(page: Page) {
  return page.evaluate(() => {
    const rgb = (c: string) => (c.match(/\d+(\.\d+)?/g) ?? []).slice(0, 3).map(Number);
    const lum = (c: number[]) => {
      const [r, g, b] = c.map((v) => (v / 255 <= 0.03928 ? v / 255 / 12.92 : ((v / 255 + 0.055) / 1.055) ** 2.4));
      return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!;
    };
    const behind = (el: Element | null): number[] => {
      for (let e = el; e; e = e.parentElement) {
        const bg = getComputedStyle(e).backgroundColor;
        if (bg && !bg.startsWith('rgba(0, 0, 0, 0)') && bg !== 'transparent') return rgb(bg);
      }
      return [255, 255, 255];
    };
    return Array.from(document.querySelectorAll('.el-input__wrapper, .el-select__wrapper, .el-textarea__inner'))
      .filter((el) => (el as HTMLElement).offsetParent !== null && !el.closest('.is-disabled, .is-focus, .is-focused'))
      .map((el) => {
        const edge = rgb(getComputedStyle(el).boxShadow);
        const [a, b] = [lum(edge), lum(behind(el.parentElement))];
        return { control: el.className, ratio: Math.round(((Math.max(a, b) + 0.05) / (Math.min(a, b) + 0.05)) * 100) / 100 };
      });
  });
}


describe('accessibility (WCAG 2.1 A/AA, axe-core)', () => {
  test('should check a page after each navigation by itself and fail its close with the list', async () => {
    const page = await browser.newPage(DESKTOP);
    const has = async (rule: string, at: string) => (await violationsSoFar(page)).some((v) => v.rule === rule && v.path === at);
    let closed: unknown = null;
    try {
      // An input without a name in every document the page loads.
      await page.addInitScript(() => document.addEventListener('DOMContentLoaded', () => document.body.append(Object.assign(document.createElement('input'), { id: 'nameless' }))));
      await page.goto(`${baseUrl}/sign-in`);
      await expect.poll(() => has('label', '/sign-in'), { timeout: 20_000 }).toBe(true);
      // A picture without a text alternative, then the portal's own route change (no page load).
      await page.evaluate(() => document.body.append(Object.assign(document.createElement('img'), { src: '/favicon.svg', width: 20 })));
      await page.locator('[data-test="forgot-password"]').press('Enter');
      await page.waitForURL((url) => url.pathname === '/forgot-password');
      await expect.poll(() => has('image-alt', '/forgot-password'), { timeout: 20_000 }).toBe(true);
    } finally {
      closed = await page.close().then(() => null, (error: unknown) => error);
    }
    expect(String(closed)).toMatch(/label \(critical\) on \/sign-in — Form elements must have labels\n\s+#nameless\n\s+<input id="nameless">/);
    expect(String(closed)).toMatch(/image-alt \(critical\) on \/forgot-password/);
  });

  test('should run axe again only once the page has moved (hover, DOM), keeping the answer of a still page', async () => {
    const page = await browser.newPage(DESKTOP);
    type Counted = { axe: { run: (...args: unknown[]) => Promise<unknown> }; axeRuns: number };
    const runs = () => page.evaluate(() => (window as unknown as Counted).axeRuns);
    try {
      await page.goto(`${baseUrl}/sign-in`);
      await page.locator('[data-test="email"]').first().waitFor();
      await checkA11y(page);
      // Counts axe's runs from here on (without touching the DOM, which would count as a move).
      await page.evaluate(() => {
        const w = window as unknown as Counted;
        const run = w.axe.run.bind(w.axe);
        w.axeRuns = 0;
        w.axe.run = (...args) => ((w.axeRuns += 1), run(...args));
      });
      await checkA11y(page);
      expect(await runs()).toBe(0);
      // Hover can change colours (contrast) without a change to the DOM.
      await page.getByRole('button', { name: /sign in/i }).hover();
      await checkA11y(page);
      expect(await runs()).toBe(1);
      await page.evaluate(() => document.body.append(Object.assign(document.createElement('input'), { id: 'nameless' })));
      await expect(checkA11y(page)).rejects.toThrow(/label \(critical\)/);
      expect(await runs()).toBe(2);
    } finally {
      await page.close().catch(() => undefined);
    }
  });

  test('should find no violation on the pages before signing in', async () => {
    const page = await browser.newPage(DESKTOP);
    try {
      expectClean('public', await auditPages(page, ['/sign-in', '/forgot-password', '/accept-invite?token=x']));
    } finally {
      // The pages were checked above; a close that repeats the list adds nothing.
      await page.close().catch(() => undefined);
    }
  });

  test('should give the edge of every form control 3:1 against what is behind it', async () => {
    await withPage({}, async (page) => {
      await page.goto(`${baseUrl}/sign-in`);
      await page.locator('[data-test="email"]').first().waitFor();
      const signInEdges = await controlEdges(page);
      await signIn(page, 'foreman');
      await page.goto(`${baseUrl}/fields`);
      await page.locator('[data-test="row"]').first().waitFor();
      const edges = [...signInEdges, ...(await controlEdges(page))];
      expect(edges.length).toBeGreaterThanOrEqual(4);
      expect(edges.filter((e) => e.ratio < 3)).toEqual([]);
    });
  });

  test.each(ROLES)('should find no violation on any page of the %s at desktop size', async (role) => {
    const page = await browser.newPage(DESKTOP);
    try {
      await signIn(page, role);
      const pages = await pagesOf(page);
      expect(pages.length).toBeGreaterThanOrEqual(3);
      expectClean(`${role} desktop`, await auditPages(page, [...pages, '/no-such-page']));
    } finally {
      await page.close().catch(() => undefined);
    }
  }, ROLE_TIMEOUT);

  test.each(['crew', 'partner'] as Role[])('should find no violation on any page of the %s on a phone', async (role) => {
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    try {
      await signIn(page, role);
      const pages = await pagesOf(page);
      expectClean(`${role} phone`, await auditPages(page, pages));
    } finally {
      await context.close().catch(() => undefined);
    }
  }, ROLE_TIMEOUT);
});
