/**
 * The session cookie and the security headers: behind an HTTPS proxy the cookie is
 * `__Host-` prefixed, Secure, HttpOnly, SameSite=Lax, for path / and without a Domain; over
 * plain http it keeps working without Secure. The content security policy allows no inline
 * script or style.
 */
import supertest from 'supertest';
import { describe, expect, test } from 'vitest';
import { COOKIE_NAME, SECURE_COOKIE_NAME } from '../../apps/api/src/app.ts';
import { useTestApi } from '../support/app.ts';
import { PASSWORD } from '../support/fixture.ts';

const api = useTestApi();

function attributes(setCookie: string): { name: string; value: string; attrs: Map<string, string> } {
  const [pair, ...rest] = setCookie.split(';').map((p) => p.trim());
  const [name, value] = pair!.split('=') as [string, string];
  return { name, value, attrs: new Map(rest.map((a) => [a.split('=')[0]!.toLowerCase(), a.split('=')[1] ?? ''])) };
}

describe('the session cookie', () => {
  test('should be __Host-, Secure, HttpOnly, SameSite=Lax, path / and without Domain behind an HTTPS proxy', async () => {
    const { app } = api.makeApp({ COOKIE_SECURE: 'true', TRUST_PROXY: 'loopback' });
    const res = await supertest(app).post('/api/auth/sign-in').set('X-Forwarded-Proto', 'https').send({ email: api.fixture.users.head.email, password: PASSWORD });
    expect(res.status).toBe(200);
    const cookies = [res.headers['set-cookie'] ?? []].flat();
    expect(cookies).toHaveLength(1);
    const cookie = attributes(cookies[0]!);
    expect(cookie.name).toBe(SECURE_COOKIE_NAME);
    expect(cookie.name.startsWith('__Host-')).toBe(true);
    expect(cookie.attrs.has('secure')).toBe(true);
    expect(cookie.attrs.has('httponly')).toBe(true);
    expect(cookie.attrs.get('samesite')).toBe('Lax');
    expect(cookie.attrs.get('path')).toBe('/');
    expect(cookie.attrs.has('domain')).toBe(false);
    // HSTS goes with HTTPS.
    expect(res.headers['strict-transport-security']).toMatch(/max-age=\d+/);

    // The cookie signs the caller in, and signing out clears it with the same attributes
    // (a browser ignores a clearing Set-Cookie for a __Host- cookie that is not Secure).
    const me = await supertest(app).get('/api/auth/me').set('X-Forwarded-Proto', 'https').set('Cookie', `${cookie.name}=${cookie.value}`);
    expect(me.status).toBe(200);
    const out = await supertest(app).post('/api/auth/sign-out').set('X-Forwarded-Proto', 'https').set('Origin', 'http://portal.test').set('Cookie', `${cookie.name}=${cookie.value}`);
    expect(out.status).toBe(204);
    const cleared = attributes([out.headers['set-cookie'] ?? []].flat()[0] ?? '');
    expect(cleared.name).toBe(SECURE_COOKIE_NAME);
    expect(cleared.attrs.has('secure')).toBe(true);
    expect(cleared.attrs.get('path')).toBe('/');
  });

  test('should not be set on a plain-http request to an HTTPS deployment', async () => {
    const { app } = api.makeApp({ COOKIE_SECURE: 'true', TRUST_PROXY: 'loopback' });
    const res = await supertest(app).post('/api/auth/sign-in').send({ email: api.fixture.users.head.email, password: PASSWORD });
    expect(res.headers['set-cookie']).toBeUndefined();
  });

  test('should keep the plain name, HttpOnly and SameSite=Lax without Secure on a plain-http installation', async () => {
    const res = await supertest(api.app).post('/api/auth/sign-in').send({ email: api.fixture.users.head.email, password: PASSWORD });
    const cookie = attributes([res.headers['set-cookie'] ?? []].flat()[0]!);
    expect(cookie.name).toBe(COOKIE_NAME);
    expect(cookie.attrs.has('secure')).toBe(false);
    expect(cookie.attrs.has('httponly')).toBe(true);
    expect(cookie.attrs.get('samesite')).toBe('Lax');
  });
});
