import { eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { auditLog, crews, equipment } from '../../apps/api/src/db/schema/index.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();

const rotary = (districtId: number, crewId: number | null = null) => ({
  districtId,
  crewId,
  kind: 'rotary_mower',
  name: 'Wide-area rotary 72',
  cuttingWidthM: 1.83,
  speedKmh: 8,
  fieldEfficiency: 0.8,
  hocMinMm: 25,
  hocMaxMm: 115,
  hourMeterH: 410,
  sharpenIntervalH: 25,
  lastSharpenedAtH: 380,
});

describe('crews', () => {
  test('should let a foreman create and edit a crew in his district only', async () => {
    const foreman = await api.signIn('foreman');
    const res = await foreman.post('/api/crews').send({ districtId: api.fixture.districts.north, name: 'North Crew B', hoursPerDay: 9, members: ['R. Tester', 'S. Tester'] });
    expect(res.status).toBe(201);
    const id = res.body.crew.id;
    const edit = await foreman.patch(`/api/crews/${id}`).send({ version: 1, hoursPerDay: 10 });
    expect(edit.status).toBe(200);
    expect(edit.body.crew).toMatchObject({ hoursPerDay: 10, version: 2 });
    expect((await foreman.patch(`/api/crews/${id}`).send({ version: 1, hoursPerDay: 7 })).status).toBe(409);
    const other = await foreman.post('/api/crews').send({ districtId: api.fixture.districts.south, name: 'Not mine', hoursPerDay: 8 });
    expect(other.status).toBe(403);
    const south = await foreman.patch(`/api/crews/${api.fixture.crews.south}`).send({ version: 1, name: 'Taken' });
    expect(south.status).toBe(403);
    const [row] = await api.database.db.select().from(crews).where(eq(crews.id, api.fixture.crews.south));
    expect(row!.name).toBe('South Crew');
    expect((await foreman.delete(`/api/crews/${id}?version=2`)).status).toBe(204);
  });

  test('should refuse bad crew bodies with field issues', async () => {
    const foreman = await api.signIn('foreman');
    const res = await foreman.post('/api/crews').send({ districtId: api.fixture.districts.north, name: 'X', hoursPerDay: 30 });
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues.map((i: { path: string }) => i.path).sort()).toEqual(['body.hoursPerDay', 'body.name']);
  });

  test('should list a crew with its lead’s name and working days', async () => {
    const foreman = await api.signIn('foreman');
    const res = await foreman.get('/api/crews');
    expect(res.body.items.find((c: { id: number }) => c.id === api.fixture.crews.north)).toMatchObject({ leadName: 'Test crew', workDays: ['mon', 'tue', 'wed', 'thu', 'fri'] });
  });

  test('should not delete a crew that still has its lead', async () => {
    const admin = await api.signIn('admin');
    const res = await admin.delete(`/api/crews/${api.fixture.crews.north}?version=1`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('crew/has_lead');
  });
});

describe('equipment', () => {
  test('should record a mower with its HOC range and flag blades due for sharpening', async () => {
    const foreman = await api.signIn('foreman');
    const res = await foreman.post('/api/equipment').send(rotary(api.fixture.districts.north, api.fixture.crews.north));
    expect(res.status).toBe(201);
    // 410 h on the meter, sharpened at 380 h, every 25 h → 30 h since: due
    expect(res.body.equipment).toMatchObject({ kind: 'rotary_mower', crewName: 'North Crew', hoursSinceSharpening: 30, sharpeningDue: true });
    const id = res.body.equipment.id;
    const sharpened = await foreman.patch(`/api/equipment/${id}`).send({ version: 1, lastSharpenedAtH: 410 });
    expect(sharpened.body.equipment).toMatchObject({ hoursSinceSharpening: 0, sharpeningDue: false, version: 2 });
    const audit = await api.database.db.select().from(auditLog).where(eq(auditLog.entity, 'equipment')).orderBy(auditLog.id);
    expect(audit.map((a) => a.action)).toEqual(['create', 'update']);
  });

  test('should require the mower figures and a sensible HOC range', async () => {
    const foreman = await api.signIn('foreman');
    const missing = await foreman.post('/api/equipment').send({ districtId: api.fixture.districts.north, kind: 'reel_mower', name: 'Reel 5-gang' });
    expect(missing.status).toBe(400);
    expect(missing.body.error.details.issues.map((i: { path: string }) => i.path).sort()).toEqual([
      'body.cuttingWidthM',
      'body.fieldEfficiency',
      'body.hocMaxMm',
      'body.hocMinMm',
      'body.speedKmh',
    ]);
    const backwards = await foreman.post('/api/equipment').send({ ...rotary(api.fixture.districts.north), hocMinMm: 80, hocMaxMm: 30 });
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.details.issues[0]).toEqual({ path: 'body.hocMaxMm', message: 'the highest HOC is below the lowest' });
    const marker = await foreman.post('/api/equipment').send({ districtId: api.fixture.districts.north, kind: 'line_marker', name: 'Marker 2' });
    expect(marker.status).toBe(201);
    const otherCrew = await foreman.post('/api/equipment').send(rotary(api.fixture.districts.north, api.fixture.crews.south));
    expect(otherCrew.status).toBe(400);
    expect(otherCrew.body.error.details.issues[0].message).toMatch(/another district/);
  });

  test('should scope equipment by district and show a crew lead only his crew’s', async () => {
    const admin = await api.signIn('admin');
    await admin.post('/api/equipment').send({ ...rotary(api.fixture.districts.south), name: 'South rotary' });
    const foreman = await api.signIn('foreman');
    const mine = await foreman.get('/api/equipment');
    expect(mine.body.items.every((e: { districtId: number }) => e.districtId === api.fixture.districts.north)).toBe(true);
    const southId = (await api.database.db.select().from(equipment).where(eq(equipment.name, 'South rotary')))[0]!.id;
    expect((await foreman.patch(`/api/equipment/${southId}`).send({ version: 1, name: 'Mine now' })).status).toBe(403);
    expect((await foreman.delete(`/api/equipment/${southId}?version=1`)).status).toBe(403);
    const crew = await api.signIn('crew');
    const crewList = await crew.get('/api/equipment');
    expect(crewList.status).toBe(200);
    expect(crewList.body.items.map((e: { crewId: number }) => e.crewId)).toEqual(crewList.body.items.map(() => api.fixture.crews.north));
    expect((await crew.post('/api/equipment').send(rotary(api.fixture.districts.north))).status).toBe(403);
    const partner = await api.signIn('partner');
    expect((await partner.get('/api/equipment')).status).toBe(403);
  });
});
