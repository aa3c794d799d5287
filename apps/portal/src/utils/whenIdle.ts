/**
 * Runs `work` once the browser has nothing more urgent to do (at the latest after `timeoutMs`):
 * for code a page will want soon but not for its first screen, so that its download and
 * start-up do not delay what the page shows now.
 */
export function whenIdle(work: () => void, timeoutMs = 2000): void {
  if (typeof requestIdleCallback === 'function') requestIdleCallback(() => work(), { timeout: timeoutMs });
  else setTimeout(work, 200);
}
