/**
 * Debian's chromium driven by playwright-core (never a downloaded browser), and what every
 * browser test file shares: one browser for the file, the screenshot folder, signing in.
 */
import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type BrowserContextOptions, type Locator, type Page, type Request, type Response } from 'playwright-core';
import sharp from 'sharp';
import { afterAll, afterEach, beforeAll, expect, inject } from 'vitest';
import type { Role } from '@swardwise/domain';
import { DEMO_SIGN_INS } from '../../apps/api/src/db/seed/demo-city.ts';
import { finishOpenPages, watchContext } from './axe.ts';
import { finishCsp, watchCsp } from './csp-watch.ts';

export { checkA11y } from './axe.ts';

const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium', args: CHROMIUM_ARGS });
}

/** Where browser tests leave the screenshots a person looks at. */
export const shots = path.resolve(import.meta.dirname, '../.artifacts/screenshots');

/** The file's browser, set by `useBrowser()` before its tests (a live binding). */
export let browser: Browser;

/**
 * Launches the file's browser before its tests and closes it after them. Every context and
 * page it makes (`browser.newPage()`, `browser.newContext()`) is checked with axe-core against
 * WCAG 2.1 A/AA after each navigation and when closed, which fails on a violation (axe.ts),
 * and watched for content security policy violations, which fail the test (csp-watch.ts).
 */
export function useBrowser(): void {
  beforeAll(async () => {
    fs.mkdirSync(shots, { recursive: true });
    const kept = await keptBrowser();
    browser = kept.browser;
    // browser.newPage() makes its context through this too.
    browser.newContext = async (options) => watchContext(await watchCsp(await kept.newContext(options)));
  });
  afterEach(finishOpenPages);
  // Every page shown also loads under the shipped content security policy (csp-watch.ts).
  afterEach(finishCsp);
  // What the file left open goes with it, unchecked, as closing the file's own browser did.
  afterAll(() => Promise.all((browser?.contexts() ?? []).map((context) => Object.getPrototypeOf(context).close.call(context))));
}

/**
 * The browser files share: the browser files run one after another in one process (isolate:
 * false), and launching and closing chromium took seconds a file. Kept on globalThis so a
 * run with isolation shares it too; each file's contexts are its own (nothing of one reaches
 * the next), and chromium ends with the process (its DevTools pipe closes).
 */
async function keptBrowser(): Promise<{ browser: Browser; newContext: Browser['newContext'] }> {
  const held = globalThis as { swardwiseE2eBrowser?: { browser: Browser; newContext: Browser['newContext'] } };
  if (!held.swardwiseE2eBrowser?.browser.isConnected()) {
    const launched = await launchBrowser();
    held.swardwiseE2eBrowser = { browser: launched, newContext: launched.newContext.bind(launched) };
  }
  return held.swardwiseE2eBrowser;
}

/**
 * Fills the e-mail and password of a demo account on the sign-in page the browser shows and
 * waits to be let in: onto `landing` when given, else anywhere but the sign-in page.
 */
