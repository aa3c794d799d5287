/**
 * The head finds e-mail the outbox gave up on (recipient, subject, attempts, last error, never
 * the text with its sign-in link) from the navigation, and sends it again now.
 */
import path from 'node:path';
import { describe, expect, test } from 'vitest';
import { mailOutbox } from '../../apps/api/src/db/schema/index.ts';
import { shots, useBrowser, withPage } from './browser.ts';
import { useOwnServer } from './own-server.ts';

useBrowser();

const own = useOwnServer();

describe('mail outbox', () => {
  test('should list given-up e-mail to the head without its text and send one again now', async () => {
    const [failed] = await own.database.db
      .insert(mailOutbox)
      .values([
        { to: 'new.groundskeeper@test.example', subject: 'Your Swardwise invitation', text: 'Open http://x/accept-invite?token=secret-link-0123 to start.', status: 'failed', attempts: 20, lastError: '550 5.1.1 mailbox unavailable' },
        { to: 'foreman.east@test.example', subject: 'Reset your Swardwise password', text: 'Open http://x/reset?token=secret-link-4567 to reset.', status: 'queued', attempts: 3, lastError: 'connect ECONNREFUSED 10.0.0.5:587', nextAttemptAt: new Date(Date.now() + 3600_000) },
      ])
      .returning({ id: mailOutbox.id });
    await withPage({}, async (page) => {
      await own.signIn(page, 'head');
      await page.getByRole('link', { name: 'Mail outbox' }).first().click();
      await page.waitForURL((url) => url.pathname === '/mail-outbox');
      const row = page.locator('[data-test="row"]').filter({ hasText: 'new.groundskeeper@test.example' });
      await row.waitFor();
      const text = await row.innerText();
      expect(text).toContain('Your Swardwise invitation');
      expect(text).toContain('Given up');
      expect(text).toContain('550 5.1.1 mailbox unavailable');
      const waiting = await page.locator('[data-test="row"]').filter({ hasText: 'foreman.east@test.example' }).innerText();
      expect(waiting).toContain('Waiting');
      expect(waiting).toContain('ECONNREFUSED');
      expect(await page.locator('body').innerText()).not.toContain('secret-link');
      await expect.poll(() => page.locator('[data-test="outbox-counts"]').innerText()).toContain('1 given up');
      await page.screenshot({ path: path.join(shots, 'mail-outbox.png'), fullPage: true });

      await page.locator(`[data-test="send-again-${failed!.id}"]`).click();
      await page.getByText('is queued to be sent again now').waitFor();
      // The outbox delivers it at once; the page shows it sent once it asks again.
      await own.background.idle();
      await page.getByRole('button', { name: 'Refresh' }).click();
      await expect.poll(() => page.locator(`[data-test="mail-state-${failed!.id}"]`).innerText()).toBe('Sent');
      expect(await page.locator(`[data-test="send-again-${failed!.id}"]`).count()).toBe(0);
      await page.screenshot({ path: path.join(shots, 'mail-outbox-sent.png'), fullPage: true });
    });
  });
});
