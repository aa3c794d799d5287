import { eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import type { Polygon } from '@swardwise/domain';
import { fields } from '../../apps/api/src/db/schema/index.ts';
import { useTestApi } from '../support/app.ts';
import { fieldBody } from '../support/fixture.ts';

/**
 * An outline's positions are bounded (5,000 over all rings) in the shared schema, so field
 * create and update, map editing and outline imports all refuse a huge one with a 400 that
 * names the ring, before any geometry is computed.
 */
const api = useTestApi();

/** A closed ring of `n` positions on a circle of about 90 m, short numbers so 100,000 fit the 2 MB body limit. */
function circle(n: number, lng = -66.47, lat = 37.64): Polygon {
  const pts = Array.from({ length: n - 1 }, (_, i) => {
    const t = (2 * Math.PI * i) / (n - 1);
    return [Math.round((lng + 0.001 * Math.cos(t)) * 1e6) / 1e6, Math.round((lat + 0.0008 * Math.sin(t)) * 1e6) / 1e6] as [number, number];
  });
  return { type: 'Polygon', coordinates: [[...pts, pts[0]!]] };
}

const newField = (geometry: Polygon) => fieldBody(api.fixture.sites.northPark, 'Round lawn', geometry, { sport: 'lawn', maintenanceLevel: 4 });

describe('outline size', () => {
  test('should refuse 100,000 positions with a 400 naming the ring, and write nothing', async () => {
    const foreman = await api.signIn('foreman');
    const huge = circle(100_000, 1.5, 2.5);
    const body = JSON.stringify(newField(huge));
    expect(body.length).toBeLessThan(2 * 1024 * 1024);
    const before = (await api.database.db.select().from(fields)).length;
    const res = await foreman.post('/api/fields').set('content-type', 'application/json').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues[0]).toEqual({ path: 'body.geometry.coordinates.0', message: 'a ring may have at most 5,000 positions; simplify the outline' });
    expect((await api.database.db.select().from(fields)).length).toBe(before);
  });

  test('should refuse the same on an outline edit (the map’s) and keep the stored outline', async () => {
    const foreman = await api.signIn('foreman');
    const id = api.fixture.fields.northLawn;
    const [stored] = await api.database.db.select().from(fields).where(eq(fields.id, id));
    const res = await foreman.patch(`/api/fields/${id}`).send({ version: stored!.version, geometry: circle(5_001) });
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues[0].path).toBe('body.geometry.coordinates.0');
    const [after] = await api.database.db.select().from(fields).where(eq(fields.id, id));
    expect(after).toEqual(stored);
  });

  test('should answer an outline of 5,000 positions with its area and long axis', async () => {
    const foreman = await api.signIn('foreman');
    const res = await foreman.post('/api/fields').send(newField(circle(5_000)));
    expect(res.status).toBe(201);
    // An ellipse of semi-axes ≈ 88 m (east) and ≈ 89 m (north): π·a·b ≈ 24,600 m².
    expect(res.body.field.areaM2).toBeGreaterThan(24_000);
    expect(res.body.field.areaM2).toBeLessThan(25_200);
    expect(res.body.field.longAxisDeg).not.toBeNull();
  });

  test('should refuse an oversized outline row by row in an outlines import', async () => {
    const head = await api.signIn('head');
    const doc = {
      type: 'FeatureCollection',
      features: [{ type: 'Feature', properties: { fieldId: api.fixture.fields.northSoccer }, geometry: circle(6_000) }],
    };
    const res = await head.post('/api/imports').field('kind', 'outlines_geojson').attach('file', Buffer.from(JSON.stringify(doc)), 'outlines.geojson');
    expect(res.status).toBe(201);
    expect(res.body.import.rows[0].errors).toEqual([{ column: 'geometry', message: 'a ring may have at most 5,000 positions; simplify the outline' }]);
    expect((await head.post(`/api/imports/${res.body.import.id}/commit`)).status).toBe(409);
  });
});
