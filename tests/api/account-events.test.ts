/**
 * Account events in the audit log (sign-in, failed sign-in, sign-out, reset request; never a
 * password or token), the absolute session lifetime, and the shortest password.
 */
import { and, eq, gt } from 'drizzle-orm';
import supertest from 'supertest';
import { describe, expect, test } from 'vitest';
import { auditLog, sessions, users } from '../../apps/api/src/db/schema/index.ts';
import { PASSWORD } from '../support/fixture.ts';
import { useTestApi } from '../support/app.ts';

// These tests change stored sessions and accounts behind the API's back, as another process
// would; with no cache the next request sees the change (the cache's bound: auth-cache.test.ts).
const api = useTestApi({ AUTH_CACHE_SECONDS: '0' });

const DAY = 24 * 3600 * 1000;
const lastId = async () => (await api.database.db.select({ id: auditLog.id }).from(auditLog)).reduce((m, r) => Math.max(m, r.id), 0);
const entriesAfter = (id: number) => api.database.db.select().from(auditLog).where(and(gt(auditLog.id, id), eq(auditLog.entity, 'account'))).orderBy(auditLog.id);

describe('account events in the audit log', () => {
  test('should log a sign-in, a failed sign-in and a sign-out with who and from where, and no password', async () => {
    const since = await lastId();
    const user = api.fixture.users.foreman;
    expect((await supertest(api.app).post('/api/auth/sign-in').send({ email: user.email, password: 'not-the-password-1' })).status).toBe(401);
    expect((await supertest(api.app).post('/api/auth/sign-in').send({ email: 'stranger@test.example', password: 'not-the-password-2' })).status).toBe(401);
    const agent = await api.signIn('foreman');
    expect((await agent.post('/api/auth/sign-out')).status).toBe(204);

    const entries = await entriesAfter(since);
    expect(entries.map((e) => [e.action, e.actorId, e.entityId])).toEqual([
      ['sign_in_failed', null, user.id],
      ['sign_in_failed', null, null],
      ['sign_in', user.id, user.id],
      ['sign_out', user.id, user.id],
    ]);
    expect(entries[0]!.after).toMatchObject({ email: user.email, address: expect.stringMatching(/127\.0\.0\.1|::1/) });
    expect(entries[1]!.after).toMatchObject({ email: 'stranger@test.example' });
    const text = JSON.stringify(entries);
    for (const secret of ['not-the-password-1', 'not-the-password-2', PASSWORD]) expect(text).not.toContain(secret);
  });

  test('should log a reset request, known or not, and never the token', async () => {
    const since = await lastId();
    await supertest(api.app).post('/api/auth/forgot-password').send({ email: api.fixture.users.head.email });
    await supertest(api.app).post('/api/auth/forgot-password').send({ email: 'stranger@test.example' });
    await api.background.idle();
    const mail = await api.mail.waitFor((m) => m.to.includes(api.fixture.users.head.email));
    const token = new URL(mail.text.match(/https?:\/\/\S+/)![0]).searchParams.get('token')!;
    const entries = await entriesAfter(since);
    expect(entries.map((e) => [e.action, e.entityId, (e.after as { accountFound: boolean }).accountFound])).toEqual(
      expect.arrayContaining([
        ['reset_requested', api.fixture.users.head.id, true],
        ['reset_requested', null, false],
      ]),
    );
    expect(JSON.stringify(await api.database.db.select().from(auditLog))).not.toContain(token);

    // Using the link is logged as a sign-in, again without the token or the new password.
    const done = await supertest(api.app).post('/api/auth/reset-password').send({ token, password: 'a-long-new-password' });
    expect(done.status).toBe(200);
    const all = JSON.stringify(await api.database.db.select().from(auditLog));
    expect(all).not.toContain(token);
    expect(all).not.toContain('a-long-new-password');
    expect((await entriesAfter(since)).at(-1)).toMatchObject({ action: 'sign_in', actorId: api.fixture.users.head.id });
  });
});

