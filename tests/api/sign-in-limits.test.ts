/**
 * Sign-in and reset abuse: failures are counted per account and per address separately,
 * forwarded addresses are believed only from TRUST_PROXY, every reset request counts, and
 * the reset answer is the same, and as fast, for an unknown address.
 */
import { eq } from 'drizzle-orm';
import supertest from 'supertest';
import { beforeEach, describe, expect, test } from 'vitest';
import { loadConfig } from '../../apps/api/src/config.ts';
import { auditLog, userTokens } from '../../apps/api/src/db/schema/index.ts';
import type { Mailer, OutgoingMail } from '../../apps/api/src/mail/mailer.ts';
import { PASSWORD } from '../support/fixture.ts';
import { type TestApi, useTestApi } from '../support/app.ts';

const api = useTestApi();
beforeEach(() => api.mail.clear());

const signIn = (app: TestApi['app'], email: string, password: string, forwardedFor?: string) => {
  const req = supertest(app).post('/api/auth/sign-in');
  if (forwardedFor) req.set('X-Forwarded-For', forwardedFor);
  return req.send({ email, password });
};
const forgot = (app: TestApi['app'], email: string, forwardedFor?: string) => {
  const req = supertest(app).post('/api/auth/forgot-password');
  if (forwardedFor) req.set('X-Forwarded-For', forwardedFor);
  return req.send({ email });
};
const resetTokens = async (userId: number) => api.database.db.select().from(userTokens).where(eq(userTokens.userId, userId));

describe('TRUST_PROXY', () => {
  test('should trust no forwarded header by default and refuse to trust every sender', () => {
    expect(loadConfig({}).trustProxy).toBe(false);
    expect(loadConfig({ TRUST_PROXY: 'loopback' }).trustProxy).toBe('loopback');
    expect(loadConfig({ TRUST_PROXY: '1' }).trustProxy).toBe(1);
    expect(() => loadConfig({ TRUST_PROXY: 'true' })).toThrow(/name the proxy/);
    // HTTPS is the proxy's: a secure cookie without trusting it would never be sent.
    expect(() => loadConfig({ COOKIE_SECURE: 'true' })).toThrow(/COOKIE_SECURE=true needs TRUST_PROXY/);
    expect(loadConfig({ COOKIE_SECURE: 'true', TRUST_PROXY: 'loopback' }).cookieSecure).toBe(true);
  });
});

describe('failed sign-ins', () => {
  test('should limit one address trying many accounts, whatever X-Forwarded-For it sends', async () => {
    const { app } = api.makeApp({ LOGIN_ATTEMPTS_PER_ADDRESS: '5', LOGIN_ATTEMPTS: '100' });
    const statuses: number[] = [];
    for (let i = 0; i < 6; i += 1) statuses.push((await signIn(app, `guess${i}@test.example`, 'guess-guess', `203.0.113.${i}`)).status);
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
    const blocked = await signIn(app, api.fixture.users.head.email, PASSWORD, '198.51.100.7');
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('auth/rate_limited');
  });

  test('should limit one account tried from many addresses, even the right password then', async () => {
    // Behind a proxy on loopback, each forwarded address is its own client.
    const { app } = api.makeApp({ TRUST_PROXY: 'loopback', LOGIN_ATTEMPTS: '3', LOGIN_ATTEMPTS_PER_ADDRESS: '100' });
    const statuses: number[] = [];
    for (let i = 0; i < 4; i += 1) statuses.push((await signIn(app, api.fixture.users.crew.email, 'guess-guess', `203.0.113.${i + 10}`)).status);
    expect(statuses).toEqual([401, 401, 401, 429]);
    expect((await signIn(app, api.fixture.users.crew.email, PASSWORD, '198.51.100.20')).status).toBe(429);
    // Another account from those addresses is not locked out.
    expect((await signIn(app, api.fixture.users.head.email, PASSWORD, '203.0.113.10')).status).toBe(200);
  });

  test('should count forwarded addresses apart only when TRUST_PROXY names the proxy', async () => {
    const { app } = api.makeApp({ TRUST_PROXY: 'loopback', LOGIN_ATTEMPTS_PER_ADDRESS: '2', LOGIN_ATTEMPTS: '100' });
    for (let i = 0; i < 4; i += 1) expect((await signIn(app, `nobody${i}@test.example`, 'guess-guess', `203.0.113.${40 + i}`)).status).toBe(401);
    // The proxy's other client keeps its own count: two failures from one forwarded address, then refused.
    expect((await signIn(app, 'x@test.example', 'guess-guess', '203.0.113.99')).status).toBe(401);
    expect((await signIn(app, 'y@test.example', 'guess-guess', '203.0.113.99')).status).toBe(401);
    expect((await signIn(app, 'z@test.example', 'guess-guess', '203.0.113.99')).status).toBe(429);
  });
});

