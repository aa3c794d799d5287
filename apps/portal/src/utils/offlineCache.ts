/**
 * The service worker's copies of the API answers Today needs (network first, these when
 * there is no signal; `vite.config.ts` names the routes). They belong to the person who was
 * signed in: forgotten when nobody is, or someone else is.
 */
export const TODAY_API_CACHE = 'swardwise-today-api';
/** The reads the service worker keeps copies of: who is signed in, and what Today shows. */
export const TODAY_API_READS = /\/api\/(?:auth\/me|work-orders|crews|districts|sites)(?:\?|$)/;

/** Drops the kept answers; a browser without Cache Storage (or a test) has none to drop. */
export async function forgetOfflineAnswers(): Promise<void> {
  if (typeof caches === 'undefined') return;
  await caches.delete(TODAY_API_CACHE).catch(() => false);
}

/**
 * The first visit's reads go past the service worker, which is not running yet (a resource
 * entry with no `workerStart`). Read each of Today's again through it once it controls the
 * page, so that the next opening with no signal finds them.
 */
export function keepReadsOnceControlled(): void {
  if (typeof navigator === 'undefined' || !('serviceWorker' in navigator) || typeof PerformanceObserver === 'undefined') return;
  const missed = new Set<string>();
  const reread = () => {
    if (!navigator.serviceWorker.controller) return;
    for (const url of missed) void fetch(url, { credentials: 'same-origin' }).catch(() => undefined);
    missed.clear();
  };
  new PerformanceObserver((list) => {
    for (const entry of list.getEntries() as PerformanceResourceTiming[]) {
      // `link`: index.html preloads who is signed in.
      if ((entry.initiatorType === 'fetch' || entry.initiatorType === 'link') && entry.workerStart === 0 && TODAY_API_READS.test(entry.name)) missed.add(entry.name);
    }
    reread();
  }).observe({ type: 'resource', buffered: true });
  navigator.serviceWorker.addEventListener('controllerchange', reread);
}

/**
 * After a sign-in (or a change of one's own settings) under the service worker: read who is
 * signed in through it, so that its copy is this session's. Nothing to do without one.
 */
export function refreshOfflineSession(): void {
  if (typeof navigator === 'undefined' || !navigator.serviceWorker?.controller) return;
  void fetch('/api/auth/me', { credentials: 'same-origin' }).catch(() => undefined);
}

/**
 * Registers the service worker (built by vite-plugin-pwa; none under the dev server) once
 * the first page has shown and read its data: its downloads would otherwise share a slow
 * connection with the page's own.
 */
export function registerWhenSettled(busy: () => boolean): void {
  if (!import.meta.env.PROD || typeof navigator === 'undefined' || !('serviceWorker' in navigator)) return;
  const register = () => {
    if (busy()) return void setTimeout(register, 500);
    void navigator.serviceWorker.register('/sw.js', { scope: '/' }).catch(() => undefined);
  };
  if (document.readyState === 'complete') register();
  else window.addEventListener('load', register, { once: true });
}
