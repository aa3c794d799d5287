/**
 * Cached answers (a field’s needs, the field list) are never stale: a change by any path,
 * this API's routes or another process writing to the same database, gives a new answer on
 * the next request.
 */
import { eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { fields, settings } from '../../apps/api/src/db/schema/index.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();
const inSeason = '2026-05-20';

describe('cached answers', () => {
  test('should work out a field’s needs again when the department parameters change in the database', async () => {
    const head = await api.signIn('head');
    const id = api.fixture.fields.northSoccer; // tall fescue
    const url = `/api/fields/${id}/needs`;
    const before = (await head.get(url).query({ date: inSeason })).body.needs;
    expect((await head.get(url).query({ date: inSeason })).body.needs).toEqual(before);

    // As another process, or a later settings page, would: a faster-growing fescue.
    await api.database.db.insert(settings).values({ key: 'department_parameters', value: { maxGrowthMmPerDay: { tall_fescue: 9 } } });
    try {
      const after = (await head.get(url).query({ date: inSeason })).body.needs;
      expect(Math.max(...after.season.growthMm)).toBeGreaterThan(Math.max(...before.season.growthMm));
    } finally {
      await api.database.db.delete(settings).where(eq(settings.key, 'department_parameters'));
    }
    expect((await head.get(url).query({ date: inSeason })).body.needs).toEqual(before);
  });

  test('should give a changed field in its needs and in the list on the next request', async () => {
    const foreman = await api.signIn('foreman');
    const id = api.fixture.fields.northSoccer; // level 2
    const field = (await foreman.get(`/api/fields/${id}`)).body.field;
    expect((await foreman.get(`/api/fields/${id}/needs`).query({ date: inSeason })).body.needs.standards.level).toBe(2);
    await foreman.get('/api/fields');
    const changed = await foreman.patch(`/api/fields/${id}`).send({ version: field.version, maintenanceLevel: 3 });
    expect(changed.status).toBe(200);
    try {
      const [needs, list] = await Promise.all([foreman.get(`/api/fields/${id}/needs`).query({ date: inSeason }), foreman.get('/api/fields')]);
      expect(needs.body.needs.standards.level).toBe(3);
      expect(list.body.items.find((f: { id: number }) => f.id === id).maintenanceLevel).toBe(3);
    } finally {
      await api.database.db.update(fields).set({ maintenanceLevel: 2 }).where(eq(fields.id, id));
    }
  });
});
