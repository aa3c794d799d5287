/**
 * What the hostile-input fuzzing found: numbers too small for the database's single-precision
 * columns (read as zero, so they meet the schema's own limits or store a plain 0) and a
 * district that does not exist; each a 400, never a 500.
 */
import { describe, expect, test } from 'vitest';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();

describe('negligible numbers', () => {
  test('should refuse 1e-264 planned hours with 400 and store 1e-200 meter hours as 0', async () => {
    const admin = await api.signIn('admin');
    const order = await admin.post('/api/work-orders').send({ fieldId: api.fixture.fields.northSoccer, task: 'mow', plannedDate: '2030-01-08', plannedHours: 2.49e-264 });
    expect(order.status).toBe(400);
    expect(order.body.error.details.issues[0]).toEqual({ path: 'body.plannedHours', message: 'planned hours must be more than 0' });
    const mower = await admin
      .post('/api/equipment')
      .send({ districtId: api.fixture.districts.north, kind: 'rotary_mower', name: 'Tiny meter', cuttingWidthM: 1.5, speedKmh: 8, fieldEfficiency: 0.8, hocMinMm: 20, hocMaxMm: 90, hourMeterH: 1e-200 });
    expect(mower.status).toBe(201);
    expect(mower.body.equipment.hourMeterH).toBe(0);
  });

  test('should refuse equipment or a crew moved into a district that does not exist with 400, not 500', async () => {
    const admin = await api.signIn('admin');
    const made = await admin
      .post('/api/equipment')
      .send({ districtId: 987654, kind: 'rotary_mower', name: 'Nowhere mower', cuttingWidthM: 1.5, speedKmh: 8, fieldEfficiency: 0.8, hocMinMm: 20, hocMaxMm: 90 });
    expect(made.status).toBe(400);
    expect(made.body.error.details.issues[0].path).toBe('body.districtId');
    const crew = (await admin.get('/api/crews')).body.items.find((c: { id: number }) => c.id === api.fixture.crews.south) as { version: number };
    const moved = await admin.patch(`/api/crews/${api.fixture.crews.south}`).send({ version: crew.version, districtId: 987654 });
    expect(moved.status).toBe(400);
  });
});
