import { describe, expect, test } from 'vitest';
import { giveWork } from '../support/fixture.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();

const ids = (res: { body: { items: { id: number }[] } }) => res.body.items.map((r) => r.id).sort((a, b) => a - b);

describe('reading by role', () => {
  test('should show the head every district, site and field', async () => {
    const agent = await api.signIn('head');
    const { fields, sites, districts } = api.fixture;
    expect(ids(await agent.get('/api/districts'))).toEqual([districts.north, districts.south].sort((a, b) => a - b));
    expect(ids(await agent.get('/api/sites'))).toHaveLength(3);
    expect(ids(await agent.get('/api/fields'))).toEqual(Object.values(fields).sort((a, b) => a - b));
    expect((await agent.get(`/api/sites/${sites.southPark}`)).status).toBe(200);
  });

  test('should show a foreman only his own district’s rows', async () => {
    const agent = await api.signIn('foreman');
    const { fields, sites, districts } = api.fixture;
    expect(ids(await agent.get('/api/districts'))).toEqual([districts.north]);
    expect(ids(await agent.get('/api/sites'))).toEqual([sites.northPark, sites.northSchool].sort((a, b) => a - b));
    expect(ids(await agent.get('/api/fields'))).toEqual([fields.northSoccer, fields.northLawn, fields.northSchoolFootball].sort((a, b) => a - b));
    // Asking for the other district by filter gives nothing, not its rows.
    expect(ids(await agent.get(`/api/fields?districtId=${districts.south}`))).toEqual([]);
    const other = await agent.get(`/api/fields/${fields.southBaseball}`);
    expect(other.status).toBe(403);
    expect(other.body.error.code).toBe('auth/forbidden');
    expect((await agent.get(`/api/sites/${sites.southPark}`)).status).toBe(403);
    expect(ids(await agent.get('/api/crews'))).toEqual([api.fixture.crews.north]);
  });

  test('should show a crew lead only the fields of his crew’s recent and coming work, and only his crew', async () => {
    const agent = await api.signIn('crew');
    const { fields: f, crews } = api.fixture;
    expect(ids(await agent.get('/api/fields'))).toEqual([]);
    await giveWork(api.database.db, f.northSoccer, crews.north, 2);
    await giveWork(api.database.db, f.northLawn, crews.north, -30); // long past: not his work now
    await giveWork(api.database.db, f.northSchoolFootball, crews.south, 0); // another crew's
    expect(ids(await agent.get('/api/fields'))).toEqual([f.northSoccer]);
    expect((await agent.get(`/api/fields/${f.northSoccer}`)).status).toBe(200);
    expect((await agent.get(`/api/fields/${f.northLawn}`)).status).toBe(403);
    expect(ids(await agent.get('/api/crews'))).toEqual([api.fixture.crews.north]);
    expect((await agent.get(`/api/fields/${api.fixture.fields.southBaseball}`)).status).toBe(403);
    expect((await agent.get('/api/users')).status).toBe(403);
  });

  test('should show a partner only the fields of his linked site', async () => {
    const agent = await api.signIn('partner');
    const { fields, sites } = api.fixture;
    expect(ids(await agent.get('/api/sites'))).toEqual([sites.northSchool]);
    expect(ids(await agent.get('/api/fields'))).toEqual([fields.northSchoolFootball]);
    expect((await agent.get(`/api/fields/${fields.northSoccer}`)).status).toBe(403);
    expect((await agent.get(`/api/sites/${sites.northPark}`)).status).toBe(403);
    const own = await agent.get(`/api/sites/${sites.northSchool}`);
    expect(own.status).toBe(200);
    expect(own.body.fields.map((f: { id: number }) => f.id)).toEqual([fields.northSchoolFootball]);
    expect((await agent.get('/api/districts')).status).toBe(403);
    expect((await agent.get('/api/crews')).status).toBe(403);
    expect((await agent.get('/api/audit')).status).toBe(403);
  });

  test('should return a field with its outline and geodesic area', async () => {
    const agent = await api.signIn('foreman');
    const res = await agent.get(`/api/fields/${api.fixture.fields.northSoccer}`);
    expect(res.status).toBe(200);
    expect(res.body.field.geometry.type).toBe('Polygon');
    // 105 m × 68 m = 7,140 m² (IFAB Law 1 dimensions of the fixture rectangle)
    expect(res.body.field.areaM2).toBeGreaterThan(7140 * 0.995);
    expect(res.body.field.areaM2).toBeLessThan(7140 * 1.005);
    expect(res.body.field).toMatchObject({ districtId: api.fixture.districts.north, siteName: 'Test Park North', version: 1 });
  });

  test('should refuse a malformed id with 400 and an unknown one with 404', async () => {
    const agent = await api.signIn('admin');
    const bad = await agent.get('/api/fields/abc');
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.issues[0].path).toBe('params.id');
    const missing = await agent.get('/api/fields/99999');
    expect(missing.status).toBe(404);
    expect(missing.body.error.code).toBe('field/not_found');
  });
});
