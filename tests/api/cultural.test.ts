import { and, eq } from 'drizzle-orm';
import { describe, expect, test } from 'vitest';
import { DEFAULT_CULTURAL } from '@swardwise/domain';
import { standards, workOrders } from '../../apps/api/src/db/schema/index.ts';
import { useTestApi } from '../support/app.ts';

const api = useTestApi();
// The fixture's weather runs 4 May – 7 June 2026; tall fescue grows well in it.
const WEEK = '2026-05-25';
const row = async (level: number) => (await api.database.db.select().from(standards).where(eq(standards.level, level)))[0]!;
const aerateOnly = (times: number) => ({
  aerate: { ...DEFAULT_CULTURAL[2].aerate, timesPerSeason: times, method: 'solid_tine' as const },
  overseed: { ...DEFAULT_CULTURAL[2].overseed, timesPerSeason: 0 },
  topdress: { ...DEFAULT_CULTURAL[2].topdress, timesPerSeason: 0 },
  weed_control: { ...DEFAULT_CULTURAL[2].weed_control, timesPerSeason: 0 },
});

describe('the cultural program in the Standards', () => {
  test('should refuse a crew lead and a foreman, and change nothing', async () => {
    const before = await row(2);
    for (const who of ['crew', 'foreman', 'partner'] as const) {
      const res = await (await api.signIn(who)).patch('/api/standards/2').send({ version: before.version, cultural: aerateOnly(5) });
      expect(res.status, who).toBe(403);
    }
    expect((await row(2)).version).toBe(before.version);
  });

  test('should refuse a window that ends before it begins, and too many times, with the field and a message', async () => {
    const head = await api.signIn('head');
    const before = await row(2);
    const bad = await head.patch('/api/standards/2').send({ version: before.version, cultural: { aerate: { ...aerateOnly(2).aerate, cool: { fromMonth: 9, toMonth: 4 } } } });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.issues).toContainEqual({ path: 'body.cultural.aerate.cool.toMonth', message: 'the window ends before it begins: the last month must be on or after the first' });
    const many = await head.patch('/api/standards/2').send({ version: before.version, cultural: { weed_control: { ...aerateOnly(2).weed_control, timesPerSeason: 13 } } });
    expect(many.status).toBe(400);
    expect(many.body.error.details.issues[0].message).toBe('more than 12 times a season is not a program');
    expect((await row(2)).version).toBe(before.version);
  });

  test('should let the head set a program, keep the tasks not sent, and plan it into the week with its reason', async () => {
    const head = await api.signIn('head');
    const before = await row(2);
    const res = await head.patch('/api/standards/2').send({ version: before.version, cultural: aerateOnly(1) });
    expect(res.status).toBe(200);
    expect(res.body.standard.data.cultural.aerate).toMatchObject({ timesPerSeason: 1, method: 'solid_tine' });
    const one = await head.patch('/api/standards/2').send({ version: before.version + 1, cultural: { topdress: { ...DEFAULT_CULTURAL[2].topdress, timesPerSeason: 0 } } });
    expect(one.status).toBe(200);
    expect(one.body.standard.data.cultural.aerate.timesPerSeason).toBe(1);

    const foreman = await api.signIn('foreman');
    const gen = await foreman.post('/api/week-plans/generate').send({ districtId: api.fixture.districts.north, weekStart: WEEK });
    expect(gen.status).toBe(200);
    type Order = { id: number; fieldId: number; task: string; reason: string; plannedHours: number; version: number; details: Record<string, unknown> };
    const aerations = (gen.body.board.orders as Order[]).filter((o) => o.task === 'aerate');
    // Level 2 soccer field only: level 1's program is its default (3 a season), level 4's asks none.
    const soccer = aerations.filter((o) => o.fieldId === api.fixture.fields.northSoccer);
    expect(soccer).toHaveLength(1);
    expect(soccer[0]!.reason).toMatch(/^Level 2 program: solid tine aeration 1× a season in Apr–Oct; this is 1 of 1 \(0 done\)/);
    expect(soccer[0]!.plannedHours).toBeGreaterThan(0);
    expect(aerations.some((o) => o.fieldId === api.fixture.fields.northLawn)).toBe(false);

    // Re-generating leaves it; once logged done, the season's one is done and no other is asked.
    const again = await foreman.post('/api/week-plans/generate').send({ districtId: api.fixture.districts.north, weekStart: WEEK });
    expect(again.body.diff.summary.added).toBe(0);
    await api.database.db.update(workOrders).set({ status: 'done' }).where(eq(workOrders.id, soccer[0]!.id));
    const next = await foreman.post('/api/week-plans/generate').send({ districtId: api.fixture.districts.north, weekStart: '2026-06-01' });
    expect(next.status).toBe(200);
    const asked = await api.database.db
      .select()
      .from(workOrders)
      .where(and(eq(workOrders.fieldId, api.fixture.fields.northSoccer), eq(workOrders.task, 'aerate')));
    expect(asked).toHaveLength(1);
  });
});
