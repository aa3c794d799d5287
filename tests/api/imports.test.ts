import { eq, sql } from 'drizzle-orm';
import supertest from 'supertest';
import { describe, expect, test } from 'vitest';
import { auditLog, fields, imports, sites } from '../../apps/api/src/db/schema/index.ts';
import { rectangle } from '../support/fixture.ts';
import { type TestApi, useTestApi } from '../support/app.ts';

const api = useTestApi();

const count = async (table: typeof sites | typeof fields | typeof auditLog) =>
  (await api.database.db.select({ n: sql<number>`count(*)::int` }).from(table))[0]!.n;
const siteNamed = async (name: string) => (await api.database.db.select().from(sites).where(eq(sites.name, name)))[0];
const fieldRow = async (id: number) => (await api.database.db.select().from(fields).where(eq(fields.id, id)))[0]!;

const SITE_HEADER = 'site,district,kind,owner,address,lat,lng,notes';
const csv = (...lines: string[]) => Buffer.from(lines.join('\n') + '\n');
type Agent = Awaited<ReturnType<TestApi['signIn']>>;
const upload = (agent: Agent, kind: string, file: Buffer, name: string) => agent.post('/api/imports').field('kind', kind).attach('file', file, name);
const geometryCell = (lat: number, lng: number) => `"${JSON.stringify(rectangle(lat, lng, 60, 90)).replace(/"/g, '""')}"`;

describe('imports: preview', () => {
  test('should show per-row errors for bad rows and write nothing, and refuse to commit them', async () => {
    const agent = await api.signIn('foreman');
    const before = { sites: await count(sites), audit: await count(auditLog) };
    const res = await upload(
      agent,
      'sites_csv',
      csv(SITE_HEADER, 'Alder Green,north,park,city,1 Alder Way,37.61,-66.49,', 'Bad Row Park,north,castle,city,,ninety,-66.49,', 'Alder Green,north,park,city,,37.61,-66.49,'),
      'sites.csv',
    );
    expect(res.status).toBe(201);
    const preview = res.body.import;
    expect(preview.status).toBe('preview');
    expect(preview.summary).toMatchObject({ rows: 3, valid: 1, errors: 2, create: 1 });
    const bad = preview.rows.find((r: { row: number }) => r.row === 3);
    expect(bad.errors.map((e: { column: string }) => e.column).sort()).toEqual(['kind', 'lat']);
    expect(bad.errors.find((e: { column: string }) => e.column === 'lat').message).toMatch(/not a number/);
    expect(preview.rows.find((r: { row: number }) => r.row === 4).errors[0].message).toMatch(/more than once/);
    expect(await count(sites)).toBe(before.sites);
    expect(await count(auditLog)).toBe(before.audit);

    const again = await agent.get(`/api/imports/${preview.id}`);
    expect(again.status).toBe(200);
    expect(again.body.import.rows).toHaveLength(3);

    const commit = await agent.post(`/api/imports/${preview.id}/commit`);
    expect(commit.status).toBe(409);
    expect(commit.body.error.code).toBe('import/has_errors');
    expect(commit.body.error.details.errors).toBe(2);
    expect(await count(sites)).toBe(before.sites);
    expect(await siteNamed('Alder Green')).toBeUndefined();
  });

  test('should refuse, row by row, a foreman’s rows in another district', async () => {
    const agent = await api.signIn('foreman');
    const res = await upload(agent, 'sites_csv', csv(SITE_HEADER, 'Own Corner,north,park,city,,37.61,-66.49,', 'Far Meadow,Test South,park,city,,37.51,-66.49,'), 'mixed.csv');
    expect(res.status).toBe(201);
    const [own, far] = res.body.import.rows;
    expect(own.errors).toEqual([]);
    expect(far.errors).toEqual([{ column: 'district', message: expect.stringMatching(/may not add sites/) }]);
    const fieldsRes = await upload(
      agent,
      'fields_csv',
      csv('site,field,sport,grass,rootzone,irrigation,level,clippings,geometry', `Test Park South,Sneaky,soccer,tall_fescue,native_soil,none,3,returned,${geometryCell(37.52, -66.47)}`),
      'fields.csv',
    );
    expect(fieldsRes.body.import.rows[0].errors[0]).toMatchObject({ column: 'site', message: expect.stringMatching(/no site called/) });
    expect((await agent.post(`/api/imports/${res.body.import.id}/commit`)).status).toBe(409);
    expect(await siteNamed('Own Corner')).toBeUndefined();
  });

  test('should name missing and unknown columns with a 400', async () => {
    const agent = await api.signIn('head');
    const res = await upload(agent, 'sites_csv', csv('site,district,colour', 'A,north,green'), 'sites.csv');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('import/columns');
    expect(res.body.error.message).toMatch(/missing columns kind, owner, lat, lng/);
    expect(res.body.error.message).toMatch(/unknown column colour/);
  });
});

