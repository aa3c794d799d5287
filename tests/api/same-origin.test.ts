/**
 * Writes only from the portal's own origin: SameSite=Lax lets another port of the same
 * host send the session cookie, so the Origin (or Referer) of every write is checked.
 */
import { eq } from 'drizzle-orm';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { loadConfig } from '../../apps/api/src/config.ts';
import { sites } from '../../apps/api/src/db/schema/index.ts';
import { startTestApi, type TestApi } from '../support/app.ts';

let api: TestApi;
beforeAll(async () => {
  // PUBLIC_URL is http://portal.test (tests/support/app.ts).
  api = await startTestApi();
});
afterAll(() => api.close());

const siteName = async (id: number) => (await api.database.db.select({ name: sites.name }).from(sites).where(eq(sites.id, id)))[0]!.name;

describe('writes from another origin', () => {
  test('should refuse a signed-in write whose Origin is another port of the same host, and change nothing', async () => {
    const admin = await api.signIn('admin');
    const id = api.fixture.sites.northPark;
    const before = await siteName(id);
    const res = await admin.patch(`/api/sites/${id}`).set('Origin', 'http://portal.test:8080').send({ version: 1, name: 'Taken over' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('request/cross_origin');
    expect(await siteName(id)).toBe(before);
  });

  test('should refuse body-less and multipart POSTs from another site, before reading them', async () => {
    const admin = await api.signIn('admin');
    const signOut = await admin.post('/api/auth/sign-out').set('Origin', 'http://evil.example');
    expect(signOut.status).toBe(403);
    expect((await admin.get('/api/auth/me')).status).toBe(200);
    const upload = await admin.post('/api/imports').set('Origin', 'http://evil.example').field('kind', 'sites_csv').attach('file', Buffer.from('site\n'), 's.csv');
    expect(upload.status).toBe(403);
    expect(upload.body.error.code).toBe('request/cross_origin');
  });

  test('should judge by the Referer when there is no Origin, and refuse an opaque "null" origin', async () => {
    const admin = await api.signIn('admin');
    const viaReferer = await admin.post('/api/auth/sign-out').set('Referer', 'http://127.0.0.1:9999/attack.html');
    expect(viaReferer.status).toBe(403);
    const opaque = await admin.post('/api/auth/sign-out').set('Origin', 'null');
    expect(opaque.status).toBe(403);
    const crossSite = await admin.post('/api/auth/sign-out').set('Sec-Fetch-Site', 'same-site');
    expect(crossSite.status).toBe(403);
  });

  test('should refuse a cross-origin sign-in (login CSRF) and reset request', async () => {
    const signIn = await supertest(api.app).post('/api/auth/sign-in').set('Origin', 'http://evil.example').send({ email: api.fixture.users.head.email, password: 'whatever-it-is' });
    expect(signIn.status).toBe(403);
    const forgot = await supertest(api.app).post('/api/auth/forgot-password').set('Origin', 'http://evil.example').send({ email: api.fixture.users.head.email });
    expect(forgot.status).toBe(403);
  });
});

describe('writes from the portal and from non-browser clients', () => {
  test('should accept writes from PUBLIC_URL’s origin, by Origin or Referer', async () => {
    const admin = await api.signIn('admin');
    const id = api.fixture.sites.southPark;
    const current = (await admin.get(`/api/sites/${id}`)).body.site as { version: number };
    const res = await admin.patch(`/api/sites/${id}`).set('Origin', 'http://portal.test').send({ version: current.version, name: 'Test Park South' });
    expect(res.status).toBe(200);
    const viaReferer = await admin.patch(`/api/sites/${id}`).set('Referer', 'http://portal.test/sites/3').send({ version: current.version + 1, name: 'Test Park South' });
    expect(viaReferer.status).toBe(200);
  });

  test('should accept the Vite dev server’s origin in development only', async () => {
    expect(loadConfig({ NODE_ENV: 'development', PUBLIC_URL: 'http://localhost:5173' }).allowedOrigins).toEqual(['http://localhost:5173', 'http://127.0.0.1:5173']);
    expect(loadConfig({ NODE_ENV: 'production', PUBLIC_URL: 'https://parks.example.org/' }).allowedOrigins).toEqual(['https://parks.example.org']);
    const { app } = api.makeApp({ NODE_ENV: 'production', PUBLIC_URL: 'https://parks.example.org' });
    const fromDev = await supertest(app).post('/api/auth/forgot-password').set('Origin', 'http://127.0.0.1:5173').send({ email: 'x@test.example' });
    expect(fromDev.status).toBe(403);
    const fromPortal = await supertest(app).post('/api/auth/forgot-password').set('Origin', 'https://parks.example.org').send({ email: 'x@test.example' });
    expect(fromPortal.status).toBe(202);
  });

  test('should accept the address the browser used while PUBLIC_URL is unset, but no other port', async () => {
    const { app } = api.makeApp({ NODE_ENV: 'production', PUBLIC_URL: '', PORT: '3000' });
    const same = await supertest(app).post('/api/auth/forgot-password').set('Host', '192.168.1.20:3000').set('Origin', 'http://192.168.1.20:3000').send({ email: 'x@test.example' });
    expect(same.status).toBe(202);
    const otherPort = await supertest(app).post('/api/auth/forgot-password').set('Host', '192.168.1.20:3000').set('Origin', 'http://192.168.1.20:8080').send({ email: 'x@test.example' });
    expect(otherPort.status).toBe(403);
  });

  test('should let requests without Origin or Referer through (curl, scripts; not a browser page) and reads from anywhere', async () => {
    const admin = await api.signIn('admin');
    expect((await admin.get('/api/sites').set('Origin', 'http://evil.example')).status).toBe(200);
    const id = api.fixture.sites.northSchool;
    const current = (await admin.get(`/api/sites/${id}`)).body.site as { version: number };
    expect((await admin.patch(`/api/sites/${id}`).send({ version: current.version, name: 'Test High School' })).status).toBe(200);
  });
});
