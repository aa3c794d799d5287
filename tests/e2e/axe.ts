/**
 * WCAG 2.1 A/AA checks with axe-core on every page a browser test shows.
 *
 * `watchContext` (applied by `useBrowser` to every context and page the file's browser makes)
 * checks a page once it has settled after each navigation, the portal's own route changes
 * included, and once more when the page or its context is closed; the close then fails with
 * the list of violations. `checkA11y(page)` checks the page as it is now and fails at once,
 * for states a test wants checked by name (an open dialog, a phone layout). A check of a page
 * that has not moved since its last one (no change to its DOM, focus, hover, size, scroll or
 * media) keeps that one's answer instead of running axe again on the same state.
 */
import fs from 'node:fs';
import { createRequire } from 'node:module';
import type { AxeResults, RunOptions } from 'axe-core';
import type { BrowserContext, Page } from 'playwright-core';

const require = createRequire(import.meta.url);
const AXE_SOURCE = fs.readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

/** The rules the department is held to: WCAG 2.0 and 2.1, levels A and AA. */
export const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];

/** One failing element of one rule, as a person reads it. */
export interface A11yViolation {
  rule: string;
  impact: string;
  help: string;
  /** The page's path and query when it was checked. */
  path: string;
  target: string;
  /** The start of the element's HTML, to find it by. */
  html: string;
  summary: string;
}

interface RawViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: string; html: string; summary: string }[];
}

/** How long the network and the page's animations must stay still before a check. */
const QUIET_MS = 300;
/** A page that keeps changing under the check is tried this often, then checked as it is. */
const ATTEMPTS = 6;
/**
 * The background check after a navigation gives up sooner: a page the test is busy with keeps
 * changing, and axe on a large page takes the page's main thread for a while. The check at
 * close sees what it missed.
 */
const BACKGROUND_ATTEMPTS = 2;

/**
 * Runs axe in the page. Playwright evaluates in the page's main world through the DevTools
 * protocol, which the portal's content security policy does not govern, so the product's CSP
 * stays as it ships (a `<script>` tag with axe's source would need `bypassCSP`, and that would
 * hide a CSP that blocks something the portal needs). Answers null when the DOM changed or an
 * animation ran while axe looked, unless `force`.
 */
async function runAxe(page: Page, force: boolean): Promise<{ raw: RawViolation[]; still: boolean } | null> {
  const present = await page.evaluate(() => typeof (window as { axe?: unknown }).axe === 'object');
  if (!present) await page.evaluate(AXE_SOURCE);
  return page.evaluate(
    async ({ tags, force }) => {
      const axe = (window as unknown as { axe: { run: (context: Document, options: RunOptions) => Promise<AxeResults> } }).axe;
      const moving = () => document.getAnimations().some((a) => a.playState === 'running');
      if (!force && moving()) return null;
      const w = window as unknown as { __a11yStill?: boolean; __a11yWatch?: MutationObserver };
      if (!w.__a11yWatch) {
        // Kept for the document's life: anything that can change what axe finds (the DOM, focus,
        // the pointer's hover, the viewport, scrolling, print or colour media) marks the page as moved.
        const moved = () => (w.__a11yStill = false);
        w.__a11yWatch = new MutationObserver(moved);
        w.__a11yWatch.observe(document, { subtree: true, childList: true, attributes: true, characterData: true });
        for (const type of ['focusin', 'focusout', 'pointerover', 'pointerout', 'pointermove', 'mouseover', 'mouseout', 'mousemove', 'resize', 'scroll']) window.addEventListener(type, moved, true);
        for (const query of ['print', '(prefers-color-scheme: dark)', '(prefers-reduced-motion: reduce)', '(forced-colors: active)']) matchMedia(query).addEventListener('change', moved);
      }
      w.__a11yStill = true;
      let changed = false;
      const observer = new MutationObserver(() => (changed = true));
      observer.observe(document, { subtree: true, childList: true, attributes: true, characterData: true });
      const results = await axe.run(document, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] });
      observer.disconnect();
      w.__a11yWatch.takeRecords().forEach(() => (w.__a11yStill = false));
      if (!force && (changed || moving())) return null;
      // Whether the page is still as axe saw it: then a check before it moves would find the same.
      const still = !changed && !moving() && w.__a11yStill === true;
      w.__a11yStill = still;
      const raw = results.violations.map((v) => ({
        id: v.id,
        impact: v.impact ?? null,
        help: v.help,
        nodes: v.nodes.map((n) => ({ target: n.target.map(String).join(' '), html: n.html.slice(0, 160), summary: (n.failureSummary ?? '').replace(/\s+/g, ' ').trim() })),
      }));
      return { raw, still };
    },
    { tags: WCAG_TAGS, force },
  );
}

