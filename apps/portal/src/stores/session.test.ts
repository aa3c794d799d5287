import { createPinia, setActivePinia } from 'pinia';
import { afterEach, beforeEach, describe, expect, test, vi } from 'vitest';
import { queryClient } from '../api/queryClient.ts';
import { useSessionStore } from './session.ts';

const user = (id: number) => ({ id, email: `u${id}@test.example`, name: `U${id}`, role: 'foreman' as const, districtId: 1, crewId: null, siteIds: [], units: 'metric' as const, version: 1 });
const answer = (status: number, body?: unknown) => new Response(body === undefined ? null : JSON.stringify(body), { status });

beforeEach(() => setActivePinia(createPinia()));
afterEach(() => {
  vi.unstubAllGlobals();
  queryClient.clear();
});

describe('session store', () => {
  test('should forget every cached answer at sign-out', async () => {
    vi.stubGlobal('fetch', vi.fn(async (url: string) => (url.endsWith('/sign-in') ? answer(200, { user: user(3) }) : answer(204))));
    const session = useSessionStore();
    await session.signIn('u3@test.example', 'correct horse battery');
    queryClient.setQueryData(['fields', 'list', {}], [{ id: 1 }]);
    await session.signOut();
    expect(queryClient.getQueryData(['fields', 'list', {}])).toBeUndefined();
    expect(session.user).toBeNull();
  });

  test('should forget them when the session ends on its own or another person signs in, and keep them for the same person', async () => {
    const session = useSessionStore();
    vi.stubGlobal('fetch', vi.fn(async () => answer(200, { user: user(3) })));
    await session.signIn('u3@test.example', 'correct horse battery');
    queryClient.setQueryData(['users'], ['kept']);
    await session.setUnits('imperial');
    expect(queryClient.getQueryData(['users'])).toEqual(['kept']);
    session.expire();
    expect(queryClient.getQueryData(['users'])).toBeUndefined();
    queryClient.setQueryData(['users'], ['of 3']);
    vi.stubGlobal('fetch', vi.fn(async () => answer(200, { user: user(4) })));
    await session.signIn('u4@test.example', 'correct horse battery');
    expect(queryClient.getQueryData(['users'])).toBeUndefined();
  });
});
