/**
 * The demo started on any day: a season of history Records shows, weather observed through
 * yesterday with a week of forecast, no "no weather after" notice, and no games on dormant
 * warm-season turf. Each day gets a fresh demo database seeded through the department clock.
 */
import { eq } from 'drizzle-orm';
import { pino } from 'pino';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { DEFAULT_TIME_ZONE, addDaysIso, grassSeason, weekdayOf, type Grass } from '@swardwise/domain';
import { createApp } from '../../apps/api/src/app.ts';
import { loadConfig } from '../../apps/api/src/config.ts';
import type { Database } from '../../apps/api/src/db/client.ts';
import { openTestDatabase } from '../support/app.ts';
import { districts, fieldChecks } from '../../apps/api/src/db/schema/index.ts';
import { DEMO_SIGN_INS } from '../../apps/api/src/db/seed/demo-city.ts';
import { createMailer } from '../../apps/api/src/mail/mailer.ts';
import { DepartmentClock } from '../../apps/api/src/services/clock.ts';
import { prepareInstallation } from '../../apps/api/src/services/first-run.ts';

interface Demo {
  database: Database;
  agent: (role: keyof typeof DEMO_SIGN_INS) => Promise<ReturnType<typeof supertest.agent>>;
}

const started = new Map<string, Promise<Demo>>();
/** The demo started on `today`, once per file: each seed is a fresh demo database. */
const demoOn = (today: string): Promise<Demo> => {
  if (!started.has(today)) started.set(today, startDemo(today));
  return started.get(today)!;
};
afterAll(async () => {
  for (const demo of started.values()) await (await demo).database.close();
});

/** A demo started on `today` (mid-afternoon in the department's zone), as the server starts one. */
async function startDemo(today: string): Promise<Demo> {
  const database = await openTestDatabase();
  const clock = new DepartmentClock(database.db, DEFAULT_TIME_ZONE, () => new Date(`${today}T20:00:00Z`));
  await clock.ready();
  const config = loadConfig({ NODE_ENV: 'test' });
  const logger = pino({ level: 'silent' });
  await prepareInstallation(database.db, { ...config, demo: true }, logger, () => {}, clock.today(), clock.timeZone);
  const { app } = createApp({ db: database.db, config, logger, sessionSecret: 'test', mailer: createMailer(null, logger), clock });
  return {
    database,
    agent: async (role) => {
      const agent = supertest.agent(app);
      const res = await agent.post('/api/auth/sign-in').send(DEMO_SIGN_INS[role]);
      expect(res.status).toBe(200);
      return agent;
    },
  };
}