/** Whether the page has not moved since a check that saw it still (see runAxe): that check's answer holds. */
function unmoved(page: Page): Promise<boolean> {
  return page.evaluate(() => {
    const w = window as unknown as { __a11yStill?: boolean; __a11yWatch?: MutationObserver };
    if (!w.__a11yWatch || w.__a11yStill !== true) return false;
    if (w.__a11yWatch.takeRecords().length) return (w.__a11yStill = false);
    return !document.getAnimations().some((a) => a.playState === 'running');
  });
}

/** The violations found in one page, kept once each (rule, path and element). */
class PageAudit {
  readonly found = new Map<string, A11yViolation>();
  private inFlight = 0;
  private lastNetwork = Date.now();
  private dirty = false;
  private closed = false;
  private queue: Promise<void> = Promise.resolve();
  /** The last check of a page that stood still while axe looked, and its answer. */
  private last?: { path: string; violations: A11yViolation[] };
  reported = false;

  constructor(readonly page: Page) {
    page.on('request', () => {
      this.inFlight += 1;
      this.lastNetwork = Date.now();
    });
    const done = () => {
      this.inFlight = Math.max(0, this.inFlight - 1);
      this.lastNetwork = Date.now();
    };
    page.on('requestfinished', done);
    page.on('requestfailed', done);
    page.on('framenavigated', (frame) => {
      if (frame !== page.mainFrame()) return;
      this.dirty = true;
      this.schedule();
    });
    page.on('close', () => (this.closed = true));
  }

  private get path(): string {
    const url = new URL(this.page.url());
    return url.pathname + url.search;
  }

  /** Waits until no request is open and none ended for QUIET_MS (or the page closed). */
  private async quiet(): Promise<void> {
    for (let waited = 0; waited < 15_000 && !this.closed; waited += 50) {
      if (this.inFlight === 0 && Date.now() - this.lastNetwork >= QUIET_MS) return;
      await new Promise((r) => setTimeout(r, 50));
    }
  }

  private record(raw: RawViolation[], path: string): A11yViolation[] {
    const now: A11yViolation[] = [];
    for (const v of raw) {
      for (const node of v.nodes) {
        const item = { rule: v.id, impact: v.impact ?? '', help: v.help, path, target: node.target, html: node.html, summary: node.summary };
        now.push(item);
        this.found.set(`${v.id}|${path}|${node.target}`, item);
      }
    }
    return now;
  }

  /** One settled check: retried while the page changes under it; `force` checks the last try as it is. */
  private async checkSettled(force: boolean): Promise<A11yViolation[]> {
    const attempts = force ? ATTEMPTS : BACKGROUND_ATTEMPTS;
    for (let attempt = 1; attempt <= attempts && !this.closed; attempt++) {
      await this.quiet();
      if (this.closed || this.page.url().startsWith('about:')) return [];
      const path = this.path;
      try {
        // Axe on a large page takes seconds: a page that has not moved since its last check
        // (the one after its navigation, or the test's own) keeps that check's answer.
        if (this.last?.path === path && (await unmoved(this.page))) return this.last.violations;
        const ran = await runAxe(this.page, force && attempt === attempts);
        if (ran) {
          const violations = this.record(ran.raw, path);
          this.last = ran.still ? { path, violations } : undefined;
          return violations;
        }
      } catch (error) {
        // The test navigated or closed the page while axe looked: the next state gets its check.
        if (this.closed || /context was destroyed|Target .*closed|navigat/i.test(String(error))) return [];
        throw error;
      }
      await new Promise((r) => setTimeout(r, QUIET_MS));
    }
    return [];
  }

