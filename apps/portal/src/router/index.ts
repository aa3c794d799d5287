import { createRouter, createWebHistory, type RouteLocationNormalized } from 'vue-router';
import { ability } from '../ability.ts';
import { useSessionStore } from '../stores/session.ts';
import { routes } from './routes.ts';
import { safeNext } from './safeNext.ts';

export const router = createRouter({
  history: createWebHistory(),
  routes,
  scrollBehavior: () => ({ top: 0 }),
});

function allowed(to: RouteLocationNormalized, role: string): boolean {
  return to.matched.every(({ meta }) => {
    if (meta.roles && !meta.roles.includes(role as never)) return false;
    if (meta.can && !ability.can(meta.can[0], meta.can[1])) return false;
    return true;
  });
}

/**
 * Starts fetching the code of the page being opened now, while the guard asks who is signed
 * in, instead of after: one round trip less before a page shows on a slow connection. The
 * router loads the same modules itself later (the browser fetches each once).
 */
function prefetchPage(to: RouteLocationNormalized) {
  for (const record of to.matched) {
    for (const component of Object.values(record.components ?? {})) {
      // Lazy views are `() => import(…)`; a loaded one is an object.
      if (typeof component === 'function') void Promise.resolve((component as () => unknown)()).catch(() => undefined);
    }
  }
}

router.beforeEach(async (to) => {
  const session = useSessionStore();
  if (!session.loaded) prefetchPage(to);
  try {
    await session.load();
  } catch {
    // The API is down: let public pages render; others go to sign-in, which shows the error.
  }
  const isPublic = to.matched.some((r) => r.meta.public);

  if (!session.user) {
    return isPublic ? true : { path: '/sign-in', query: to.fullPath === '/' ? {} : { next: to.fullPath } };
  }
  if (to.name === 'sign-in') return safeNext(to.query.next) ?? session.landing;
  if (isPublic) return true;
  if (to.name === 'home') return session.landing;
  return allowed(to, session.user.role) ? true : session.landing;
});

router.afterEach((to) => {
  document.title = to.meta.title ? `${to.meta.title} · Swardwise` : 'Swardwise';
});
