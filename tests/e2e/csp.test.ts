/**
 * The content security policy the product ships allows no inline script or style, and every
 * main page of every role, and the public pages, load under it without a single violation
 * (the browser's securitypolicyviolation events and its CSP console messages).
 */
import type { BrowserContext, Page } from 'playwright-core';
import { describe, expect, inject, test } from 'vitest';
import type { Role } from '@swardwise/domain';
import { browser, signIn, useBrowser } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

const PAGES: Record<Role, string[]> = {
  admin: ['/admin/users', '/overview', '/sites', '/fields', '/map', '/crews', '/equipment', '/weather', '/standards', '/week', '/records', '/requests', '/imports', '/audit'],
  head: ['/overview', '/standards', '/records'],
  foreman: ['/district', '/week', '/fields', '/map', '/requests'],
  crew: ['/today', '/fields', '/map'],
  partner: ['/my-fields', '/map', '/requests'],
};
const PUBLIC = ['/sign-in', '/status', '/forgot-password'];

/** Collects violations in the page from its first script on, across navigations of the context. */
async function watchCsp(context: BrowserContext): Promise<string[]> {
  const found: string[] = [];
  await context.addInitScript(() => {
    const w = window as unknown as { __csp: string[] };
    w.__csp = [];
    document.addEventListener(
      'securitypolicyviolation',
      (e) => w.__csp.push(`${e.effectiveDirective} blocked ${e.blockedURI || 'inline'} at ${e.sourceFile}:${e.lineNumber} ${e.sample}`),
      true,
    );
  });
  context.on('console', (msg) => {
    if (/Content Security Policy/i.test(msg.text())) found.push(`console: ${msg.text().slice(0, 300)}`);
  });
  return found;
}

async function visit(page: Page, path: string, found: string[]): Promise<void> {
  await page.goto(`${baseUrl}${path}`);
  await page.waitForLoadState('networkidle');
  // Lazy parts (charts, the map's tiles and markers) settle after the network is quiet.
  await page.waitForTimeout(300);
  const events = await page.evaluate(() => (window as unknown as { __csp: string[] }).__csp);
  found.push(...events.map((e) => `${path}: ${e}`));
}

describe('content security policy', () => {
  test('should allow no inline script or style', async () => {
    const res = await fetch(`${baseUrl}/sign-in`);
    const csp = res.headers.get('content-security-policy') ?? '';
    const directive = (name: string) => csp.split(';').map((d) => d.trim()).find((d) => d.startsWith(`${name} `)) ?? '';
    expect(directive('script-src')).toBe("script-src 'self'");
    expect(directive('style-src')).toBe("style-src 'self'");
    expect(directive('script-src-attr')).toBe("script-src-attr 'none'");
    expect(csp).not.toContain('unsafe-inline');
    expect(csp).not.toContain('unsafe-eval');
  });

  test('should load the public pages without a violation', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const found = await watchCsp(context);
    const page = await context.newPage();
    for (const path of PUBLIC) await visit(page, path, found);
    await context.close();
    expect(found).toEqual([]);
  });

  test.each(Object.keys(PAGES) as Role[])('should load the main pages of %s without a violation', async (role) => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const found = await watchCsp(context);
    const page = await context.newPage();
    await signIn(page, role);
    for (const path of PAGES[role]) await visit(page, path, found);
    // A field's own page (outline map, charts) through the list, as a person gets there.
    if (role !== 'partner' && role !== 'crew') {
      await page.goto(`${baseUrl}/fields`);
      await page.locator('[data-test="row"]').first().waitFor();
      await page.locator('[data-test="row"] a').first().click();
      await page.waitForURL(/\/fields\/\d+/);
      await page.waitForLoadState('networkidle');
      await page.waitForTimeout(300);
      found.push(...(await page.evaluate(() => (window as unknown as { __csp: string[] }).__csp)).map((e) => `field page: ${e}`));
    }
    await context.close();
    expect(found).toEqual([]);
  }, 300_000);
});
