/**
 * Two API processes on one database (two apps, each with its own cache, as two processes
 * have): a deactivation, a role change or a sign-out made through one takes effect on it at
 * once and on the other within AUTH_CACHE_SECONDS (5 s). A session in use has its stored
 * expiry written at most once a SESSION_TOUCH_SECONDS (60 s), never later than that behind
 * its last request. The clock is faked (Date only), so no test sleeps.
 */
import { eq } from 'drizzle-orm';
import supertest from 'supertest';
import { afterEach, beforeEach, describe, expect, test, vi } from 'vitest';
import { sessions, users } from '../../apps/api/src/db/schema/index.ts';
import { addUser, PASSWORD } from '../support/fixture.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();
const BOUND_MS = 5_000;
const DAY = 24 * 3600 * 1000;

type App = ReturnType<typeof api.makeApp>['app'];
let other: App;
let n = 0;

beforeEach(() => {
  vi.useFakeTimers({ toFake: ['Date'] });
  vi.setSystemTime(new Date('2026-12-03T09:00:00Z'));
  other ??= api.makeApp().app;
});
afterEach(() => {
  vi.useRealTimers();
});

/** A new foreman of the north district, signed in: the cookie works on either app. */
async function signedInForeman(): Promise<{ id: number; cookie: string }> {
  const user = await addUser(api.database.db, `cachedForeman${++n}`, 'foreman', { districtId: api.fixture.districts.north });
  const res = await supertest(api.app).post('/api/auth/sign-in').send({ email: user.email, password: PASSWORD });
  expect(res.status).toBe(200);
  const cookie = String(res.headers['set-cookie']).split(';')[0]!;
  return { id: user.id, cookie };
}

const me = (app: App, cookie: string) => supertest(app).get('/api/auth/me').set('Cookie', cookie);
const later = (ms: number) => vi.setSystemTime(Date.now() + ms);

async function asAdminOnFirst(patch: Record<string, unknown>, id: number) {
  const admin = await api.signIn('admin');
  const [row] = await api.database.db.select({ version: users.version }).from(users).where(eq(users.id, id));
  const res = await admin.patch(`/api/users/${id}`).send({ version: row!.version, ...patch });
  expect(res.status).toBe(200);
}

describe('one account seen by two API processes', () => {
  test('should refuse a deactivated user at once where it was done and within the bound on the other process', async () => {
    const { id, cookie } = await signedInForeman();
    expect((await me(other, cookie)).status).toBe(200); // the other process has read (and keeps) the user
    await asAdminOnFirst({ active: false }, id);

    const here = await me(api.app, cookie);
    expect(here.status).toBe(401);
    expect(here.body.error.code).toBe('auth/access_changed');
    later(BOUND_MS);
    const there = await me(other, cookie);
    expect(there.status).toBe(401);
    expect(there.body.error.code).toBe('auth/access_changed');
  });

  test('should apply a role change on the other process within the bound', async () => {
    const { id, cookie } = await signedInForeman();
    expect((await me(other, cookie)).body.user.role).toBe('foreman');
    await asAdminOnFirst({ role: 'head', districtId: null }, id);

    expect((await me(api.app, cookie)).status).toBe(401);
    later(BOUND_MS);
    expect((await me(other, cookie)).status).toBe(401);
    // Signed in again, the new role holds on both.
    const [row] = await api.database.db.select({ email: users.email }).from(users).where(eq(users.id, id));
    const again = await supertest(other).post('/api/auth/sign-in').send({ email: row!.email, password: PASSWORD });
    const cookie2 = String(again.headers['set-cookie']).split(';')[0]!;
    expect((await me(api.app, cookie2)).body.user.role).toBe('head');
    expect((await me(other, cookie2)).body.user.role).toBe('head');
  });

  test('should end a signed-out session at once where it was signed out and within the bound on the other process', async () => {
    const { cookie } = await signedInForeman();
    expect((await me(other, cookie)).status).toBe(200);
    expect((await supertest(api.app).post('/api/auth/sign-out').set('Cookie', cookie)).status).toBe(204);

    expect((await me(api.app, cookie)).status).toBe(401);
    // The other process answers from what it read under 5 s ago: that is the bound, no more.
    later(BOUND_MS - 1);
    expect((await me(other, cookie)).status).toBe(200);
    later(1);
    expect((await me(other, cookie)).status).toBe(401);
  });

  test('should read a session again on every request with AUTH_CACHE_SECONDS=0', async () => {
    const uncached = api.makeApp({ AUTH_CACHE_SECONDS: '0' }).app;
    const { cookie } = await signedInForeman();
    expect((await me(uncached, cookie)).status).toBe(200);
    await supertest(api.app).post('/api/auth/sign-out').set('Cookie', cookie);
    expect((await me(uncached, cookie)).status).toBe(401);
  });
});

describe('the stored expiry of a session in use', () => {
  const stored = async (cookie: string) => {
    const rows = await api.database.db.select({ sid: sessions.sid, expiresAt: sessions.expiresAt, data: sessions.data }).from(sessions);
    const sid = decodeURIComponent(cookie.slice(cookie.indexOf('=') + 1)).slice(2).split('.')[0];
    return rows.find((r) => r.sid === sid)!.expiresAt.getTime();
  };

  test('should be written at most once a minute, and never more than a minute behind the last request', async () => {
    const { cookie } = await signedInForeman();
    const signedIn = Date.now();
    expect(await stored(cookie)).toBe(signedIn + 14 * DAY);

    later(30_000);
    expect((await me(api.app, cookie)).status).toBe(200);
    expect(await stored(cookie)).toBe(signedIn + 14 * DAY); // not written: touched under a minute ago

    later(31_000);
    const lastRequest = Date.now();
    expect((await me(api.app, cookie)).status).toBe(200);
    expect(await stored(cookie)).toBe(lastRequest + 14 * DAY);
  });
});