describe('demo season in Records', () => {
  let demo: Demo;
  beforeAll(async () => {
    demo = await demoOn('2026-12-02');
  });

  test('should show each district’s season: orders done and skipped, mowings late and missed, every week since March', async () => {
    const head = await demo.agent('head');
    for (const d of await demo.database.db.select().from(districts)) {
      const res = await head.get('/api/records').query({ districtId: d.id, from: '2026-03-01', to: '2026-12-01' });
      expect(res.status).toBe(200);
      const { totals, byWeek, byField, lateMowings } = res.body;
      expect(totals.ordersDone, d.code).toBeGreaterThan(300);
      expect(totals.ordersSkipped, d.code).toBeGreaterThan(5);
      expect(totals.actualHours, d.code).toBeGreaterThan(100);
      expect(totals.mowingsDone, d.code).toBeGreaterThan(200);
      expect(totals.mowingsLate, d.code).toBeGreaterThan(5);
      expect(totals.mowingsMissed, d.code).toBeGreaterThan(5);
      expect(totals.mowingsMissed / totals.mowingsAsked, d.code).toBeLessThan(0.2);
      expect(lateMowings.length, d.code).toBe(totals.mowingsLate);
      // Reported on the crews' working days, as the department's calendar reads the moment.
      for (const l of lateMowings) expect(['mon', 'tue', 'wed', 'thu', 'fri'], `${l.fieldName} ${l.doneOn}`).toContain(weekdayOf(l.doneOn));
      expect(byField.length, d.code).toBeGreaterThan(10);
      // Work in every week from the first mowings of March to the end of November.
      const weeks = byWeek.map((w: { weekStart: string }) => w.weekStart);
      expect(weeks[0] < '2026-03-16', d.code).toBe(true);
      expect(weeks.length, d.code).toBeGreaterThanOrEqual(37);
    }
  });

  test('should let the north foreman read his district’s season only', async () => {
    const foreman = await demo.agent('foreman');
    const res = await foreman.get('/api/records').query({ from: '2026-03-01', to: '2026-12-01' });
    expect(res.status).toBe(200);
    expect(res.body.totals.ordersDone).toBeGreaterThan(300);
    const [north] = await demo.database.db.select().from(districts).where(eq(districts.code, 'north'));
    const head = await demo.agent('head');
    const all = await head.get('/api/records').query({ from: '2026-03-01', to: '2026-12-01' });
    const mine = await head.get('/api/records').query({ from: '2026-03-01', to: '2026-12-01', districtId: north!.id });
    expect(res.body.totals).toEqual(mine.body.totals);
    expect(all.body.totals.ordersDone).toBeGreaterThan(res.body.totals.ordersDone);
  });

  test('should hold field checks with scores in every month of the season', async () => {
    const checks = await demo.database.db.select({ checkedOn: fieldChecks.checkedOn, score: fieldChecks.score }).from(fieldChecks);
    const months = new Set(checks.map((c) => c.checkedOn.slice(0, 7)));
    for (const m of ['03', '04', '05', '06', '07', '08', '09', '10', '11']) expect(months.has(`2026-${m}`), m).toBe(true);
    expect(checks.every((c) => c.checkedOn < '2026-12-02' && c.score > 0)).toBe(true);
  });
});

describe.each(['2026-07-15', '2026-12-02', '2027-03-20'])('demo started on %s', (today) => {
  let demo: Demo;
  beforeAll(async () => {
    demo = await demoOn(today);
  });

  test('should hold weather observed through yesterday and a forecast for the coming week', async () => {
    const head = await demo.agent('head');
    const stations = await head.get('/api/weather/stations');
    expect(stations.status).toBe(200);
    expect(stations.body.items.length).toBeGreaterThan(0);
    for (const st of stations.body.items) {
      expect(st.lastDate).toBe(addDaysIso(today, 6));
      expect(st.forecastDays).toBe(7);
      const days = await head.get(`/api/weather/stations/${st.id}/days`).query({ from: addDaysIso(today, -60), to: addDaysIso(today, 6) });
      expect(days.status).toBe(200);
      const items = days.body.days as { date: string; kind: string }[];
      expect(days.body.gaps).toEqual([]);
      expect(items).toHaveLength(67);
      expect(items.filter((d) => d.kind === 'observed').at(-1)!.date).toBe(addDaysIso(today, -1));
      expect(items.filter((d) => d.kind === 'forecast')[0]!.date).toBe(today);
    }
  });

  test('should not say the weather stops before today', async () => {
    const foreman = await demo.agent('foreman');
    const map = await foreman.get('/api/map');
    expect(map.status).toBe(200);
    expect(map.body.weatherNote).toBeNull();
    expect(JSON.stringify(map.body)).not.toMatch(/No weather after/);
  });

  test('should book no game on warm-season turf in the dormant months around today', async () => {
    const head = await demo.agent('head');
    const fields = (await head.get('/api/fields')).body.items as { id: number; grass: Grass }[];
    const warm = new Set(fields.filter((f) => grassSeason(f.grass) === 'warm').map((f) => f.id));
    const events = (await head.get('/api/field-events').query({ from: addDaysIso(today, -14), to: addDaysIso(today, 14) })).body.items as { fieldId: number; startsOn: string; kind: string }[];
    const month = Number(today.slice(5, 7));
    const dormant = month <= 3 || month >= 12;
    const onWarm = events.filter((e) => warm.has(e.fieldId) && e.kind !== 'other');
    if (dormant) expect(onWarm).toEqual([]);
    else expect(events.length).toBeGreaterThan(0);
  });
});
