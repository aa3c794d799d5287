import supertest from 'supertest';
import { beforeEach, describe, expect, test } from 'vitest';
import { PASSWORD } from '../support/fixture.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();
beforeEach(() => api.mail.clear());

const linkIn = (text: string) => text.match(/https?:\/\/\S+/)![0];

describe('invitation e-mail', () => {
  test('should e-mail the invited person their one-time link', async () => {
    const admin = await api.signIn('admin');
    const res = await admin.post('/api/users').send({ email: 'new.foreman@test.example', name: 'New Foreman', role: 'foreman', districtId: api.fixture.districts.south });
    expect(res.status).toBe(201);
    expect(res.body.emailed).toBe(true);
    const mail = await api.mail.waitFor((m) => m.to.includes('new.foreman@test.example'));
    expect(mail.subject).toBe('Your Swardwise account is ready');
    expect(mail.text).toContain('Hello New Foreman');
    expect(mail.text).toContain('district foreman');
    expect(linkIn(mail.text)).toBe(res.body.inviteUrl);
  });
});

describe('password reset', () => {
  test('should e-mail a reset link that sets a new password once and ends other sessions', async () => {
    const old = await api.signIn('head');
    const res = await supertest(api.app).post('/api/auth/forgot-password').send({ email: 'HEAD@test.example' });
    expect(res.status).toBe(202);
    const mail = await api.mail.waitFor((m) => m.to.includes('head@test.example'));
    expect(mail.subject).toBe('Reset your Swardwise password');
    const url = new URL(linkIn(mail.text));
    expect(url.origin + url.pathname).toBe('http://portal.test/reset-password');
    const token = url.searchParams.get('token')!;

    const guest = supertest.agent(api.app);
    expect((await guest.post('/api/auth/reset-password').send({ token, password: 'short' })).status).toBe(400);
    const done = await guest.post('/api/auth/reset-password').send({ token, password: 'a-brand-new-password' });
    expect(done.status).toBe(200);
    expect(done.body.user.email).toBe('head@test.example');
    expect((await guest.get('/api/auth/me')).status).toBe(200);
    expect((await old.get('/api/auth/me')).status).toBe(401);
    const again = await supertest(api.app).post('/api/auth/reset-password').send({ token, password: 'yet-another-password' });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('auth/invalid_token');
    const signIn = await supertest(api.app).post('/api/auth/sign-in').send({ email: 'head@test.example', password: 'a-brand-new-password' });
    expect(signIn.status).toBe(200);
    const oldPassword = await supertest(api.app).post('/api/auth/sign-in').send({ email: 'head@test.example', password: PASSWORD });
    expect(oldPassword.status).toBe(401);
  });

  test('should answer an unknown address the same way and send nothing', async () => {
    const res = await supertest(api.app).post('/api/auth/forgot-password').send({ email: 'nobody@test.example' });
    expect(res.status).toBe(202);
    await new Promise((r) => setTimeout(r, 200));
    expect(api.mail.messages()).toHaveLength(0);
  });

  test('should refuse a malformed address with 400', async () => {
    const res = await supertest(api.app).post('/api/auth/forgot-password').send({ email: 'nope' });
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues[0].path).toBe('body.email');
  });
});

describe('developer mail page', () => {
  test('should list received messages to the admin only', async () => {
    const admin = await api.signIn('admin');
    await admin.post('/api/users').send({ email: 'listed@test.example', name: 'Listed Person', role: 'head' });
    await api.mail.waitFor((m) => m.to.includes('listed@test.example'));
    const list = await admin.get('/api/dev/mail');
    expect(list.status).toBe(200);
    expect(list.body.items[0]).toMatchObject({ to: ['listed@test.example'], subject: 'Your Swardwise account is ready' });
    const foreman = await api.signIn('foreman');
    expect((await foreman.get('/api/dev/mail')).status).toBe(403);
  });
});
