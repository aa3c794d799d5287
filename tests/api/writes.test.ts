import { and, eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { auditLog, fields, sites } from '../../apps/api/src/db/schema/index.ts';
import { fieldBody, rectangle } from '../support/fixture.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();

const fieldRow = async (id: number) => (await api.database.db.select().from(fields).where(eq(fields.id, id)))[0]!;

describe('writes across districts', () => {
  test('should refuse a foreman’s write to another district with 403 and change nothing', async () => {
    const agent = await api.signIn('foreman');
    const id = api.fixture.fields.southBaseball;
    const before = await fieldRow(id);
    const res = await agent.patch(`/api/fields/${id}`).send({ version: before.version, maintenanceLevel: 1, name: 'Taken over' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('auth/forbidden');
    expect(await fieldRow(id)).toEqual(before);
    const site = await agent.patch(`/api/sites/${api.fixture.sites.southPark}`).send({ version: 1, name: 'Not mine' });
    expect(site.status).toBe(403);
    const created = await agent.post('/api/fields').send(fieldBody(api.fixture.sites.southPark, 'Sneaky', rectangle(37.52, -66.47, 60, 90)));
    expect(created.status).toBe(403);
    const count = await api.database.db.select().from(fields).where(eq(fields.name, 'Sneaky'));
    expect(count).toHaveLength(0);
  });

  test('should refuse a foreman moving his field into another district', async () => {
    const agent = await api.signIn('foreman');
    const id = api.fixture.fields.northLawn;
    const before = await fieldRow(id);
    const res = await agent.patch(`/api/fields/${id}`).send({ version: before.version, siteId: api.fixture.sites.southPark });
    expect(res.status).toBe(403);
    expect(await fieldRow(id)).toEqual(before);
  });

  test('should refuse writes by crew leads and partners', async () => {
    for (const who of ['crew', 'partner'] as const) {
      const agent = await api.signIn(who);
      const id = api.fixture.fields.northSchoolFootball;
      const before = await fieldRow(id);
      const res = await agent.patch(`/api/fields/${id}`).send({ version: before.version, status: 'closed' });
      expect(res.status, who).toBe(403);
      expect(await fieldRow(id)).toEqual(before);
    }
  });
});

describe('validation', () => {
  test('should refuse bad bodies with 400, name each bad field, and write nothing', async () => {
    const agent = await api.signIn('foreman');
    const id = api.fixture.fields.northSoccer;
    const before = await fieldRow(id);
    const audits = (await api.database.db.select().from(auditLog)).length;
    const res = await agent.patch(`/api/fields/${id}`).send({ version: before.version, maintenanceLevel: 7, sport: 'quidditch', hocOverrideMm: -5 });
    expect(res.status).toBe(400);
    const paths = res.body.error.details.issues.map((i: { path: string }) => i.path).sort();
    expect(paths).toEqual(['body.hocOverrideMm', 'body.maintenanceLevel', 'body.sport']);
    expect(res.body.error.details.issues.find((i: { path: string }) => i.path === 'body.sport').message).toMatch(/soccer/);
    expect(await fieldRow(id)).toEqual(before);
    expect((await api.database.db.select().from(auditLog)).length).toBe(audits);
  });

  test('should refuse an open polygon ring', async () => {
    const agent = await api.signIn('foreman');
    const res = await agent.post('/api/fields').send(fieldBody(api.fixture.sites.northPark, 'Open ring', { type: 'Polygon', coordinates: [[[-66.48, 37.62], [-66.47, 37.62], [-66.47, 37.63], [-66.48, 37.631]]] }));
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues[0].message).toMatch(/end where it starts/);
  });

  test('should refuse an update without a version', async () => {
    const agent = await api.signIn('foreman');
    const res = await agent.patch(`/api/fields/${api.fixture.fields.northSoccer}`).send({ name: 'No version' });
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues[0].path).toBe('body.version');
  });
});

describe('optimistic concurrency', () => {
  test('should refuse a stale version with 409 and keep the first writer’s change', async () => {
    const first = await api.signIn('foreman');
    const second = await api.signIn('admin');
    const id = api.fixture.fields.northLawn;
    const { version } = await fieldRow(id);
    const listed = async () => (await first.get('/api/fields')).body.items.find((f: { id: number }) => f.id === id);
    expect((await listed()).status).toBe('open');
    const ok = await first.patch(`/api/fields/${id}`).send({ version, status: 'restricted', statusNote: 'Wet after storms' });
    expect(ok.status).toBe(200);
    // The cached list follows the write at once.
    expect(await listed()).toMatchObject({ status: 'restricted', statusNote: 'Wet after storms', version: version + 1 });
    expect(ok.body.field.version).toBe(version + 1);
    const stale = await second.patch(`/api/fields/${id}`).send({ version, status: 'closed' });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('field/version_conflict');
    const row = await fieldRow(id);
    expect(row.status).toBe('restricted');
    expect(row.version).toBe(version + 1);
  });

  test('should refuse a stale site version too', async () => {
    const agent = await api.signIn('foreman');
    const id = api.fixture.sites.northPark;
    const [site] = await api.database.db.select().from(sites).where(eq(sites.id, id));
    expect((await agent.patch(`/api/sites/${id}`).send({ version: site!.version, notes: 'Gate code at the office' })).status).toBe(200);
    expect((await agent.patch(`/api/sites/${id}`).send({ version: site!.version, notes: 'stale' })).status).toBe(409);
  });
});

describe('audit log', () => {
  test('should record who changed what with the row before and after', async () => {
    const agent = await api.signIn('foreman');
    const id = api.fixture.fields.northSoccer;
    const { version } = await fieldRow(id);
    const geometry = rectangle(37.62, -66.48, 64, 100);
    const res = await agent.patch(`/api/fields/${id}`).send({ version, maintenanceLevel: 1, geometry });
    expect(res.status).toBe(200);
    // area follows the new outline (100 m × 64 m)
    expect(Math.abs(res.body.field.areaM2 - 6400) / 6400).toBeLessThan(0.005);
    const [entry] = await api.database.db.select().from(auditLog).where(eq(auditLog.entityId, id)).orderBy(auditLog.id);
    const entries = await api.database.db.select().from(auditLog).where(eq(auditLog.entity, 'field')).orderBy(auditLog.id);
    const last = entries.filter((e) => e.entityId === id).at(-1)!;
    expect(entry).toBeDefined();
    expect(last).toMatchObject({ actorId: api.fixture.users.foreman.id, action: 'update', districtId: api.fixture.districts.north });
    expect(last.before).toMatchObject({ maintenanceLevel: 2 });
    expect(last.after).toMatchObject({ maintenanceLevel: 1 });
    const head = await api.signIn('head');
    const list = await head.get('/api/audit?entity=field');
    expect(list.status).toBe(200);
    expect(list.body.items[0]).toMatchObject({ entity: 'field', entityId: id, actorName: 'Test foreman' });
    // In words: the field by its name and site, the level by its name, the outline without coordinates.
    const site = (await api.database.db.select().from(sites).where(eq(sites.id, (await fieldRow(id)).siteId)))[0]!;
    const field = await fieldRow(id);
    expect(list.body.items[0].entityName).toBe(`${field.name} (${site.name})`);
    const changes = list.body.items[0].changes as { attribute: string; label: string; before: string; after: string }[];
    expect(changes.find((c) => c.attribute === 'maintenanceLevel')).toEqual({ attribute: 'maintenanceLevel', label: 'Maintenance level', before: 'Competition', after: 'Showcase' });
    expect(changes.map((c) => c.attribute)).not.toContain('version');
    expect(changes.map((c) => c.attribute)).not.toContain('updatedAt');
  });

  test('should show a foreman only his district’s history', async () => {
    const south = await api.signIn('foremanSouth');
    const res = await south.get('/api/audit');
    expect(res.status).toBe(200);
    expect(res.body.items.every((e: { districtId: number }) => e.districtId === api.fixture.districts.south)).toBe(true);
  });
});

describe('deleting a field', () => {
  test('should let a foreman delete his own field with its version, audited, and refuse a stale version or another district', async () => {
    const agent = await api.signIn('foreman');
    const created = await agent.post('/api/fields').send(fieldBody(api.fixture.sites.northPark, 'Temporary pitch', rectangle(37.623, -66.476, 45, 64)));
    expect(created.status).toBe(201);
    const id = created.body.field.id;
    expect((await agent.delete(`/api/fields/${id}?version=2`)).status).toBe(409);
    expect((await agent.delete(`/api/fields/${id}`)).status).toBe(400);
    expect((await agent.delete(`/api/fields/${api.fixture.fields.southBaseball}?version=1`)).status).toBe(403);
    expect((await agent.delete(`/api/fields/${id}?version=1`)).status).toBe(204);
    expect(await api.database.db.select().from(fields).where(eq(fields.id, id))).toHaveLength(0);
    const entries = await api.database.db.select().from(auditLog).where(and(eq(auditLog.entity, 'field'), eq(auditLog.entityId, id))).orderBy(auditLog.id);
    expect(entries.map((e) => e.action)).toEqual(['create', 'delete']);
    expect(entries[1]!.before).toMatchObject({ name: 'Temporary pitch' });
    expect((await agent.get(`/api/fields/${id}`)).status).toBe(404);
  });
});
