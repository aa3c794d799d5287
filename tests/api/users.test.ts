import supertest from 'supertest';
import { eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { users } from '../../apps/api/src/db/schema/index.ts';
import { PASSWORD } from '../support/fixture.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();

describe('user administration', () => {
  test('should let only the admin list users', async () => {
    const admin = await api.signIn('admin');
    const res = await admin.get('/api/users');
    expect(res.status).toBe(200);
    expect(res.body.items.length).toBe(7);
    expect(res.body.items[0].passwordHash).toBeUndefined();
    const partner = res.body.items.find((u: { role: string }) => u.role === 'partner');
    expect(partner.siteIds).toEqual([api.fixture.sites.northSchool]);
    for (const who of ['head', 'crew', 'partner'] as const) {
      expect((await (await api.signIn(who)).get('/api/users')).status, who).toBe(403);
    }
  });

  test('should invite a user who then sets a password and signs in', async () => {
    const admin = await api.signIn('admin');
    const res = await admin
      .post('/api/users')
      .send({ email: 'New.Partner@Test.example', name: 'New Partner', role: 'partner', siteIds: [api.fixture.sites.southPark] });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email: 'new.partner@test.example', role: 'partner', pendingInvite: true, siteIds: [api.fixture.sites.southPark] });
    const token = new URL(res.body.inviteUrl).searchParams.get('token')!;
    expect(res.body.inviteUrl).toMatch(/^http:\/\/portal\.test\/accept-invite\?token=/);

    const guest = supertest.agent(api.app);
    expect((await guest.post('/api/auth/accept-invite').send({ token, password: 'short' })).status).toBe(400);
    const accepted = await guest.post('/api/auth/accept-invite').send({ token, password: 'a-long-new-password' });
    expect(accepted.status).toBe(200);
    const fieldsSeen = await guest.get('/api/fields');
    expect(fieldsSeen.body.items.map((f: { id: number }) => f.id)).toEqual([api.fixture.fields.southBaseball]);
    // The link works once.
    expect((await supertest(api.app).post('/api/auth/accept-invite').send({ token, password: 'another-password' })).status).toBe(400);
  });

  test('should refuse an invite with a missing scope or a taken e-mail', async () => {
    const admin = await api.signIn('admin');
    const noDistrict = await admin.post('/api/users').send({ email: 'f2@test.example', name: 'Foreman Two', role: 'foreman' });
    expect(noDistrict.status).toBe(400);
    expect(noDistrict.body.error.details.issues[0]).toEqual({ path: 'body.districtId', message: 'a foreman must be bound to a district' });
    const taken = await admin.post('/api/users').send({ email: 'head@test.example', name: 'Twin', role: 'head' });
    expect(taken.status).toBe(409);
    expect(taken.body.error.code).toBe('user/email_taken');
    const badCrew = await admin.post('/api/users').send({ email: 'c2@test.example', name: 'Crew Two', role: 'crew', crewId: 9999 });
    expect(badCrew.status).toBe(400);
    expect(await api.database.db.select().from(users).where(eq(users.email, 'c2@test.example'))).toHaveLength(0);
  });

  test('should refuse invitations by anyone but the admin', async () => {
    const head = await api.signIn('head');
    const res = await head.post('/api/users').send({ email: 'x@test.example', name: 'Someone', role: 'head' });
    expect(res.status).toBe(403);
  });

  test('should deactivate a user, end their sessions and refuse their sign-in', async () => {
    const admin = await api.signIn('admin');
    const victim = await api.signIn('foremanSouth');
    const id = api.fixture.users.foremanSouth.id;
    const [row] = await api.database.db.select().from(users).where(eq(users.id, id));
    const res = await admin.patch(`/api/users/${id}`).send({ version: row!.version, role: 'foreman', districtId: api.fixture.districts.south, active: false });
    expect(res.status).toBe(200);
    expect(res.body.user.active).toBe(false);
    expect((await victim.get('/api/fields')).status).toBe(401);
    const again = await supertest(api.app).post('/api/auth/sign-in').send({ email: api.fixture.users.foremanSouth.email, password: PASSWORD });
    expect(again.status).toBe(403);
    expect(again.body.error.code).toBe('auth/deactivated');
  });

  test('should move a crew lead to a crew and take the crew’s district', async () => {
    const admin = await api.signIn('admin');
    const id = api.fixture.users.crew.id;
    const [row] = await api.database.db.select().from(users).where(eq(users.id, id));
    const res = await admin.patch(`/api/users/${id}`).send({ version: row!.version, role: 'crew', crewId: api.fixture.crews.south });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ crewId: api.fixture.crews.south, districtId: api.fixture.districts.south });
    const stale = await admin.patch(`/api/users/${id}`).send({ version: row!.version, role: 'crew', crewId: api.fixture.crews.north });
    expect(stale.status).toBe(409);
  });

  test('should not let the admin lock himself out', async () => {
    const admin = await api.signIn('admin');
    const id = api.fixture.users.admin.id;
    const [row] = await api.database.db.select().from(users).where(eq(users.id, id));
    const res = await admin.patch(`/api/users/${id}`).send({ version: row!.version, role: 'admin', active: false });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('user/self_lockout');
  });

  test('should let any user change their own unit preference', async () => {
    const crew = await api.signIn('partner');
    const me = await crew.get('/api/auth/me');
    const res = await crew.patch('/api/auth/me').send({ version: me.body.user.version, units: 'metric' });
    expect(res.status).toBe(200);
    expect(res.body.user.units).toBe('metric');
    expect((await crew.patch('/api/auth/me').send({ version: me.body.user.version, units: 'cubits' })).status).toBe(400);
  });
});