export async function enterSignIn(page: Page, role: Role, landing?: string) {
  await page.getByLabel('E-mail').fill(DEMO_SIGN_INS[role].email);
  await page.getByLabel('Password').fill(DEMO_SIGN_INS[role].password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await page.waitForURL((url) => (landing ? url.pathname === landing : !url.pathname.startsWith('/sign-in')));
}

/** Signs in through the real sign-in page as the demo account of `role`. */
export async function signIn(page: Page, role: Role, landing?: string) {
  await page.goto(`${inject('baseUrl')}/sign-in`);
  await enterSignIn(page, role, landing);
}

/** Follows the navigation's link to `name` (`nav-<name>`) and waits for its page, `/<name>`. */
export async function followNav(page: Page, name: string) {
  await page.locator(`[data-test="nav-${name}"]`).click();
  await page.waitForURL((url) => url.pathname === `/${name}`);
}

/** A phone as crew leads hold one: 390 × 844 CSS pixels, touch. */
export const PHONE = { viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true };

/** The office's screen, where a test names no other. */
export const DESKTOP = { viewport: { width: 1366, height: 900 } };

export interface PageOptions {
  /** Signs in as the demo account of this role first (through the sign-in page). */
  role?: Role;
  /** With `role`: where signing in lands (waited for). */
  landing?: string;
  /** With `role`: sign in with the keyboard alone (`keyboardSignIn`). */
  keyboard?: boolean;
  /** The screen and other context options: `DESKTOP` by default, `PHONE` for a crew lead's. */
  device?: BrowserContextOptions;
  /** Then follows the navigation's link to this page (`followNav`). */
  nav?: string;
  /** Then opens this path of the portal (`/overview`). */
  open?: string;
}

/**
 * Runs `steps` on a page of its own (a fresh context: no cookies, no cache), signed in when
 * `role` is given and on the page `nav` or `open` names, and closes it afterwards even when a
 * step fails: closing is when the page's last accessibility check runs and reports.
 */
export async function withPage<T>({ role, landing, keyboard = false, device = DESKTOP, nav, open }: PageOptions, steps: (page: Page) => Promise<T>): Promise<T> {
  const context = await browser.newContext(device);
  try {
    const page = await context.newPage();
    if (role) await (keyboard ? keyboardSignIn : signIn)(page, role, landing);
    if (nav) await followNav(page, nav);
    if (open) await page.goto(`${inject('baseUrl')}${open}`);
    return await steps(page);
  } finally {
    await context.close();
  }
}

/** The Today page's report dialog (job done or skipped). */
export const reportDialog = (page: Page) => page.locator('.el-dialog').filter({ has: page.locator('[data-test="report-submit"]') });

/** An invented photo (one shade of turf green) as a file input takes it: PNG or JPEG by the name's ending. */
export async function turfPhoto(name: string, width: number, height: number) {
  const image = sharp({ create: { width, height, channels: 3, background: { r: 60, g: 125, b: 66 } } });
  const png = name.endsWith('.png');
  return { name, mimeType: png ? 'image/png' : 'image/jpeg', buffer: await (png ? image.png() : image.jpeg()).toBuffer() };
}

/**
 * Presses Tab (Shift+Tab with `back`) until the focused element is, or is inside, `selector`,
 * as a person without a mouse moves through the page; fails after `max` presses.
 */
export async function tabTo(page: Page, selector: string, { max = 150, back = false } = {}): Promise<void> {
  for (let i = 0; i < max; i++) {
    await page.keyboard.press(back ? 'Shift+Tab' : 'Tab');
    if (await page.evaluate((s) => !!document.activeElement?.closest(s), selector)) return;
  }
  throw new Error(`${selector} was not reached with ${max} presses of Tab`);
}

/**
 * Once `opener` is shown and the page's requests have settled, moves to it with Tab and
 * presses Enter, as a person without a mouse opens a dialog; answers the dialog, shown.
 */
export async function openDialogByKeyboard(page: Page, opener: string, dialog: string): Promise<Locator> {
  await page.locator(opener).waitFor();
  await page.waitForLoadState('networkidle');
  await tabTo(page, opener);
  await page.keyboard.press('Enter');
  const shown = page.locator(dialog);
  await shown.waitFor();
  return shown;
}

/** Signs in with the keyboard alone: Tab to each field, type, Enter. */
export async function keyboardSignIn(page: Page, role: Role, landing?: string) {
  await page.goto(`${inject('baseUrl')}/sign-in`);
  await page.locator('[data-test="email"]').first().waitFor();
  await tabTo(page, '[data-test="email"]');
  await page.keyboard.type(DEMO_SIGN_INS[role].email);
  await tabTo(page, '[data-test="password"]');
  await page.keyboard.type(DEMO_SIGN_INS[role].password);
  await page.keyboard.press('Enter');
  await page.waitForURL((url) => (landing ? url.pathname === landing : !url.pathname.startsWith('/sign-in')));
}

/** Opens the focused Element Plus select with the keyboard and picks the option labelled `label`. */
export async function pickOption(page: Page, label: string) {
  await page.keyboard.press('Enter');
  const dropdown = page.locator('.el-select-dropdown:visible');
  await dropdown.waitFor();
  const options = await dropdown.locator('.el-select-dropdown__item').allInnerTexts();
  expect(options).toContain(label);
  for (let i = 0; i < options.length * 2; i++) {
    if ((await dropdown.locator('.el-select-dropdown__item.is-hovering').innerText().catch(() => '')) === label) break;
    await page.keyboard.press('ArrowDown');
  }
  await page.keyboard.press('Enter');
  await dropdown.waitFor({ state: 'hidden' });
}

/**
 * Fills a field check form (the crew's and the office's share it) with one goalmouth check:
 * 84 % turf cover, 6 % weeds, 10 % bare, a 3 in/cm height, the 2.25 kg tester's `readings`,
 * evenness 4 and divots 3.
 */
export async function fillFieldCheck(form: Locator, readings: string[]) {
  await form.locator('[data-test="check-turf"] input').fill('84');
  await form.locator('[data-test="check-weeds"] input').fill('6');
  await form.locator('[data-test="check-bare"] input').fill('10');
  await form.getByText('Goalmouths', { exact: true }).click();
  await form.locator('[data-test="check-height"] input').fill('3');
  await form.locator('[data-test="check-device"]').getByText(/2\.25 kg portable tester/).click();
  for (const [i, g] of readings.entries()) await form.locator(`[data-test="check-reading-${i}"] input`).fill(g);
  await form.locator('[data-test="check-evenness"]').getByText('4', { exact: true }).click();
  await form.locator('[data-test="check-divots"]').getByText('3', { exact: true }).click();
}

/** Clicks `selector` and keeps the file its download brings among the screenshots as `name`; answers its path. */
export async function download(page: Page, selector: string, name: string): Promise<string> {
  const started = page.waitForEvent('download');
  await page.locator(selector).click();
  const file = path.join(shots, name);
  await (await started).saveAs(file);
  return file;
}

/**
 * Notes the moment (the page's `performance.now()`) the first job card is put in each page
 * `target` opens; read it with `firstJobCardAt(page)`.
 */
export async function markFirstJobCard(target: Page | BrowserContext): Promise<void> {
  await target.addInitScript(() => {
    new MutationObserver((_, observer) => {
      if (!document.querySelector('[data-test="job-card"]')) return;
      (window as unknown as { firstCard: number }).firstCard = performance.now();
      observer.disconnect();
    }).observe(document, { childList: true, subtree: true });
  });
}

/** When the first job card was put in the page (see `markFirstJobCard`). */
export const firstJobCardAt = (page: Page): Promise<number> => page.evaluate(() => (window as unknown as { firstCard: number }).firstCard);

/**
 * Drags a week board card onto `target` with the mouse and answers the PATCH it made, once the
 * board has been read again after it. On a loaded machine the mouse drag now and then starts
 * no drag (the board re-renders the crew-days' hours and routes after a write, and a card that
 * moves between the press and the first move is not picked up); a drag that sent no PATCH for
 * the card within 3 s is made again, three tries at most. One that sent it is never repeated.
 */
export async function dragCard(page: Page, orderId: number, target: Locator): Promise<Response> {
  const source = page.locator(`[data-test="order-card"][data-order-id="${orderId}"]`);
  for (let attempt = 1; ; attempt++) {
    let sent: Request | null = null;
    const onRequest = (r: Request) => {
      if (r.method() === 'PATCH' && r.url().endsWith(`/api/work-orders/${orderId}`)) sent = r;
    };
    page.on('request', onRequest);
    // The write is followed by a fresh read of the board; the next drag waits for it.
    const reread = page.waitForResponse((r) => r.request().method() === 'GET' && r.url().includes('/api/week-plans?'), { timeout: 20_000 }).catch(() => null);
    try {
      await source.dragTo(target, { timeout: 20_000 });
      const deadline = Date.now() + 3_000;
      while (!sent && Date.now() < deadline) await page.waitForTimeout(100);
    } finally {
      page.off('request', onRequest);
    }
    const request = sent as Request | null;
    if (request) {
      const response = await request.response();
      if (!response) throw new Error(`The PATCH of work order ${orderId} failed: ${request.failure()?.errorText ?? 'no answer'}`);
      await reread;
      return response;
    }
    if (attempt === 3) throw new Error(`Three drags of work order ${orderId} sent no PATCH`);
  }
}
