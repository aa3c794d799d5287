import { describe, expect, test } from 'vitest';
import { createEquipmentSchema, createFieldSchema, updateCrewSchema, updateEquipmentSchema, updateFieldSchema, updateSiteSchema } from './index.ts';

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
