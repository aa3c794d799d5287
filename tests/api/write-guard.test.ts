/**
 * Who may write is checked before the body is read: a caller outside the row's district, or a
 * role that may not write the resource at all, is refused with 403 even for a malformed body.
 */
import { describe, expect, test } from 'vitest';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();
const garbage = { version: 'x', name: { deep: [1, 2, 3] }, maintenanceLevel: 'top' };

describe('write guard before the body', () => {
  test('should refuse another district’s foreman with 403, not 400, on a malformed change', async () => {
    const foreman = await api.signIn('foreman');
    for (const path of [`/api/fields/${api.fixture.fields.southBaseball}`, `/api/sites/${api.fixture.sites.southPark}`, `/api/crews/${api.fixture.crews.south}`]) {
      const res = await foreman.patch(path).send(garbage);
      expect(res.status, path).toBe(403);
      expect(res.body.error.code).toBe('auth/forbidden');
    }
  });

  test('should refuse a role that may not create the resource with 403, not 400, on a malformed body', async () => {
    const crew = await api.signIn('crew');
    for (const path of ['/api/fields', '/api/sites', '/api/crews', '/api/equipment', '/api/work-orders']) {
      const res = await crew.post(path).send(garbage);
      expect(res.status, path).toBe(403);
    }
  });

  test('should still answer a malformed body from a caller who may write with 400, and a missing row with 404', async () => {
    const foreman = await api.signIn('foreman');
    expect((await foreman.patch(`/api/fields/${api.fixture.fields.northSoccer}`).send(garbage)).status).toBe(400);
    expect((await foreman.patch('/api/fields/987654').send(garbage)).status).toBe(404);
  });
});
