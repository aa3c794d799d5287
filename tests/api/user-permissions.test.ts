import type supertest from 'supertest';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { userSites, users } from '../../apps/api/src/db/schema/index.ts';
import { startTestApi, type TestApi } from '../support/app.ts';

/**
 * An account's role, scope (district, crew, sites) and `active` are the administrator's: a
 * user's own change may touch their name and units, nothing else.
 */
let api: TestApi;
const agents: Partial<Record<Who, ReturnType<typeof supertest.agent>>> = {};
type Who = 'admin' | 'head' | 'foreman' | 'crew' | 'partner';
const ROLES: Who[] = ['head', 'foreman', 'crew', 'partner'];

beforeAll(async () => {
  api = await startTestApi();
  for (const who of ['admin', ...ROLES] as Who[]) agents[who] = await api.signIn(who);
});
afterAll(() => api.close());

async function account(id: number) {
  const [row] = await api.database.db.select().from(users).where(eq(users.id, id));
  const sites = await api.database.db.select({ siteId: userSites.siteId }).from(userSites).where(eq(userSites.userId, id));
  return { role: row!.role, districtId: row!.districtId, crewId: row!.crewId, active: row!.active, version: row!.version, name: row!.name, units: row!.units, siteIds: sites.map((s) => s.siteId).sort() };
}

/** Each permission attribute, set to something that would widen the caller's scope. */
const escalations = (): Record<string, Record<string, unknown>> => ({
  role: { role: 'admin' },
  districtId: { districtId: api.fixture.districts.south },
  crewId: { crewId: api.fixture.crews.south },
  siteIds: { siteIds: [api.fixture.sites.southPark, api.fixture.sites.northPark] },
  active: { active: true },
});
const KEYS = ['role', 'districtId', 'crewId', 'siteIds', 'active'] as const;

describe('changing one’s own account', () => {
  test.each(ROLES.flatMap((who) => KEYS.map((key) => [who, key] as const)))('should refuse a %s changing his own %s with 403 and change nothing', async (who, key) => {
    const id = api.fixture.users[who].id;
    const before = await account(id);
    const res = await agents[who]!.patch(`/api/users/${id}`).send({ version: before.version, ...escalations()[key] });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('user/forbidden_attribute');
    expect(res.body.error.details.issues).toEqual([{ path: `body.${key}`, message: 'only an administrator may change this' }]);
    expect(await account(id)).toEqual(before);
  });

  test.each(ROLES)('should refuse a %s sending his own role and a scope along with his name, and change nothing', async (who) => {
    const id = api.fixture.users[who].id;
    const before = await account(id);
    const res = await agents[who]!.patch(`/api/users/${id}`).send({ version: before.version, name: 'Renamed', role: who, districtId: api.fixture.districts.south, crewId: api.fixture.crews.south, siteIds: [api.fixture.sites.southPark] });
    expect(res.status).toBe(403);
    expect(await account(id)).toEqual(before);
  });

  test('should not let a foreman move himself into another district (the review’s case)', async () => {
    const id = api.fixture.users.foreman.id;
    const before = await account(id);
    const res = await agents.foreman!.patch(`/api/users/${id}`).send({ version: before.version, role: 'foreman', districtId: api.fixture.districts.south });
    expect(res.status).toBe(403);
    const seen = await agents.foreman!.get('/api/fields');
    expect(seen.body.items.map((f: { id: number }) => f.id)).not.toContain(api.fixture.fields.southBaseball);
    expect((await agents.foreman!.get(`/api/fields/${api.fixture.fields.southBaseball}`)).status).toBe(403);
  });

  test.each([...ROLES, 'admin'] as Who[])('should let a %s change his own name and units', async (who) => {
    const id = api.fixture.users[who].id;
    const before = await account(id);
    const named = await agents[who]!.patch(`/api/users/${id}`).send({ version: before.version, name: `Renamed ${who}` });
    expect(named.status).toBe(200);
    const units = await agents[who]!.patch(`/api/users/${id}`).send({ version: before.version + 1, units: before.units === 'metric' ? 'imperial' : 'metric' });
    expect(units.status).toBe(200);
    const after = await account(id);
    expect(after).toEqual({ ...before, name: `Renamed ${who}`, units: before.units === 'metric' ? 'imperial' : 'metric', version: before.version + 2 });
  });

  test.each(ROLES)('should refuse a %s changing another person’s account', async (who) => {
    const other = api.fixture.users.foremanSouth.id;
    const before = await account(other);
    const res = await agents[who]!.patch(`/api/users/${other}`).send({ version: before.version, name: 'Someone else' });
    expect(res.status).toBe(403);
    expect(await account(other)).toEqual(before);
  });
});