describe('imports: files', () => {
  test('should refuse a file over 5 MB with 413', async () => {
    const agent = await api.signIn('foreman');
    const big = Buffer.alloc(5 * 1024 * 1024 + 1, 'a');
    const res = await upload(agent, 'sites_csv', big, 'big.csv');
    expect(res.status).toBe(413);
    expect(res.body.error.message).toMatch(/larger than 5 MB/);
  });

  test('should refuse the wrong type by extension and by content with 415', async () => {
    const agent = await api.signIn('foreman');
    const byName = await upload(agent, 'sites_csv', csv(SITE_HEADER), 'sites.xlsx');
    expect(byName.status).toBe(415);
    expect(byName.body.error.message).toMatch(/\.csv file/);
    const binary = await upload(agent, 'sites_csv', Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0xff, 0xfe, 0x00]), 'sites.csv');
    expect(binary.status).toBe(415);
    const notGeo = await upload(agent, 'outlines_geojson', csv(SITE_HEADER), 'outlines.geojson');
    expect(notGeo.status).toBe(415);
    expect(notGeo.body.error.message).toMatch(/not valid JSON/);
    const notCollection = await upload(agent, 'outlines_geojson', Buffer.from(JSON.stringify(rectangle(1, 1, 10, 10))), 'outline.json');
    expect(notCollection.status).toBe(415);
    expect(notCollection.body.error.message).toMatch(/FeatureCollection/);
  });

  test('should answer 400 for an unknown kind or no file', async () => {
    const agent = await api.signIn('foreman');
    expect((await upload(agent, 'weather', csv(SITE_HEADER), 'x.csv')).status).toBe(400);
    expect((await agent.post('/api/imports').field('kind', 'sites_csv')).status).toBe(400);
  });
});

describe('imports: roles', () => {
  test('should refuse callers who are not signed in (401) and crew leads and partners (403)', async () => {
    expect((await supertest(api.app).get('/api/imports')).status).toBe(401);
    expect((await supertest(api.app).post('/api/imports').field('kind', 'sites_csv').attach('file', csv(SITE_HEADER), 's.csv')).status).toBe(401);
    for (const who of ['crew', 'partner'] as const) {
      const agent = await api.signIn(who);
      expect((await agent.get('/api/imports')).status, who).toBe(403);
      expect((await upload(agent, 'sites_csv', csv(SITE_HEADER, 'X Park,north,park,city,,37.61,-66.49,'), 's.csv')).status, who).toBe(403);
    }
    const head = await api.signIn('head');
    expect((await head.get('/api/imports')).status).toBe(200);
  });

  test('should not let another foreman read or commit an import', async () => {
    const agent = await api.signIn('foreman');
    const res = await upload(agent, 'sites_csv', csv(SITE_HEADER, 'Private Park,north,park,city,,37.61,-66.49,'), 's.csv');
    const other = await api.signIn('foremanSouth');
    expect((await other.get(`/api/imports/${res.body.import.id}`)).status).toBe(404);
    expect((await other.post(`/api/imports/${res.body.import.id}/commit`)).status).toBe(404);
    expect((await other.get('/api/imports')).body.items.map((i: { id: number }) => i.id)).not.toContain(res.body.import.id);
  });
});

