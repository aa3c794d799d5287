/**
 * Debian's chromium driven by playwright-core (never a downloaded browser), and what every
 * browser test file shares: one browser for the file, the screenshot folder, signing in.
 */
import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import sharp from 'sharp';
import { afterAll, afterEach, beforeAll, inject } from 'vitest';
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

/** A phone as crew leads hold one: 390 × 844 CSS pixels, touch. */
export const PHONE = { viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true };

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
