import { eq } from 'drizzle-orm';
import { pino } from 'pino';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { DEFAULT_TIME_ZONE, ROLES, localToday } from '@swardwise/domain';
import { createApp } from '../../apps/api/src/app.ts';
import { loadConfig } from '../../apps/api/src/config.ts';
import type { Database } from '../../apps/api/src/db/client.ts';
import { openTestDatabase } from '../support/app.ts';
import { districts, fieldChecks, fields, settings, sites, users } from '../../apps/api/src/db/schema/index.ts';
import { DEMO_SIGN_INS } from '../../apps/api/src/db/seed/demo-city.ts';
import { seedDemoCity } from '../../apps/api/src/db/seed/index.ts';
import { demoSeasonWindow } from '../../apps/api/src/db/seed/demo-season.ts';
import { createMailer } from '../../apps/api/src/mail/mailer.ts';

let database: Database;
let app: ReturnType<typeof createApp>['app'];
let firstSeed: Awaited<ReturnType<typeof seedDemoCity>>;

beforeAll(async () => {
  database = await openTestDatabase();
  firstSeed = await seedDemoCity(database.db);
  const logger = pino({ level: 'silent' });
  app = createApp({ db: database.db, config: loadConfig({ NODE_ENV: 'test' }), logger, sessionSecret: 'test', mailer: createMailer(null, logger) }).app;
});
afterAll(() => database.close());

describe('demo city seed', () => {
  test('should seed three districts, about 25 sites and about 60 fields once', async () => {
    expect(firstSeed).toMatchObject({ districts: 3 });
    expect(firstSeed!.sites).toBeGreaterThanOrEqual(20);
    expect(firstSeed!.fields).toBeGreaterThanOrEqual(50);
    const counts = async () => ({
      districts: (await database.db.select().from(districts)).length,
      sites: (await database.db.select().from(sites)).length,
      fields: (await database.db.select().from(fields)).length,
      users: (await database.db.select().from(users)).length,
    });
    const before = await counts();
    expect(await seedDemoCity(database.db)).toBeNull();
    expect(await counts()).toEqual(before);
  });

  test('should store the tester with every hardness reading, and refuse a reading without one', async () => {
    const checks = await database.db.select().from(fieldChecks);
    expect(checks.length).toBeGreaterThan(0);
    for (const c of checks) expect(c.gmax === null ? c.gmaxDevice === null : c.gmaxDevice === 'portable_2_25kg').toBe(true);
    const [one] = checks;
    const row = { fieldId: one!.fieldId, checkedOn: '2026-11-30', turfCoverPct: 90, weedsPct: 2, barePct: 3, score: 80 };
    await expect(database.db.insert(fieldChecks).values({ ...row, gmax: 150 })).rejects.toThrow();
    await expect(database.db.insert(fieldChecks).values({ ...row, gmax: null, gmaxDevice: 'f355_missile_a' })).rejects.toThrow();
    const [ok] = await database.db.insert(fieldChecks).values({ ...row, gmax: 150, gmaxDevice: 'f355_missile_a' }).returning();
    expect(ok!.gmaxDevice).toBe('f355_missile_a');
    await database.db.delete(fieldChecks).where(eq(fieldChecks.id, ok!.id));
  });

  test('should mark the data as invented demo data', async () => {
    const all = await database.db.select().from(settings);
    const demo = all.find((s) => s.key === 'demo_city');
    expect(JSON.stringify(demo?.value)).toMatch(/invented/i);
  });

  test.each(ROLES)('should let the documented %s demo user sign in', async (role) => {
    const agent = supertest.agent(app);
    const res = await agent.post('/api/auth/sign-in').send(DEMO_SIGN_INS[role]);
    expect(res.status).toBe(200);
    expect(res.body.user.role).toBe(role);
    const list = await agent.get('/api/fields');
    expect(list.status).toBe(200);
    expect(list.body.items.length).toBeGreaterThan(0);
  });

  test('should show the north foreman only North Ridge fields', async () => {
    const agent = supertest.agent(app);
    await agent.post('/api/auth/sign-in').send(DEMO_SIGN_INS.foreman);
    const res = await agent.get('/api/fields');
    const districtNames = new Set(res.body.items.map((f: { districtName: string }) => f.districtName));
    expect([...districtNames]).toEqual(['North Ridge']);
  });

  test('should book games that each role sees in its own scope', async () => {
    expect(firstSeed!.fieldEvents).toBeGreaterThan(200);
    const coming = async (role: keyof typeof DEMO_SIGN_INS) => {
      const agent = supertest.agent(app);
      const me = await agent.post('/api/auth/sign-in').send(DEMO_SIGN_INS[role]);
      // The autumn leagues: the demo books games only on playable turf, so not around every seeding day.
      const year = demoSeasonWindow(localToday(DEFAULT_TIME_ZONE)).start.slice(0, 4);
      const res = await agent.get('/api/field-events').query({ from: `${year}-09-01`, to: `${year}-11-30` });
      expect(res.status).toBe(200);
      return Object.assign(res.body.items as { siteId: number; districtId: number; kind: string }[], { siteIds: me.body.user.siteIds as number[] });
    };
    const all = await coming('head');
    expect(all.filter((e) => e.kind === 'game').length).toBeGreaterThanOrEqual(4);
    const north = (await database.db.select().from(districts)).find((d) => d.code === 'north')!;
    const foreman = await coming('foreman');
    expect(foreman.length).toBeGreaterThan(0);
    expect(foreman.every((e) => e.districtId === north.id)).toBe(true);
    expect(foreman.length).toBeLessThan(all.length);
    const partner = await coming('partner');
    expect(partner.length).toBeGreaterThan(0);
    expect(partner.every((e) => partner.siteIds.includes(e.siteId))).toBe(true);
    expect(all.some((e) => !partner.siteIds.includes(e.siteId))).toBe(true);
  });
});
