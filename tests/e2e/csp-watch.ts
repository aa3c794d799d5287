/**
 * The content security policy checked on every page every browser test shows: each context the
 * file's browser makes reports the browser's securitypolicyviolation events and its CSP console
 * messages, and the test fails after it ends if there was one (see `useBrowser`). csp.test.ts
 * keeps the header itself and a check that this watch sees a violation.
 */
import type { BrowserContext, Page } from 'playwright-core';

const found: string[] = [];

const where = (page: Page | undefined | null) => {
  try {
    const url = new URL(page?.url() ?? '');
    return url.pathname + url.search;
  } catch {
    return '?';
  }
};

/** Collects the context's violations from each document's first script on, across navigations. */
export async function watchCsp(context: BrowserContext): Promise<BrowserContext> {
  await context.exposeBinding('__reportCspViolation', ({ page }, text: string) => {
    found.push(`${where(page)}: ${text}`);
  });
  await context.addInitScript(() => {
    document.addEventListener(
      'securitypolicyviolation',
      (e) => {
        const report = (window as unknown as { __reportCspViolation?: (text: string) => void }).__reportCspViolation;
        report?.(`${e.effectiveDirective} blocked ${e.blockedURI || 'inline'} at ${e.sourceFile}:${e.lineNumber} ${e.sample}`);
      },
      true,
    );
  });
  context.on('console', (msg) => {
    if (/Content Security Policy/i.test(msg.text())) found.push(`${where(msg.page())}: console: ${msg.text().slice(0, 300)}`);
  });
  return context;
}

/** The violations seen since the last call (and forgets them). */
export function takeCspViolations(): string[] {
  return found.splice(0);
}

/** After each test: fails with the violations its pages met. */
export function finishCsp(): void {
  const violations = takeCspViolations();
  if (violations.length) throw new Error(`${violations.length} content security policy violation(s):\n${violations.join('\n')}`);
}
