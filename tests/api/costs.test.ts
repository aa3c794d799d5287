/** The department's costs and rates: who may read and set them, bad input, conflicts and the audit. */
import { desc, eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { DEFAULT_COSTS } from '@swardwise/domain';
import { auditLog } from '../../apps/api/src/db/schema/index.ts';
import supertest from 'supertest';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();

const body = (version: number, change: Partial<typeof DEFAULT_COSTS> = {}) => ({ ...DEFAULT_COSTS, ...change, version });

describe('costs and rates', () => {
  test('should answer the starting values until the department sets its own', async () => {
    const head = await api.signIn('head');
    const res = await head.get('/api/costs');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ costs: DEFAULT_COSTS, source: 'default', version: 1 });
  });

  test('should let the head set every rate, with a crew’s own rate, and audit the change', async () => {
    const head = await api.signIn('head');
    const { version } = (await head.get('/api/costs')).body as { version: number };
    const crewRates = [{ crewId: api.fixture.crews.north, ratePerHour: 52.5 }];
    const res = await head.patch('/api/costs').send(body(version, { labourRatePerHour: 41, crewRates, waterPricePerM3: 1.75 }));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ source: 'setting', version: version + 1, costs: { labourRatePerHour: 41, crewRates, waterPricePerM3: 1.75 } });
    expect((await head.get('/api/costs')).body).toEqual(res.body);

    const [entry] = await api.database.db.select().from(auditLog).where(eq(auditLog.entity, 'cost_settings')).orderBy(desc(auditLog.id)).limit(1);
    expect(entry).toMatchObject({ actorId: api.fixture.users.head.id, before: { labourRatePerHour: DEFAULT_COSTS.labourRatePerHour }, after: { labourRatePerHour: 41 } });
    const log = await head.get('/api/audit?entity=cost_settings');
    const changes = log.body.items[0].changes as { label: string; before: string; after: string }[];
    expect(changes).toContainEqual({ attribute: 'labourRatePerHour', label: 'Labour rate per hour', before: String(DEFAULT_COSTS.labourRatePerHour), after: '41' });
  });

  test('should let a foreman read the rates but not change them; crews and partners see none', async () => {
    const foreman = await api.signIn('foreman');
    expect((await foreman.get('/api/costs')).status).toBe(200);
    const refused = await foreman.patch('/api/costs').send(body(1, { labourRatePerHour: 1 }));
    expect(refused.status).toBe(403);
    for (const who of ['crew', 'partner'] as const) {
      const agent = await api.signIn(who);
      expect((await agent.get('/api/costs')).status).toBe(403);
      expect((await agent.patch('/api/costs').send(body(1))).status).toBe(403);
    }
    expect((await supertest(api.app).get('/api/costs')).status).toBe(401);
  });

  test('should refuse a negative or absurd price, an unknown crew and a stale version, changing nothing', async () => {
    const head = await api.signIn('head');
    const before = (await head.get('/api/costs')).body as { version: number };
    const negative = await head.patch('/api/costs').send(body(before.version, { fuelPricePerL: -1 }));
    expect(negative.status).toBe(400);
    expect(negative.body.error.details.issues[0]).toMatchObject({ path: 'body.fuelPricePerL', message: 'the fuel price cannot be negative' });
    expect((await head.patch('/api/costs').send(body(before.version, { seedPricePerKg: 1e9 }))).status).toBe(400);
    expect((await head.patch('/api/costs').send({ ...body(before.version), currency: 'dollars' })).status).toBe(400);
    const unknownCrew = await head.patch('/api/costs').send(body(before.version, { crewRates: [{ crewId: 987654, ratePerHour: 30 }] }));
    expect(unknownCrew.status).toBe(400);
    expect(unknownCrew.body.error.details.issues[0].path).toBe('body.crewRates.0.crewId');
    const twice = await head.patch('/api/costs').send(body(before.version, { crewRates: [{ crewId: api.fixture.crews.north, ratePerHour: 30 }, { crewId: api.fixture.crews.north, ratePerHour: 31 }] }));
    expect(twice.status).toBe(400);
    expect((await head.get('/api/costs')).body).toEqual(before);

    const first = await head.patch('/api/costs').send(body(before.version, { paintPricePerL: 4 }));
    expect(first.status).toBe(200);
    const stale = await head.patch('/api/costs').send(body(before.version, { paintPricePerL: 5 }));
    expect(stale.status).toBe(409);
    expect((await head.get('/api/costs')).body.costs.paintPricePerL).toBe(4);
  });
});