describe('imports: commit and undo', () => {
  test('should create and update sites, audit them, and undo both', async () => {
    const agent = await api.signIn('foreman');
    const park = (await siteNamed('Test Park North'))!;
    const audits = await count(auditLog);
    const res = await upload(
      agent,
      'sites_csv',
      csv(SITE_HEADER, 'Birch Hollow,north,Park,City,2 Birch Rd,37.615,-66.485,imported', 'Test Park North,,,,9 New Address,,,'),
      'sites.csv',
    );
    expect(res.body.import.summary).toMatchObject({ rows: 2, errors: 0, create: 1, update: 1 });
    const commit = await agent.post(`/api/imports/${res.body.import.id}/commit`);
    expect(commit.status).toBe(200);
    expect(commit.body.import).toMatchObject({ status: 'committed', changes: { created: 1, updated: 1 } });

    const birch = (await siteNamed('Birch Hollow'))!;
    expect(birch).toMatchObject({ kind: 'park', owner: 'city', lat: 37.615, districtId: api.fixture.districts.north, version: 1 });
    expect((await siteNamed('Test Park North'))!).toMatchObject({ address: '9 New Address', version: park.version + 1, lat: park.lat });
    const entries = await api.database.db.select().from(auditLog).where(sql`${auditLog.id} > 0`).orderBy(auditLog.id);
    expect(entries.length).toBe(audits + 3);
    expect(entries.filter((e) => e.entity === 'site' && e.entityId === birch.id && e.action === 'create')).toHaveLength(1);
    expect(entries.filter((e) => e.entity === 'import' && e.entityId === res.body.import.id)).toHaveLength(1);
    expect((await agent.post(`/api/imports/${res.body.import.id}/commit`)).status).toBe(409);

    const list = await agent.get('/api/imports');
    expect(list.body.lastCommittedId).toBe(res.body.import.id);

    const undo = await agent.post(`/api/imports/${res.body.import.id}/undo`);
    expect(undo.status).toBe(200);
    expect(undo.body.import.status).toBe('undone');
    expect(await siteNamed('Birch Hollow')).toBeUndefined();
    const restored = (await siteNamed('Test Park North'))!;
    expect(restored.address).toBe(park.address);
    expect(restored.version).toBe(park.version + 2);
    expect((await agent.post(`/api/imports/${res.body.import.id}/undo`)).status).toBe(409);
  });

  test('should refuse to undo when an imported row was changed since, and keep everything', async () => {
    const agent = await api.signIn('foreman');
    const res = await upload(agent, 'sites_csv', csv(SITE_HEADER, 'Cedar Flats,north,park,city,,37.617,-66.486,'), 'sites.csv');
    await agent.post(`/api/imports/${res.body.import.id}/commit`).expect(200);
    const cedar = (await siteNamed('Cedar Flats'))!;
    await agent.patch(`/api/sites/${cedar.id}`).send({ version: 1, notes: 'edited by hand' }).expect(200);
    const undo = await agent.post(`/api/imports/${res.body.import.id}/undo`);
    expect(undo.status).toBe(409);
    expect(undo.body.error.code).toBe('import/changed_since');
    expect((await siteNamed('Cedar Flats'))!.notes).toBe('edited by hand');
    const [record] = await api.database.db.select().from(imports).where(eq(imports.id, res.body.import.id));
    expect(record!.status).toBe('committed');
  });

  test('should create and update fields with their outline facts, and undo them', async () => {
    const agent = await api.signIn('foreman');
    const soccer = await fieldRow(api.fixture.fields.northSoccer);
    const header = 'site,field,sport,grass,rootzone,irrigation,level,clippings,hoc_mm,status,weekly_use_hours,geometry';
    const res = await upload(
      agent,
      'fields_csv',
      csv(
        header,
        `Test Park North,Practice 2,soccer,Tall fescue,native_soil,none,Community,returned,,open,6,${geometryCell(37.622, -66.476)}`,
        'Test Park North,Soccer 1,,,,,1,,32,,,',
        'Test Park North,Practice 3,soccer,tall_fescue,native_soil,none,3,returned,,,,',
      ),
      'fields.csv',
    );
    expect(res.body.import.rows[2].errors).toEqual([{ column: 'geometry', message: expect.stringMatching(/needs its outline/) }]);
    expect(await count(fields)).toBe(4);

    const clean = await upload(agent, 'fields_csv', csv(header, `Test Park North,Practice 2,soccer,Tall fescue,native_soil,none,Community,returned,,open,6,${geometryCell(37.622, -66.476)}`, 'Test Park North,Soccer 1,,,,,1,,32,,,'), 'fields.csv');
    expect(clean.body.import.summary).toMatchObject({ errors: 0, create: 1, update: 1 });
    await agent.post(`/api/imports/${clean.body.import.id}/commit`).expect(200);
    const [practice] = await api.database.db.select().from(fields).where(eq(fields.name, 'Practice 2'));
    expect(practice).toMatchObject({ grass: 'tall_fescue', maintenanceLevel: 3, weeklyUseHours: 6 });
    expect(practice!.areaM2).toBeGreaterThan(5300);
    expect(practice!.areaM2).toBeLessThan(5500);
    expect(await fieldRow(soccer.id)).toMatchObject({ maintenanceLevel: 1, hocOverrideMm: 32 });

    await agent.post(`/api/imports/${clean.body.import.id}/undo`).expect(200);
    expect(await api.database.db.select().from(fields).where(eq(fields.name, 'Practice 2'))).toHaveLength(0);
    expect(await fieldRow(soccer.id)).toMatchObject({ maintenanceLevel: soccer.maintenanceLevel, hocOverrideMm: soccer.hocOverrideMm });
  });

  test('should update outlines from GeoJSON matched by names or id, and undo them', async () => {
    const agent = await api.signIn('head');
    const soccer = await fieldRow(api.fixture.fields.northSoccer);
    const outline = rectangle(37.62, -66.48, 70, 110);
    const doc = {
      type: 'FeatureCollection',
      features: [
        { type: 'Feature', properties: { site: 'Test Park North', field: 'Soccer 1' }, geometry: outline },
        { type: 'Feature', properties: { fieldId: api.fixture.fields.southBaseball }, geometry: { type: 'Point', coordinates: [1, 1] } },
        { type: 'Feature', properties: { field: 'Nowhere' }, geometry: outline },
      ],
    };
    const bad = await upload(agent, 'outlines_geojson', Buffer.from(JSON.stringify(doc)), 'outlines.geojson');
    expect(bad.status).toBe(201);
    expect(bad.body.import.rows[1].errors[0].message).toMatch(/must be a Polygon, not Point/);
    expect(bad.body.import.rows[2].errors[0].message).toMatch(/fieldId/);
    const good = await upload(agent, 'outlines_geojson', Buffer.from(JSON.stringify({ ...doc, features: [doc.features[0]] })), 'outlines.json');
    expect(good.body.import.summary).toMatchObject({ errors: 0, update: 1 });
    await agent.post(`/api/imports/${good.body.import.id}/commit`).expect(200);
    const after = await fieldRow(soccer.id);
    expect(after.geometry).toEqual(outline);
    expect(after.areaM2).toBeGreaterThan(soccer.areaM2);
    await agent.post(`/api/imports/${good.body.import.id}/undo`).expect(200);
    const undone = await fieldRow(soccer.id);
    expect(undone.geometry).toEqual(soccer.geometry);
    expect(undone.areaM2).toBeCloseTo(soccer.areaM2, 6);
  });
});
