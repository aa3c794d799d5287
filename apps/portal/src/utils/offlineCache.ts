/**
 * The service worker's copies of the API answers Today needs (network first, these when
 * there is no signal; `vite.config.ts` names the routes). They belong to the person who was
 * signed in: forgotten when nobody is, or someone else is.
 */
export const TODAY_API_CACHE = 'swardwise-today-api';

/** Drops the kept answers; a browser without Cache Storage (or a test) has none to drop. */
export async function forgetOfflineAnswers(): Promise<void> {
  if (typeof caches === 'undefined') return;
  await caches.delete(TODAY_API_CACHE).catch(() => false);
}
