import supertest from 'supertest';
import { describe, expect, test } from 'vitest';
import { sessions } from '../../apps/api/src/db/schema/index.ts';
import { PASSWORD } from '../support/fixture.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi({ LOGIN_ATTEMPTS: '5' });

describe('sign-in', () => {
  test('should sign in with the right password and set an httpOnly SameSite cookie', async () => {
    const res = await supertest(api.app).post('/api/auth/sign-in').send({ email: 'FOREMAN@test.example', password: PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: 'foreman@test.example', role: 'foreman', districtId: api.fixture.districts.north });
    expect(res.body.user.passwordHash).toBeUndefined();
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/swardwise\.sid=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });

  test('should store the session in the database and answer /me with the user', async () => {
    const agent = await api.signIn('head');
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.role).toBe('head');
    const rows = await api.database.db.select().from(sessions);
    expect(rows.some((r) => r.userId === api.fixture.users.head.id)).toBe(true);
  });

  test('should refuse a wrong password with a clear message and no cookie', async () => {
    const res = await supertest(api.app).post('/api/auth/sign-in').send({ email: 'head@test.example', password: 'wrong-password' });
    expect(res.status).toBe(401);
    expect(res.body.error).toEqual({ code: 'auth/invalid_credentials', message: 'The e-mail or password is not right' });
    expect(res.headers['set-cookie']).toBeUndefined();
  });

  test('should give an unknown e-mail the same answer as a wrong password', async () => {
    const res = await supertest(api.app).post('/api/auth/sign-in').send({ email: 'nobody@test.example', password: PASSWORD });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('auth/invalid_credentials');
  });

  test('should refuse a deactivated account, saying so after the right password', async () => {
    const res = await supertest(api.app).post('/api/auth/sign-in').send({ email: 'inactive@test.example', password: PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('auth/deactivated');
  });

  test('should refuse a malformed body with field-level issues', async () => {
    const res = await supertest(api.app).post('/api/auth/sign-in').send({ email: 'not-an-email' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('request/invalid');
    const paths = res.body.error.details.issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['body.email', 'body.password']));
  });

  test('should refuse invalid JSON with a 400, not a 500', async () => {
    const res = await supertest(api.app).post('/api/auth/sign-in').set('content-type', 'application/json').send('{"email":');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('request/malformed_json');
  });

  test('should rate-limit repeated failed sign-ins for one account', async () => {
    const attempt = () => supertest(api.app).post('/api/auth/sign-in').send({ email: 'crew@test.example', password: 'guess-guess' });
    const statuses: number[] = [];
    for (let i = 0; i < 6; i += 1) statuses.push((await attempt()).status);
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    expect(statuses[5]).toBe(429);
    const limited = await attempt();
    expect(limited.body.error.code).toBe('auth/rate_limited');
    // Even the right password waits out the window.
    const right = await supertest(api.app).post('/api/auth/sign-in').send({ email: 'crew@test.example', password: PASSWORD });
    expect(right.status).toBe(429);
    // Another account from the same address is not locked out.
    const other = await supertest(api.app).post('/api/auth/sign-in').send({ email: 'admin@test.example', password: PASSWORD });
    expect(other.status).toBe(200);
  });
});

describe('sign-out', () => {
  test('should end the session so the cookie no longer works', async () => {
    const agent = await api.signIn('partner');
    expect((await agent.get('/api/auth/me')).status).toBe(200);
    const out = await agent.post('/api/auth/sign-out');
    expect(out.status).toBe(204);
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(401);
    expect(me.body.error.code).toBe('auth/unauthenticated');
  });

  test('should refuse every data route without a session', async () => {
    for (const path of ['/api/fields', '/api/sites', '/api/districts', '/api/users', '/api/crews', '/api/audit']) {
      const res = await supertest(api.app).get(path);
      expect(res.status, path).toBe(401);
    }
  });
});

describe('health and unknown routes', () => {
  test('should answer health without signing in', async () => {
    const res = await supertest(api.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok' });
  });

  test('should answer an unknown API route with 404 in the error shape', async () => {
    const agent = await api.signIn('admin');
    const res = await agent.get('/api/nothing-here');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('route/not_found');
  });

  test('should send helmet security headers', async () => {
    const res = await supertest(api.app).get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toBeDefined();
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