  /** After a navigation: check the new page once it has settled, in the background, one check at a time. */
  private schedule() {
    this.queue = this.queue.then(async () => {
      if (!this.dirty || this.closed) return;
      this.dirty = false;
      await this.checkSettled(false).catch(() => undefined);
    });
  }

  /** Checks the page as it is now (after what the background checks still had to do). */
  async checkNow(): Promise<A11yViolation[]> {
    await this.queue;
    const run = this.checkSettled(true);
    this.queue = run.then(() => undefined, () => undefined);
    return run;
  }

  /** What the checks so far found, once the one running has ended (no new check). */
  async soFar(): Promise<A11yViolation[]> {
    await this.queue;
    return [...this.found.values()];
  }

  /** Before the page closes: the last check, then everything found in its life (once: later calls answer nothing). */
  async finish(): Promise<A11yViolation[]> {
    if (this.reported) return [];
    this.reported = true;
    if (!this.closed) await this.checkNow().catch(() => undefined);
    return [...this.found.values()];
  }
}

const audits = new WeakMap<Page, PageAudit>();
/** The audits of pages not yet reported, for the file's after-each check. */
const open = new Set<PageAudit>();

/** A readable list: rule (impact) — what it asks, then each element and why it fails. */
export function formatViolations(violations: A11yViolation[]): string {
  const byRule = new Map<string, A11yViolation[]>();
  for (const v of violations) byRule.set(`${v.rule}|${v.path}`, [...(byRule.get(`${v.rule}|${v.path}`) ?? []), v]);
  const lines = [`${violations.length} element(s) fail WCAG 2.1 A/AA (axe-core):`];
  for (const group of byRule.values()) {
    const { rule, impact, help, path } = group[0]!;
    lines.push(`  ${rule} (${impact}) on ${path} — ${help}`);
    for (const v of group) lines.push(`    ${v.target}\n      ${v.html}\n      ${v.summary}`);
  }
  return lines.join('\n');
}

function fail(violations: A11yViolation[], where: string) {
  if (violations.length) throw new Error(`${where}: ${formatViolations(violations)}`);
}

function audit(page: Page): PageAudit {
  let found = audits.get(page);
  if (!found) {
    found = new PageAudit(page);
    audits.set(page, found);
    open.add(found);
    const close = page.close.bind(page);
    page.close = async (options) => {
      const violations = await found!.finish();
      open.delete(found!);
      await close(options);
      fail(violations, 'page closed');
    };
  }
  return found;
}

/** Checks every page of the context after each navigation and when it closes (see the file's comment). */
export function watchContext(context: BrowserContext): BrowserContext {
  for (const page of context.pages()) audit(page);
  context.on('page', audit);
  const close = context.close.bind(context);
  context.close = async (options) => {
    const pages = context.pages().map(audit);
    const violations = (await Promise.all(pages.map((p) => p.finish()))).flat();
    for (const p of pages) open.delete(p);
    await close(options);
    fail(violations, 'context closed');
  };
  return context;
}

/** Checks the page as it shows now and fails with the list of violations. */
export async function checkA11y(page: Page): Promise<void> {
  fail(await audit(page).checkNow(), `page ${new URL(page.url()).pathname}`);
}

/** The violations of the page as it shows now, without failing (for reports). */
export async function a11yViolations(page: Page): Promise<A11yViolation[]> {
  return audit(page).checkNow();
}

/** What the automatic checks of the page have found so far, without a new check. */
export function violationsSoFar(page: Page): Promise<A11yViolation[]> {
  return audit(page).soFar();
}

/** For a test that left pages open: reports what they found, then forgets them. */
export async function finishOpenPages(): Promise<void> {
  const pages = [...open];
  open.clear();
  const violations = (await Promise.all(pages.map((p) => p.finish()))).flat();
  fail(violations, 'pages left open');
}
