import { describe, expect, test } from 'vitest';
import { createEquipmentSchema, createFieldSchema, MAX_OUTLINE_POSITIONS, polygonSchema, updateCrewSchema, updateEquipmentSchema, updateFieldSchema, updateSiteSchema } from './index.ts';

describe('update schemas', () => {
  // A PATCH that names one key must not carry defaults for the others: they would overwrite
  // the stored values (a closed field reopened, a note wiped).
  test.each([
    ['field', updateFieldSchema, { version: 3, name: 'Renamed' }],
    ['site', updateSiteSchema, { version: 3, name: 'Renamed' }],
    ['crew', updateCrewSchema, { version: 3, name: 'Renamed' }],
    ['equipment', updateEquipmentSchema, { version: 3, name: 'Renamed' }],
  ] as const)('should keep a %s update to the keys it names', (_what, schema, body) => {
    expect(schema.parse(body)).toEqual(body);
  });

  test('should still fill creation defaults', () => {
    const field = createFieldSchema.parse({
      siteId: 1,
      name: 'Pitch',
      sport: 'soccer',
      grass: 'tall_fescue',
      rootzone: 'native_soil',
      irrigation: 'none',
      maintenanceLevel: 3,
      clippings: 'returned',
      geometry: { type: 'Polygon', coordinates: [[[0, 0], [0.001, 0], [0.001, 0.001], [0, 0]]] },
    });
    expect(field).toMatchObject({ status: 'open', statusNote: '', hocOverrideMm: null, weeklyUseHours: 0 });
    const marker = createEquipmentSchema.parse({ districtId: 1, kind: 'line_marker', name: 'Marker' });
    expect(marker).toMatchObject({ crewId: null, hourMeterH: 0, active: true, notes: '' });
  });
});

describe('polygonSchema', () => {
  /** A closed ring of `n` positions (n − 1 corners on a circle and the closing one). */
  const ring = (n: number) => {
    const pts = Array.from({ length: n - 1 }, (_, i) => [10 + 0.001 * Math.cos((2 * Math.PI * i) / (n - 1)), 40 + 0.001 * Math.sin((2 * Math.PI * i) / (n - 1))]);
    return [...pts, pts[0]!];
  };

  test('should take an outline of up to MAX_OUTLINE_POSITIONS positions', () => {
    expect(polygonSchema.safeParse({ type: 'Polygon', coordinates: [ring(MAX_OUTLINE_POSITIONS)] }).success).toBe(true);
  });

  test('should refuse a ring over the bound with a message on the ring', () => {
    const res = polygonSchema.safeParse({ type: 'Polygon', coordinates: [ring(MAX_OUTLINE_POSITIONS + 1)] });
    expect(res.success).toBe(false);
    expect(res.error!.issues[0]).toMatchObject({ path: ['coordinates', 0], message: 'a ring may have at most 5,000 positions; simplify the outline' });
  });

  test('should refuse rings that are each within the bound but over it together', () => {
    const res = polygonSchema.safeParse({ type: 'Polygon', coordinates: [ring(3_000), ring(2_500)] });
    expect(res.success).toBe(false);
    expect(res.error!.issues).toEqual([expect.objectContaining({ path: ['coordinates'], message: 'an outline may have at most 5,000 positions in all its rings; simplify it' })]);
  });
});
