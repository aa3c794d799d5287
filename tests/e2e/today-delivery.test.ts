/**
 * What a crew lead's phone fetches before Today shows its first job: over HTTP/1.1 each file
 * beyond the browser's six connections waits a round trip (150 ms on a slow mobile
 * connection), so Today comes as a handful of files, all named by the page it is sent (no
 * second wave found only once the entry has run), and the dialogs' forms come after the jobs.
 * Counts, not times: the times are in the benchmark (tests/bench/today.ts).
 */
import { describe, expect, inject, test } from 'vitest';
import { browser, markFirstJobCard, PHONE, signIn, useBrowser } from './browser.ts';

useBrowser();
const baseUrl = inject('baseUrl');

describe('Today on a phone, first visit', () => {
  test('should come as a few files named by its own page, asking who is signed in once', async () => {
    const context = await browser.newContext({ ...PHONE, serviceWorkers: 'block' });
    try {
      const page = await context.newPage();
      await signIn(page, 'crew', '/today');
      // A fresh start with the session cookie: nothing cached, as a phone opening its bookmark.
      const cookies = await context.cookies();
      await context.close();
      const fresh = await browser.newContext({ ...PHONE, serviceWorkers: 'block' });
      await fresh.addCookies(cookies);
      // The moment the first job card is in the page, and what had been asked for by then.
      await markFirstJobCard(fresh);
      const phone = await fresh.newPage();
      const answer = await phone.goto(`${baseUrl}/today`);
      await phone.locator('[data-test="job-card"]').first().waitFor();
      // What was asked for before Today asked for its jobs: the code on its critical path, which
      // must come in one wave named by its HTML. (With other browser tests running the dialogs'
      // code, loaded when idle, can come before the first card is drawn; it is not on that path.)
      const asked = await phone.evaluate(() => {
        const entries = performance.getEntriesByType('resource') as PerformanceResourceTiming[];
        const orders = entries.find((e) => new URL(e.name).pathname === '/api/work-orders');
        const card = (window as unknown as { firstCard: number }).firstCard;
        const cut = Math.min(card, orders?.startTime ?? card);
        return entries.filter((e) => e.startTime < cut).map((e) => new URL(e.name).pathname);
      });

      const html = await answer!.text();
      const named = new Set([...html.matchAll(/(?:href|src)="(\/assets\/[^"]+)"/g)].map((m) => m[1]));
      const code = asked.filter((p) => /\.(js|css)$/.test(p));
      // Every file Today needed was named by the HTML, so all were asked for at once.
      expect(code.filter((p) => !named.has(p)), 'files found only after the entry ran').toEqual([]);
      expect(code.length, code.join('\n')).toBeLessThanOrEqual(6);
      expect(asked.filter((p) => p === '/api/auth/me')).toHaveLength(1);

      // The report dialog still opens, its code fetched after the jobs were shown.
      // Any open job: other browser tests may have logged the first one done already.
      await phone.locator('[data-test="job-card"]').getByRole('button', { name: 'Done', exact: true }).first().click();
      await phone.locator('[data-test="report-submit"]').waitFor();
      await fresh.close();
    } finally {
      await context.close().catch(() => undefined);
    }
  });
});
