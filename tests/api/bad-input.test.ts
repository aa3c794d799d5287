/**
 * Input that the database cannot hold answers 400 with field-level messages, never 500:
 * ids and versions past PostgreSQL's integer, dates outside 1900–2200, JSON nested deeper
 * than any real document.
 */
import { describe, expect, test } from 'vitest';
import { useTestApi } from '../support/app.ts';
import { giveWork } from '../support/fixture.ts';
import { servedRoutes } from '../support/routes.ts';

const api = useTestApi();

const TOO_BIG = '2147483648';
const issuePaths = (body: { error: { details?: { issues?: { path: string }[] } } }) => (body.error.details?.issues ?? []).map((i) => i.path);

/** Every API route with a parameter the app serves (a route added later is swept too). */
function paramRoutes(): { method: 'get' | 'post' | 'patch' | 'delete'; path: string }[] {
  return servedRoutes(api.app)
    .map((r) => r.split(' ') as [string, string])
    .filter(([method, path]) => path.startsWith('/api/') && path.includes(':') && ['GET', 'POST', 'PATCH', 'DELETE'].includes(method))
    .map(([method, path]) => ({ method: method.toLowerCase() as 'get', path }));
}

describe('ids and versions past PostgreSQL’s integer', () => {
  test('should answer GET /api/sites/2147483648 with 400 and the parameter named', async () => {
    const admin = await api.signIn('admin');
    const res = await admin.get(`/api/sites/${TOO_BIG}`);
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues).toEqual([{ path: 'params.id', message: 'must be an id of at most 2147483647' }]);
    expect((await admin.get('/api/sites/2147483647')).status).toBe(404);
  });

  test('should sweep every route parameter: too large is 400, never 500', async () => {
    const admin = await api.signIn('admin');
    const routes = paramRoutes();
    // The sweep finds the routers (a broken pattern would find nothing and pass).
    expect(routes.length).toBeGreaterThanOrEqual(20);
    expect(routes).toContainEqual({ method: 'get', path: '/api/sites/:id' });
    expect(routes).toContainEqual({ method: 'post', path: '/api/work-orders/:id/photos' });
    for (const route of routes) {
      const names = [...route.path.matchAll(/:(\w+)/g)].map((m) => m[1]!);
      for (const name of names) {
        const url = route.path.replace(/:(\w+)/g, (_m, p: string) => (p === name ? TOO_BIG : '1'));
        const res = await admin[route.method](url);
        expect(res.status, `${route.method.toUpperCase()} ${url}`).toBe(400);
        expect(issuePaths(res.body), `${route.method.toUpperCase()} ${url}`).toContain(`params.${name}`);
      }
    }
  });

  test('should answer a version of 3000000000 with 400 on body and query', async () => {
    const admin = await api.signIn('admin');
    const patch = await admin.patch(`/api/sites/${api.fixture.sites.northPark}`).send({ version: 3000000000, name: 'Test Park North' });
    expect(patch.status).toBe(400);
    expect(patch.body.error.details.issues).toEqual([{ path: 'body.version', message: 'version must be at most 2147483647' }]);
    const del = await admin.delete(`/api/crews/${api.fixture.crews.south}?version=3000000000`);
    expect(del.status).toBe(400);
    expect(issuePaths(del.body)).toEqual(['query.version']);
  });

  test('should answer ids in queries and bodies past the range with 400', async () => {
    const admin = await api.signIn('admin');
    const list = await admin.get(`/api/fields?siteId=${TOO_BIG}`);
    expect(list.status).toBe(400);
    expect(issuePaths(list.body)).toEqual(['query.siteId']);
    const booking = await admin.post('/api/field-events').send({ fieldId: 3000000000, kind: 'game', title: 'Cup final', startsOn: '2026-06-01' });
    expect(booking.status).toBe(400);
    expect(issuePaths(booking.body)).toEqual(['body.fieldId']);
  });
});

describe('dates outside 1900–2200', () => {
  test('should answer a date in the year 0000 in a query with 400 and the field named', async () => {
    const admin = await api.signIn('admin');
    const records = await admin.get('/api/records?from=0000-01-01&to=0000-02-01');
    expect(records.status).toBe(400);
    expect(records.body.error.details.issues).toContainEqual({ path: 'query.from', message: 'use a date between 1900-01-01 and 2200-12-31' });
    for (const url of [
      `/api/fields/${api.fixture.fields.northSoccer}/needs?date=0000-06-01`,
      '/api/work-orders?from=0000-06-01',
      '/api/field-events?from=2201-01-01',
      '/api/map?asOf=1899-12-31',
      `/api/weather/stations/${api.fixture.weather.stationId}/days?from=0000-01-01&to=0000-01-05`,
    ]) {
      const res = await admin.get(url);
      expect(res.status, url).toBe(400);
      expect(res.body.error.message, url).toMatch(/between 1900-01-01 and 2200-12-31/);
    }
  });

  test('should answer a date in the year 0000 in a body with 400, and keep the edges', async () => {
    const admin = await api.signIn('admin');
    const booking = (startsOn: string) => admin.post('/api/field-events').send({ fieldId: api.fixture.fields.northSoccer, kind: 'game', title: 'Cup final', startsOn });
    const res = await booking('0000-06-01');
    expect(res.status).toBe(400);
    expect(res.body.error.details.issues).toEqual([{ path: 'body.startsOn', message: 'use a date between 1900-01-01 and 2200-12-31' }]);
    expect((await booking('2200-12-31')).status).toBe(201);
    expect((await booking('2026-02-30')).status).toBe(400);
    const crew = await api.signIn('crew');
    const order = await giveWork(api.database.db, api.fixture.fields.northSoccer, api.fixture.crews.north);
    const report = await crew.post(`/api/work-orders/${order}/reports`).send({ status: 'started', clientRef: 'bad-date-report-1', reportedAt: '0000-01-01T08:00:00Z' });
    expect(report.status).toBe(400);
    expect(issuePaths(report.body)).toEqual(['body.reportedAt']);
  });
});

describe('deeply nested JSON', () => {
  const nested = (depth: number) => '['.repeat(depth) + '1' + ']'.repeat(depth);

  test('should answer a deeply nested GeoJSON import with 400, not 500', async () => {
    const admin = await api.signIn('admin');
    const doc = `{"type":"FeatureCollection","features":[{"type":"Feature","properties":{"fieldId":${api.fixture.fields.northSoccer}},"geometry":{"type":"Polygon","coordinates":${nested(100_000)}}}]}`;
    const res = await admin.post('/api/imports').field('kind', 'outlines_geojson').attach('file', Buffer.from(doc), 'outlines.geojson');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('import/too_deep');
    expect(issuePaths(res.body)).toEqual(['body.file']);
  });

  test('should answer a deeply nested JSON body with 400', async () => {
    const admin = await api.signIn('admin');
    const res = await admin
      .patch(`/api/fields/${api.fixture.fields.northSoccer}`)
      .set('content-type', 'application/json')
      .send(`{"version":1,"notes":${nested(5_000)}}`);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('request/too_deep');
  });
});