describe('session lifetime', () => {
  const storedSession = async (userId: number) => (await api.database.db.select().from(sessions).where(eq(sessions.userId, userId)))[0]!;
  const setSignedInAt = async (sid: string, data: Record<string, unknown>, at: number | undefined) => {
    const next = { ...data, signedInAt: at };
    if (at === undefined) delete next.signedInAt;
    await api.database.db.update(sessions).set({ data: next }).where(eq(sessions.sid, sid));
  };

  test('should keep the sign-in time in the session and never let the session outlive 30 days', async () => {
    const agent = await api.signIn('crew');
    const row = await storedSession(api.fixture.users.crew.id);
    const signedInAt = (row.data as { signedInAt: number }).signedInAt;
    expect(Math.abs(signedInAt - Date.now())).toBeLessThan(60_000);
    // Idle limit first: 14 days from now.
    expect(Math.abs(row.expiresAt.getTime() - (Date.now() + 14 * DAY))).toBeLessThan(60_000);

    // Signed in 20 days ago and busy every day since: the session still ends 30 days after sign-in.
    await setSignedInAt(row.sid, row.data, Date.now() - 20 * DAY);
    expect((await agent.get('/api/auth/me')).status).toBe(200);
    const capped = await storedSession(api.fixture.users.crew.id);
    expect(Math.abs(capped.expiresAt.getTime() - (Date.now() + 10 * DAY))).toBeLessThan(60_000);

    // Past 30 days: signed out, however recently used.
    await setSignedInAt(row.sid, capped.data, Date.now() - 30 * DAY - 1000);
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(401);
    expect(await api.database.db.select().from(sessions).where(eq(sessions.sid, row.sid))).toHaveLength(0);
  });

  test('should end a session that has no sign-in time', async () => {
    const agent = await api.signIn('partner');
    const row = await storedSession(api.fixture.users.partner.id);
    await setSignedInAt(row.sid, row.data, undefined);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });

  test('should let a request carrying an ended session sign in afresh', async () => {
    const agent = await api.signIn('foremanSouth');
    const row = await storedSession(api.fixture.users.foremanSouth.id);
    await setSignedInAt(row.sid, row.data, Date.now() - 31 * DAY);
    const again = await agent.post('/api/auth/sign-in').send({ email: api.fixture.users.foremanSouth.email, password: PASSWORD });
    expect(again.status).toBe(200);
    expect((await agent.get('/api/auth/me')).status).toBe(200);
    // Likewise after the account behind the cookie was deactivated: another account signs in.
    await api.database.db.update(users).set({ active: false }).where(eq(users.id, api.fixture.users.foremanSouth.id));
    const other = await agent.post('/api/auth/sign-in').send({ email: api.fixture.users.foreman.email, password: PASSWORD });
    expect(other.status).toBe(200);
    expect((await agent.get('/api/auth/me')).body.user.id).toBe(api.fixture.users.foreman.id);
    await api.database.db.update(users).set({ active: true }).where(eq(users.id, api.fixture.users.foremanSouth.id));
  });

  test('should follow SESSION_MAX_DAYS', async () => {
    const { app } = api.makeApp({ SESSION_MAX_DAYS: '1' });
    const agent = await api.signIn('admin', app);
    const row = (await api.database.db.select().from(sessions).where(eq(sessions.userId, api.fixture.users.admin.id))).at(-1)!;
    expect(row.expiresAt.getTime()).toBeLessThanOrEqual(Date.now() + DAY);
    await setSignedInAt(row.sid, row.data, Date.now() - DAY - 1000);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });
});

describe('shortest password', () => {
  test('should refuse an 11-character password when accepting an invitation, with the schema’s message', async () => {
    const admin = await api.signIn('admin');
    const invited = await admin.post('/api/users').send({ email: 'short.pass@test.example', name: 'Short Pass', role: 'head' });
    expect(invited.status).toBe(201);
    const token = new URL(invited.body.inviteUrl).searchParams.get('token')!;
    const short = await supertest(api.app).post('/api/auth/accept-invite').send({ token, password: 'elevenchars' });
    expect(short.status).toBe(400);
    expect(short.body.error.details.issues).toEqual([{ path: 'body.password', message: 'use at least 12 characters' }]);
    expect((await supertest(api.app).post('/api/auth/accept-invite').send({ token, password: 'twelve-chars' })).status).toBe(200);
  });
});