describe('password reset requests', () => {
  test('should count every request per account: 50 requests give 3 e-mails and one working link', async () => {
    const { app, background } = api.makeApp({ TRUST_PROXY: 'loopback', RESET_REQUESTS_PER_ACCOUNT: '3', RESET_REQUESTS_PER_ADDRESS: '1000' });
    const statuses: number[] = [];
    for (let i = 0; i < 50; i += 1) statuses.push((await forgot(app, api.fixture.users.foreman.email, `203.0.113.${i + 100}`)).status);
    await background.idle();
    expect(statuses.filter((s) => s === 202)).toHaveLength(3);
    expect(statuses.filter((s) => s === 429)).toHaveLength(47);
    expect(api.mail.messages().filter((m) => m.to.includes(api.fixture.users.foreman.email))).toHaveLength(3);
    const tokens = await resetTokens(api.fixture.users.foreman.id);
    expect(tokens).toHaveLength(3);
    expect(tokens.filter((t) => t.usedAt === null)).toHaveLength(1);
  });

  test('should count every request per address, for accounts that exist or not', async () => {
    const { app } = api.makeApp({ RESET_REQUESTS_PER_ADDRESS: '4', RESET_REQUESTS_PER_ACCOUNT: '100' });
    const statuses: number[] = [];
    for (let i = 0; i < 5; i += 1) statuses.push((await forgot(app, `someone${i}@test.example`)).status);
    expect(statuses).toEqual([202, 202, 202, 202, 429]);
  });

  test('should retire the older links when a new one is issued', async () => {
    const linkIn = (m: { text: string }) => new URL(m.text.match(/https?:\/\/\S+/)![0]).searchParams.get('token')!;
    await forgot(api.app, api.fixture.users.admin.email);
    await api.background.idle();
    const first = linkIn(await api.mail.waitFor((m) => m.to.includes(api.fixture.users.admin.email)));
    api.mail.clear();
    await forgot(api.app, api.fixture.users.admin.email);
    await api.background.idle();
    const second = linkIn(await api.mail.waitFor((m) => m.to.includes(api.fixture.users.admin.email)));
    expect(second).not.toBe(first);
    const old = await supertest(api.app).post('/api/auth/reset-password').send({ token: first, password: 'a-replaced-password' });
    expect(old.status).toBe(400);
    expect(old.body.error.code).toBe('auth/invalid_token');
    const newest = await supertest(api.app).post('/api/auth/reset-password').send({ token: second, password: 'the-newest-password' });
    expect(newest.status).toBe(200);
  });

  test('should answer before the look-up, token and e-mail, identically for an unknown address, and do that work afterwards', async () => {
    // A mailer that holds every message until released: the answer cannot have waited for it.
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    const sent: OutgoingMail[] = [];
    const mailer: Mailer = {
      enabled: true,
      async send(mail) {
        await gate;
        sent.push(mail);
        return true;
      },
    };
    const { app, background } = api.makeApp({}, { mailer });
    const auditBefore = (await api.database.db.select().from(auditLog)).length;
    const known = await forgot(app, api.fixture.users.partner.email);
    const unknown = await forgot(app, 'no.such.person@test.example');
    expect(sent).toHaveLength(0);
    expect({ status: unknown.status, body: unknown.body, type: unknown.headers['content-type'] }).toEqual({ status: known.status, body: known.body, type: known.headers['content-type'] });
    expect(known.status).toBe(202);

    release();
    await background.idle();
    expect(sent.map((m) => m.to)).toEqual([api.fixture.users.partner.email]);
    expect((await resetTokens(api.fixture.users.partner.id)).filter((t) => t.purpose === 'reset')).toHaveLength(1);
    // Both requests were looked up and logged, the unknown one too.
    const entries = (await api.database.db.select().from(auditLog)).slice(auditBefore).filter((e) => e.action === 'reset_requested');
    expect(entries.map((e) => (e.after as { email: string; accountFound: boolean }))).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ email: api.fixture.users.partner.email, accountFound: true }),
        expect.objectContaining({ email: 'no.such.person@test.example', accountFound: false }),
      ]),
    );
  });
});
