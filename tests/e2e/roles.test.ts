/**
 * Each role signs in through the real sign-in page, lands on its own page and sees only
 * its own navigation.
 */
import path from 'node:path';
import { describe, expect, inject, test } from 'vitest';
import type { Role } from '@swardwise/domain';
import { DEMO_SIGN_INS } from '../../apps/api/src/db/seed/demo-city.ts';
import { browser, enterSignIn, shots, useBrowser, withPage } from './browser.ts';

const baseUrl = inject('baseUrl');

useBrowser();

const expected: Record<Role, { landing: string; nav: string[] }> = {
  admin: { landing: '/admin/users', nav: ['overview', 'sites', 'fields', 'map', 'crews', 'equipment', 'weather', 'standards', 'costs', 'budget', 'what-if', 'compare', 'week', 'records', 'requests', 'imports', 'users', 'audit', 'mail-outbox'] },
  head: { landing: '/overview', nav: ['overview', 'sites', 'fields', 'map', 'crews', 'equipment', 'weather', 'standards', 'costs', 'budget', 'what-if', 'compare', 'week', 'records', 'requests', 'imports', 'audit', 'mail-outbox'] },
  foreman: { landing: '/district', nav: ['district', 'sites', 'fields', 'map', 'crews', 'equipment', 'weather', 'costs', 'budget', 'what-if', 'compare', 'week', 'records', 'requests', 'imports'] },
  crew: { landing: '/today', nav: ['today', 'fields', 'map'] },
  partner: { landing: '/my-fields', nav: ['my-fields', 'map', 'requests'] },
};

describe('signing in by role', () => {
  test.each(Object.keys(expected) as Role[])('should land %s on its own page with only its navigation', async (role) => {
    await withPage({ device: { viewport: { width: 1280, height: 800 } } }, async (page) => {
      await page.goto(`${baseUrl}/`);
      await page.waitForURL(/\/sign-in/);
      await enterSignIn(page, role, expected[role].landing);
      await page.locator('[data-test="page-title"]').first().waitFor();
      const nav = await page.locator('[data-test^="nav-"]').evaluateAll((els) => els.map((el) => el.getAttribute('data-test')!.slice(4)));
      expect(nav.sort()).toEqual([...expected[role].nav].sort());
      await page.screenshot({ path: path.join(shots, `landing-${role}.png`), fullPage: true });
    });
  });

  test('should show a clear message on a wrong password and stay on the sign-in page', async () => {
    await withPage({}, async (page) => {
      await page.goto(`${baseUrl}/sign-in`);
      await page.getByLabel('E-mail').fill(DEMO_SIGN_INS.head.email);
      await page.getByLabel('Password').fill('not-the-password');
      await page.getByRole('button', { name: /sign in/i }).click();
      await expect.poll(() => page.getByText('The e-mail or password is not right').count()).toBeGreaterThan(0);
      expect(new URL(page.url()).pathname).toBe('/sign-in');
    });
  });

  test('should send a partner who types another role’s address back to his own page', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    try {
      await page.goto(`${baseUrl}/sign-in`);
      await page.getByLabel('E-mail').fill(DEMO_SIGN_INS.partner.email);
      await page.getByLabel('Password').fill(DEMO_SIGN_INS.partner.password);
      await page.getByRole('button', { name: /sign in/i }).click();
      await page.waitForURL((url) => url.pathname === '/my-fields');
      await page.goto(`${baseUrl}/admin/users`);
      await page.waitForURL((url) => url.pathname === '/my-fields');
      // The API refuses it as well: the portal only hides what the server would refuse.
      const status = await page.evaluate(async () => (await fetch('/api/users')).status);
      expect(status).toBe(403);
    } finally {
      await context.close();
    }
  });
});
