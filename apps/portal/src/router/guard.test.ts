import type { SessionUser } from '@swardwise/domain';
import { createPinia, setActivePinia } from 'pinia';
import { beforeAll, beforeEach, describe, expect, test, vi } from 'vitest';
import { router } from './index.ts';
import { safeNext } from './safeNext.ts';

function me(user: Partial<SessionUser> | null) {
  const body = user
    ? { user: { id: 9, email: 'x@swardwise.example', name: 'X', districtId: null, crewId: null, siteIds: [], units: 'imperial', version: 1, ...user } }
    : { error: { code: 'auth/unauthenticated', message: 'sign in first' } };
  vi.stubGlobal('fetch', vi.fn(async () => new Response(JSON.stringify(body), { status: user ? 200 : 401 })));
}

// The routes load their pages lazily; compiling them the first time can outlast a test's timeout.
beforeAll(async () => {
  await Promise.all([
    import('../views/SignInView.vue'),
    import('../views/MyFieldsView.vue'),
    import('../views/SitesView.vue'),
    import('../views/OverviewView.vue'),
    import('../layouts/AppLayout.vue'),
  ]);
}, 60_000);

beforeEach(async () => {
  setActivePinia(createPinia());
  vi.unstubAllGlobals();
});

describe('router guard', () => {
  test('should send someone not signed in to sign-in, remembering where they were going', async () => {
    me(null);
    await router.push('/fields?level=2');
    expect(router.currentRoute.value.path).toBe('/sign-in');
    expect(router.currentRoute.value.query.next).toBe('/fields?level=2');
  });

  test('should send a role to its own landing page from a page that is not theirs', async () => {
    me({ role: 'partner', siteIds: [4] });
    await router.push('/admin/users');
    expect(router.currentRoute.value.path).toBe('/my-fields');
  });

  test('should let a role open its own pages', async () => {
    me({ role: 'foreman', districtId: 2 });
    await router.push('/sites');
    expect(router.currentRoute.value.path).toBe('/sites');
  });

  test('should take a signed-in user away from the sign-in page to their landing page', async () => {
    me({ role: 'head' });
    await router.push('/sign-in');
    expect(router.currentRoute.value.path).toBe('/overview');
  });

  test('should follow only a `next` that stays inside the portal', () => {
    expect(safeNext('/fields/3')).toBe('/fields/3');
    expect(safeNext('//evil.example')).toBeNull();
    expect(safeNext('https://evil.example')).toBeNull();
    expect(safeNext(undefined)).toBeNull();
  });
});
