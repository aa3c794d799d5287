import { eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { auditLog, fieldStripes } from '../../apps/api/src/db/schema/index.ts';
import { useTestApi } from '../support/app.ts';
import { addEquipment } from '../support/fixture.ts';

const api = useTestApi();
const db = () => api.database.db;
/** A Monday inside the fixture's weather. */
const WEEK = '2026-05-25';

const mower = (districtId: number, name: string) =>
  addEquipment(db(), { districtId, kind: 'rotary_mower', name, cuttingWidthM: 1.5, speedKmh: 7, fieldEfficiency: 0.85, hocMinMm: 25, hocMaxMm: 100 });

describe('field stripes', () => {
  test('should let a foreman set, change and clear the pattern of his district’s field, versioned and audited', async () => {
    const foreman = await api.signIn('foreman');
    const id = api.fixture.fields.northLawn;
    const unit = await mower(api.fixture.districts.north, 'Stripes rotary');
    const empty = await foreman.get(`/api/fields/${id}/stripes`);
    expect(empty.status).toBe(200);
    expect(empty.body.stripes).toMatchObject({ fieldId: id, pattern: null, mowerId: null, version: null });
    expect(empty.body.stripes.mowers).toContainEqual(expect.objectContaining({ id: unit, name: 'Stripes rotary', widthM: 1.5, speedKmh: 7, efficiency: 0.85 }));

    const set = await foreman.patch(`/api/fields/${id}/stripes`).send({ pattern: 'diagonal', mowerId: unit, version: null });
    expect(set.status).toBe(200);
    expect(set.body.stripes).toMatchObject({ pattern: 'diagonal', mowerId: unit, version: 1, setByName: 'Test foreman' });
    // A second first setting, or a stale version, is a conflict.
    expect((await foreman.patch(`/api/fields/${id}/stripes`).send({ pattern: 'lengthwise', version: null })).body.error.code).toBe('field_stripes/version_conflict');
    const changed = await foreman.patch(`/api/fields/${id}/stripes`).send({ pattern: 'checkerboard', mowerId: null, version: 1 });
    expect(changed.body.stripes).toMatchObject({ pattern: 'checkerboard', mowerId: null, version: 2 });
    const cleared = await foreman.patch(`/api/fields/${id}/stripes`).send({ pattern: null, version: 2 });
    expect(cleared.body.stripes).toMatchObject({ pattern: null, version: null });
    expect(await db().select().from(fieldStripes).where(eq(fieldStripes.fieldId, id))).toEqual([]);
    const audit = await db().select().from(auditLog).where(eq(auditLog.entity, 'field_stripes')).orderBy(auditLog.id);
    expect(audit.map((a) => a.action)).toEqual(['create', 'update', 'delete']);
  });

  test('should refuse a crew lead, a partner and a foreman of another district, and write nothing', async () => {
    const id = api.fixture.fields.northSoccer;
    for (const who of ['crew', 'partner', 'foremanSouth'] as const) {
      const agent = await api.signIn(who);
      const res = await agent.patch(`/api/fields/${id}/stripes`).send({ pattern: 'side_to_side', version: null });
      expect(res.status, who).toBe(403);
    }
    // A refused caller is refused before the body is read: a bad body is still a 403.
    expect((await (await api.signIn('crew')).patch(`/api/fields/${id}/stripes`).send({ pattern: 'spiral' })).status).toBe(403);
    expect((await (await api.signIn('foremanSouth')).patch(`/api/fields/${id}/stripes`).send({ pattern: 'spiral' })).status).toBe(403);
    expect(await db().select().from(fieldStripes).where(eq(fieldStripes.fieldId, id))).toEqual([]);
    expect((await (await api.signIn('foremanSouth')).get(`/api/fields/${id}/stripes`)).status).toBe(403);
  });

  test('should answer 400 for a bad pattern or a mower of another district, and 404 for no field', async () => {
    const foreman = await api.signIn('foreman');
    const id = api.fixture.fields.northSoccer;
    const southUnit = await mower(api.fixture.districts.south, 'South rotary');
    for (const body of [{ pattern: 'spiral', version: null }, { pattern: 'lengthwise' }, { pattern: 'lengthwise', version: 0 }, { pattern: 'lengthwise', mowerId: southUnit, version: null }]) {
      const res = await foreman.patch(`/api/fields/${id}/stripes`).send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
    }
    expect(await db().select().from(fieldStripes).where(eq(fieldStripes.fieldId, id))).toEqual([]);
    expect((await foreman.patch('/api/fields/999999/stripes').send({ pattern: 'lengthwise', version: null })).status).toBe(404);
  });

  test('should put the pattern on the patterned field’s generated mowing orders only', async () => {
    const foreman = await api.signIn('foreman');
    const patterned = api.fixture.fields.northSoccer;
    expect((await foreman.patch(`/api/fields/${patterned}/stripes`).send({ pattern: 'checkerboard', version: null })).status).toBe(200);
    const res = await foreman.post('/api/week-plans/generate').send({ districtId: api.fixture.districts.north, weekStart: WEEK });
    expect(res.status).toBe(200);
    type Order = { fieldId: number; task: string; plannedHours: number; reason: string; details: Record<string, unknown> };
    const mowings = (res.body.board.orders as Order[]).filter((o) => o.task === 'mow');
    const mine = mowings.filter((o) => o.fieldId === patterned);
    expect(mine.length).toBeGreaterThan(0);
    for (const o of mine) {
      expect(o.details.pattern).toBe('checkerboard');
      expect(o.reason).toMatch(/Checkerboard/);
    }
    const others = mowings.filter((o) => o.fieldId !== patterned);
    expect(others.length).toBeGreaterThan(0);
    expect(others.every((o) => o.details.pattern === undefined)).toBe(true);
  });
});
