/**
 * The content security policy the product ships allows no inline script or style. Every page
 * every browser test shows loads under it without a single violation: `useBrowser` watches each
 * context (csp-watch.ts) and fails the test after it ends, so the pages of every role (a11y.test.ts
 * visits each link of each role's navigation, a site's and a field's page), the public ones and
 * the flows are all checked without loading them again here. This file keeps the header and
 * shows that the watch sees a violation.
 */
import { describe, expect, inject, test } from 'vitest';
import { takeCspViolations } from './csp-watch.ts';
import { useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

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

  test('should see a violation on a page a browser test shows, and the public pages have none', async () => {
    await withPage({ device: { viewport: { width: 1280, height: 800 } } }, async (page) => {
      for (const path of ['/sign-in', '/status', '/forgot-password']) {
        await page.goto(`${baseUrl}${path}`);
        await page.waitForLoadState('networkidle');
      }
      expect(takeCspViolations()).toEqual([]);
      // What the policy refuses: an inline script, an inline style element and an inline handler.
      await page.evaluate(() => {
        document.body.append(Object.assign(document.createElement('script'), { textContent: 'window.__ran = true' }));
        document.head.append(Object.assign(document.createElement('style'), { textContent: 'body { color: red }' }));
        const img = document.createElement('img');
        img.setAttribute('onerror', 'window.__ran = true');
        img.src = '/no-such-picture.png';
        img.alt = 'nothing';
        document.body.append(img);
      });
      const seen: string[] = [];
      await expect.poll(() => (seen.push(...takeCspViolations()), seen.join('\n')), { timeout: 20_000 }).toMatch(/script-src-elem blocked inline/);
      await expect.poll(() => (seen.push(...takeCspViolations()), seen.join('\n'))).toMatch(/style-src-elem blocked inline/);
      await expect.poll(() => (seen.push(...takeCspViolations()), seen.join('\n'))).toMatch(/script-src-attr blocked inline/);
      expect(seen.join('\n')).toMatch(/^\/forgot-password: /m);
      expect(seen.join('\n')).toMatch(/console: .*Content Security Policy/);
      expect(await page.evaluate(() => (window as unknown as { __ran?: boolean }).__ran)).toBeUndefined();
    });
  });
});
