import supertest from 'supertest';
import { eq } from 'drizzle-orm';
import { pino } from 'pino';
import { describe, expect, test } from 'vitest';
import { users } from '../../apps/api/src/db/schema/index.ts';
import { createMailer } from '../../apps/api/src/mail/mailer.ts';
import { PASSWORD } from '../support/fixture.ts';
import { useTestApi } from '../support/app.ts';
import { generateAndConfirmWeek } from '../support/weeks.ts';

const api = useTestApi();
/** The same API with no mail set up (no SMTP_HOST). */
const mailOff = () => api.makeApp({}, { mailer: createMailer(null, pino({ level: 'silent' })) }).app;

async function versionOf(id: number) {
  const [row] = await api.database.db.select({ version: users.version }).from(users).where(eq(users.id, id));
  return row!.version;
}

describe('what the API says happened', () => {
  test('should say an invitation was not mailed when mail is off, and carry the link to pass on', async () => {
    const app = mailOff();
    const admin = await api.signIn('admin', app);
    const res = await admin.post('/api/users').send({ email: 'by.hand@test.example', name: 'By Hand', role: 'head' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ emailed: false, mail: 'off' });
    expect(res.body.inviteUrl).toMatch(/\/accept-invite\?token=/);

    const mailed = await (await api.signIn('admin')).post('/api/users').send({ email: 'by.mail@test.example', name: 'By Mail', role: 'head' });
    expect(mailed.body).toMatchObject({ emailed: true, mail: 'sent' });
  });

  test('should tell a deactivated account so after the right password only', async () => {
    const right = await supertest(api.app).post('/api/auth/sign-in').send({ email: api.fixture.users.inactive.email, password: PASSWORD });
    expect(right.status).toBe(403);
    expect(right.body.error.code).toBe('auth/deactivated');
    const wrong = await supertest(api.app).post('/api/auth/sign-in').send({ email: api.fixture.users.inactive.email, password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(wrong.body.error.code).toBe('auth/invalid_credentials');
    const unknown = await supertest(api.app).post('/api/auth/sign-in').send({ email: 'nobody@test.example', password: 'not-the-password' });
    expect(unknown.body.error).toEqual(wrong.body.error);
  });

  test('should tell a person whose role changed why their next request is refused', async () => {
    const admin = await api.signIn('admin');
    const partner = await api.signIn('partner');
    const id = api.fixture.users.partner.id;
    const res = await admin.patch(`/api/users/${id}`).send({ version: await versionOf(id), role: 'head' });
    expect(res.status).toBe(200);
    for (const path of ['/api/fields', '/api/auth/me']) {
      const refused = await partner.get(path);
      expect(refused.status, path).toBe(401);
      expect(refused.body.error.code, path).toBe('auth/access_changed');
      expect(refused.body.error.message).toMatch(/changed what your account may do/);
    }
    // Signing in again starts a clean session with the new role.
    const again = await partner.post('/api/auth/sign-in').send({ email: api.fixture.users.partner.email, password: PASSWORD });
    expect(again.body.user.role).toBe('head');
    expect((await partner.get('/api/auth/me')).status).toBe(200);
    // Another person's sessions and a changed name leave a session alone.
    const crew = await api.signIn('crew');
    const renamed = await admin.patch(`/api/users/${api.fixture.users.crew.id}`).send({ version: await versionOf(api.fixture.users.crew.id), name: 'Crew Renamed' });
    expect(renamed.status).toBe(200);
    expect((await crew.get('/api/auth/me')).status).toBe(200);
  });

  test('should tell a person whose account was deactivated under them', async () => {
    const admin = await api.signIn('admin');
    const victim = await api.signIn('foremanSouth');
    const id = api.fixture.users.foremanSouth.id;
    await admin.patch(`/api/users/${id}`).send({ version: await versionOf(id), active: false });
    const refused = await victim.get('/api/fields');
    expect(refused.status).toBe(401);
    expect(refused.body.error).toMatchObject({ code: 'auth/access_changed', message: expect.stringMatching(/deactivated/) });
    await admin.patch(`/api/users/${id}`).send({ version: await versionOf(id), active: true });
  });

  test('should say why confirming the week sent no e-mail', async () => {
    const app = mailOff();
    const foreman = await api.signIn('foreman', app);
    const res = await generateAndConfirmWeek(foreman, api.fixture.districts.north, '2026-06-08');
    expect(res.status).toBe(200);
    expect(res.body.assigned).toBeGreaterThan(0);
    expect(res.body.emailed).toBe(0);
    expect(res.body.mail).toMatchObject({ crews: 1, sent: 0, mailOff: true, crewsWithoutLead: [], failed: 0 });
  });

  test('should name the crews with no crew-lead account to write to', async () => {
    const foreman = await api.signIn('foreman');
    const crewLead = api.fixture.users.crew.id;
    await api.database.db.update(users).set({ active: false }).where(eq(users.id, crewLead));
    try {
      const res = await generateAndConfirmWeek(foreman, api.fixture.districts.north, '2026-06-15');
      expect(res.body.mail).toMatchObject({ crews: 1, sent: 0, mailOff: false, crewsWithoutLead: ['North Crew'] });
    } finally {
      await api.database.db.update(users).set({ active: true }).where(eq(users.id, crewLead));
    }
  });
});
