import { eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { DEFAULT_PARAMETERS, DEFAULT_STANDARDS } from '@swardwise/domain';
import { auditLog, settings, standards } from '../../apps/api/src/db/schema/index.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();

const row = async (level: number) => (await api.database.db.select().from(standards).where(eq(standards.level, level)))[0]!;
const audits = async () => api.database.db.select().from(auditLog).where(eq(auditLog.entity, 'standards')).orderBy(auditLog.id);

describe('GET /api/standards', () => {
  test('should give every signed-in role the four levels with their versions and the parameters', async () => {
    for (const who of ['admin', 'head', 'foreman', 'crew', 'partner'] as const) {
      const agent = await api.signIn(who);
      const res = await agent.get('/api/standards');
      expect(res.status, who).toBe(200);
      expect(res.body.levels.map((l: { level: number }) => l.level)).toEqual([1, 2, 3, 4]);
      expect(res.body.levels[0].version).toBeGreaterThanOrEqual(1);
      expect(res.body.levels[3].data.name).toBe(DEFAULT_STANDARDS[4].name);
      expect(res.body.parameters.irrigation).toEqual(DEFAULT_PARAMETERS.irrigation);
    }
  });
});

describe('department parameters', () => {
  test("should keep a department's saved settings and give the defaults of settings it never saved", async () => {
    // A department saved its DU before the turf Kc and the cycle limit became settings.
    await api.database.db.insert(settings).values({ key: 'department_parameters', value: { irrigation: { distributionUniformity: 0.8 } } });
    try {
      const res = await (await api.signIn('head')).get('/api/standards');
      expect(res.status).toBe(200);
      expect(res.body.parameters.irrigation).toEqual({ ...DEFAULT_PARAMETERS.irrigation, distributionUniformity: 0.8 });
      expect(res.body.parameters.turfKc).toEqual(DEFAULT_PARAMETERS.turfKc);
    } finally {
      await api.database.db.delete(settings).where(eq(settings.key, 'department_parameters'));
    }
  });
});

describe('PATCH /api/standards/:level', () => {
  test('should let the head change a level, bump its version and audit the change', async () => {
    const agent = await api.signIn('head');
    const before = await row(3);
    const count = (await audits()).length;
    const res = await agent.patch('/api/standards/3').send({ version: before.version, targetScore: 70, hocMm: { soccer: { warm: 35 } }, lineRepaintDays: null });
    expect(res.status).toBe(200);
    expect(res.body.standard.version).toBe(before.version + 1);
    const after = await row(3);
    expect(after.data.targetScore).toBe(70);
    expect(after.data.hocMm.soccer).toEqual({ cool: before.data.hocMm.soccer.cool, warm: 35 });
    expect(after.data.hocMm.football).toEqual(before.data.hocMm.football);
    expect(after.data.lineRepaintDays).toBeNull();
    expect(after.updatedBy).toBe(api.fixture.users.head.id);
    const entries = await audits();
    expect(entries).toHaveLength(count + 1);
    const last = entries[entries.length - 1]!;
    expect(last).toMatchObject({ action: 'update', entityId: 3, actorId: api.fixture.users.head.id });
    expect((last.before as { data: { targetScore: number } }).data.targetScore).toBe(before.data.targetScore);
    expect((last.after as { data: { targetScore: number } }).data.targetScore).toBe(70);
  });

  test('should let the admin change a level too', async () => {
    const agent = await api.signIn('admin');
    const before = await row(4);
    const res = await agent.patch('/api/standards/4').send({ version: before.version, fieldCheckDays: 45 });
    expect(res.status).toBe(200);
    expect((await row(4)).data.fieldCheckDays).toBe(45);
  });

  test('should refuse foremen, crew leads and partners with 403 and change nothing', async () => {
    for (const who of ['foreman', 'crew', 'partner'] as const) {
      const agent = await api.signIn(who);
      const before = await row(1);
      const res = await agent.patch('/api/standards/1').send({ version: before.version, targetScore: 10 });
      expect(res.status, who).toBe(403);
      expect(res.body.error.code).toBe('auth/forbidden');
      expect(await row(1)).toEqual(before);
    }
  });

  test('should refuse bad values with 400, name each one, and write nothing', async () => {
    const agent = await api.signIn('head');
    const before = await row(2);
    const count = (await audits()).length;
    const res = await agent.patch('/api/standards/2').send({
      version: before.version,
      hocMm: { soccer: { cool: 2 }, quidditch: { cool: 30 } },
      annualNShare: 1.4,
      targetScore: 120,
      maxMowingIntervalDays: 2.5,
      colour: 'teal',
    });
    expect(res.status).toBe(400);
    const paths: string[] = res.body.error.details.issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['body.hocMm.soccer.cool', 'body.annualNShare', 'body.targetScore', 'body.maxMowingIntervalDays']));
    expect(res.body.error.details.issues.find((i: { path: string }) => i.path === 'body.hocMm.soccer.cool').message).toMatch(/3 mm/);
    expect(await row(2)).toEqual(before);
    expect((await audits()).length).toBe(count);
    expect((await agent.patch('/api/standards/7').send({ version: 1, targetScore: 50 })).status).toBe(400);
    expect((await agent.patch('/api/standards/2').send({ targetScore: 50 })).status).toBe(400);
  });

  test('should refuse a stale version with 409 and keep the newer change', async () => {
    const agent = await api.signIn('head');
    const before = await row(1);
    const first = await agent.patch('/api/standards/1').send({ version: before.version, minMowingsPerWeek: 4 });
    expect(first.status).toBe(200);
    const stale = await agent.patch('/api/standards/1').send({ version: before.version, minMowingsPerWeek: 2 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('standards/version_conflict');
    expect((await row(1)).data.minMowingsPerWeek).toBe(4);
  });
});