describe('permission changes by the administrator', () => {
  test('should move a foreman to another district with the scope alone, and audit it as a permission change', async () => {
    const id = api.fixture.users.foremanSouth.id;
    const before = await account(id);
    const res = await agents.admin!.patch(`/api/users/${id}`).send({ version: before.version, districtId: api.fixture.districts.north });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ role: 'foreman', districtId: api.fixture.districts.north });
    const log = await agents.admin!.get(`/api/audit?entity=user_permissions&entityId=${id}`);
    expect(log.body.items[0]).toMatchObject({
      action: 'update',
      actorId: api.fixture.users.admin.id,
      before: { role: 'foreman', districtId: api.fixture.districts.south },
      after: { role: 'foreman', districtId: api.fixture.districts.north },
    });
  });

  test('should write a role change into the audit log as its own entry, readable later', async () => {
    const id = api.fixture.users.foremanSouth.id;
    const before = await account(id);
    const res = await agents.admin!.patch(`/api/users/${id}`).send({ version: before.version, role: 'partner', siteIds: [api.fixture.sites.southPark] });
    expect(res.status).toBe(200);
    const log = await agents.admin!.get(`/api/audit?entity=user_permissions&entityId=${id}`);
    expect(log.status).toBe(200);
    expect(log.body.items[0]).toMatchObject({
      action: 'update',
      entity: 'user_permissions',
      entityId: id,
      actorId: api.fixture.users.admin.id,
      before: { role: 'foreman', districtId: before.districtId, crewId: null, siteIds: [], active: true },
      after: { role: 'partner', districtId: null, crewId: null, siteIds: [api.fixture.sites.southPark], active: true },
    });
    // The head reads the department's history too.
    const headLog = await agents.head!.get(`/api/audit?entity=user_permissions&entityId=${id}`);
    expect(headLog.body.items.map((e: { after: { role: string } }) => e.after.role)).toContain('partner');
  });

  test('should write no permission entry for a change of name only', async () => {
    const id = api.fixture.users.crew.id;
    const count = async () => (await agents.admin!.get(`/api/audit?entity=user_permissions&entityId=${id}`)).body.items.length;
    const n = await count();
    const before = await account(id);
    expect((await agents.admin!.patch(`/api/users/${id}`).send({ version: before.version, name: 'Crew Renamed' })).status).toBe(200);
    expect(await count()).toBe(n);
  });

  test('should record an invitation’s role and scope as a permission entry', async () => {
    const res = await agents.admin!.post('/api/users').send({ email: 'grant@test.example', name: 'Granted Partner', role: 'partner', siteIds: [api.fixture.sites.northSchool] });
    expect(res.status).toBe(201);
    const log = await agents.admin!.get(`/api/audit?entity=user_permissions&entityId=${res.body.user.id}`);
    expect(log.body.items).toHaveLength(1);
    expect(log.body.items[0]).toMatchObject({ action: 'create', before: null, after: { role: 'partner', siteIds: [api.fixture.sites.northSchool] } });
  });

  test('should still refuse an incomplete scope from the administrator with 400', async () => {
    const id = api.fixture.users.crew.id;
    const before = await account(id);
    const res = await agents.admin!.patch(`/api/users/${id}`).send({ version: before.version, role: 'foreman' });
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues[0]).toEqual({ path: 'body.districtId', message: 'a foreman must be bound to a district' });
    const cleared = await agents.admin!.patch(`/api/users/${id}`).send({ version: before.version, crewId: null });
    expect(cleared.status).toBe(400);
    expect(await account(id)).toEqual(before);
  });
});
