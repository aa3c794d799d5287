import { describe, expect, test } from 'vitest';
import { createEquipmentSchema, createFieldSchema, idSchema, isoDateSchema, isoDateTimeSchema, MAX_OUTLINE_POSITIONS, passwordSchema, polygonSchema, updateCrewSchema, updateEquipmentSchema, updateFieldSchema, updateSiteSchema, versionSchema } from './index.ts';

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

describe('bounds shared by every route', () => {
  test('should keep ids and versions within PostgreSQL’s integer', () => {
    expect(idSchema.parse('2147483647')).toBe(2147483647);
    expect(idSchema.safeParse('2147483648').success).toBe(false);
    expect(idSchema.safeParse('0').success).toBe(false);
    expect(versionSchema.safeParse(2147483647).success).toBe(true);
    expect(versionSchema.safeParse(3000000000).success).toBe(false);
  });

  test('should take calendar dates from 1900 to 2200 only', () => {
    expect(isoDateSchema.safeParse('1900-01-01').success).toBe(true);
    expect(isoDateSchema.safeParse('2200-12-31').success).toBe(true);
    for (const bad of ['0000-01-01', '1899-12-31', '2201-01-01', '2026-02-29', '2026-13-01', '2026-1-1']) expect(isoDateSchema.safeParse(bad).success, bad).toBe(false);
    // One message per bad value, the first thing wrong with it.
    expect(isoDateSchema.safeParse('3 June').error?.issues.map((i) => i.message)).toEqual(['use a date as YYYY-MM-DD']);
    expect(isoDateSchema.safeParse('0000-02-30').error?.issues.map((i) => i.message)).toEqual(['not a calendar date']);
    expect(isoDateTimeSchema.safeParse('2026-06-02T20:30:00-05:00').success).toBe(true);
    expect(isoDateTimeSchema.safeParse('0000-06-02T20:30:00Z').success).toBe(false);
  });

  test('should ask passwords of at least 12 characters', () => {
    expect(passwordSchema.safeParse('elevenchars').error?.issues[0]?.message).toBe('use at least 12 characters');
    expect(passwordSchema.safeParse('twelve-chars').success).toBe(true);
  });
});
